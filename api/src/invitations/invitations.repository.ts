import { Inject, Injectable } from '@nestjs/common';
import type { ProjectRole } from '@sagline/common/api-types';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface InvitationRow {
  id: number;
  email: string;
  name: string | null;
  user_id: number;
  project_id: number | null;
  project_name: string | null;
  role: ProjectRole | null;
  expires_at: Date;
  used_at: Date | null;
}

@Injectable()
export class InvitationsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async insert(
    trx: Trx,
    inv: { tokenHash: string; email: string; name: string | null; userId: number; projectId: number | null; role: ProjectRole | null; invitedBy: number; expiresAt: Date },
  ): Promise<void> {
    await trx('invitations').insert({
      token_hash: inv.tokenHash,
      email: inv.email,
      name: inv.name,
      user_id: inv.userId,
      project_id: inv.projectId,
      role: inv.role,
      invited_by: inv.invitedBy,
      expires_at: inv.expiresAt,
    });
  }

  findByTokenHash(tokenHash: string): Promise<InvitationRow | undefined> {
    return this.knex('invitations as i')
      .leftJoin('projects as p', 'p.id', 'i.project_id')
      .where('i.token_hash', tokenHash)
      .first('i.id', 'i.email', 'i.name', 'i.user_id', 'i.project_id', 'p.name as project_name', 'i.role', 'i.expires_at', 'i.used_at');
  }

  /** Marks the invitation used if it still is usable; false when another request got there first. */
  async markUsed(trx: Trx, id: number): Promise<boolean> {
    const rows = await trx('invitations')
      .where({ id })
      .whereNull('used_at')
      .where('expires_at', '>', trx.fn.now())
      .update({ used_at: trx.fn.now() })
      .returning('id');
    return rows.length === 1;
  }

  /** Withdraws the unused invitations of a person to a project (they were removed from its team). */
  async revokeUnused(trx: Trx, projectId: number, userId: number): Promise<void> {
    await trx('invitations').where({ project_id: projectId, user_id: userId }).whereNull('used_at').delete();
  }
}
