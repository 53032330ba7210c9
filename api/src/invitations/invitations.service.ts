import { Injectable } from '@nestjs/common';
import { LIMITS, type InvitationResponse, type ProjectRole } from '@sagline/common/api-types';
import { hashPassword } from '@sagline/database';
import { ActivityService } from '../activity/activity.service';
import { ApiError } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import { UsersRepository } from '../users/users.repository';
import type { AcceptInvitationDto } from './dto/accept-invitation.dto';
import { hashInvitationToken, isWellFormedToken, newInvitationToken } from './invitation-token';
import { InvitationsRepository, type InvitationRow } from './invitations.repository';

export interface NewInvitation {
  userId: number;
  email: string;
  name: string | null;
  projectId: number | null;
  role: ProjectRole | null;
  invitedBy: number;
}

@Injectable()
export class InvitationsService {
  constructor(
    private readonly invitations: InvitationsRepository,
    private readonly users: UsersRepository,
    private readonly activity: ActivityService,
    private readonly tx: TransactionRunner,
  ) {}

  /** Stores a new invitation (its token's hash only) in the caller's transaction; returns the raw token for the link. */
  async create(trx: Trx, inv: NewInvitation): Promise<{ token: string; expiresAt: Date }> {
    const token = newInvitationToken();
    const expiresAt = new Date(Date.now() + LIMITS.invitationHours * 3_600_000);
    await this.invitations.insert(trx, { ...inv, tokenHash: hashInvitationToken(token), expiresAt });
    return { token, expiresAt };
  }

  revokeUnused(trx: Trx, projectId: number, userId: number): Promise<void> {
    return this.invitations.revokeUnused(trx, projectId, userId);
  }

  async get(token: string): Promise<InvitationResponse> {
    const inv = await this.usable(token);
    return {
      email: inv.email,
      name: inv.name,
      projectId: inv.project_id,
      projectName: inv.project_name,
      role: inv.role,
      expiresAt: inv.expires_at.toISOString(),
    };
  }

  /** Sets the invitee's name and password; the link then stops working. */
  async accept(token: string, dto: AcceptInvitationDto): Promise<void> {
    const inv = await this.usable(token);
    const passwordHash = await hashPassword(dto.password);
    await this.tx.run(async (trx) => {
      if (!(await this.invitations.markUsed(trx, inv.id))) throw used();
      const user = await this.users.findById(inv.user_id, trx);
      // An account that has a password already was activated by another invitation:
      // this link must not become a way to reset that password.
      if (!user || user.password_hash) throw used();
      await this.users.setPassword(trx, user.id, passwordHash, dto.name);
      await this.activity.record(trx, {
        projectId: inv.project_id,
        actorId: user.id,
        action: 'account.password_set',
        summary: `${dto.name} accepted the invitation${inv.role ? ` and joined as ${inv.role}` : ''}`,
      });
    });
  }

  private async usable(token: string): Promise<InvitationRow> {
    const inv = isWellFormedToken(token) ? await this.invitations.findByTokenHash(hashInvitationToken(token)) : undefined;
    if (!inv) {
      throw new ApiError('INVITATION_INVALID', 'This invitation link is not valid: check that the whole link was copied, or ask for a new invitation.');
    }
    if (inv.used_at) throw used();
    if (inv.expires_at.getTime() <= Date.now()) {
      throw new ApiError('INVITATION_EXPIRED', `This invitation expired on ${inv.expires_at.toISOString().slice(0, 10)}; ask a project manager to invite you again.`);
    }
    return inv;
  }
}

function used(): ApiError {
  return new ApiError('INVITATION_USED', 'This invitation was used already; sign in with the password you chose, or ask a manager for a new invitation.');
}
