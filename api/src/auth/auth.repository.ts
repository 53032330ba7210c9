import { Inject, Injectable } from '@nestjs/common';
import type { ProjectRole } from '@sagline/common/api-types';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

/** Queries behind the guards and the session housekeeping of the auth area. */
@Injectable()
export class AuthRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /**
   * Whether the project exists and the person's role on it, in one query:
   * undefined when there is no such project, role null when they hold none.
   */
  async projectRole(projectId: number, userId: number): Promise<{ role: ProjectRole | null } | undefined> {
    return this.knex('projects as p')
      .leftJoin('project_roles as r', (j) => j.on('r.project_id', 'p.id').andOn('r.user_id', this.knex.raw('?', [userId])))
      .where('p.id', projectId)
      .first('r.role as role');
  }

  /** Signs the person out everywhere else (after a password change). Session layout: connect-pg-simple. */
  async deleteOtherSessions(trx: Trx, userId: number, keepSid: string): Promise<number> {
    return trx('sessions')
      .whereRaw(`(sess -> 'passport' ->> 'user') = ?`, [String(userId)])
      .whereNot('sid', keepSid)
      .delete();
  }
}
