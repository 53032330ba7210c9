import { Injectable } from '@nestjs/common';
import { hashPassword, verifyPassword } from '@sagline/database';
import { ActivityService } from '../activity/activity.service';
import { invalidField } from '../common/api-error';
import { TransactionRunner } from '../db/transaction';
import { normaliseEmail, toMe } from '../users/users.mapper';
import { UsersRepository } from '../users/users.repository';
import { AuthRepository } from './auth.repository';
import type { ChangePasswordDto } from './dto/change-password.dto';
import type { SessionUser } from './session-user';

@Injectable()
export class AuthService {
  constructor(
    private readonly users: UsersRepository,
    private readonly auth: AuthRepository,
    private readonly tx: TransactionRunner,
    private readonly activity: ActivityService,
  ) {}

  /**
   * The person for an e-mail and password, or null. An unknown e-mail, an
   * account still waiting for its invitation and a wrong password all take the
   * same path (one scrypt comparison), so neither the answer nor its timing
   * tells which e-mails have accounts.
   */
  async validateCredentials(email: string, password: string): Promise<SessionUser | null> {
    const user = await this.users.findByEmail(normaliseEmail(email));
    const ok = await verifyPassword(password, user?.password_hash ?? null);
    return user && ok ? toMe(user) : null;
  }

  /** Checks the current password, stores the new one and ends the person's other sessions. */
  async changePassword(user: SessionUser, dto: ChangePasswordDto, keepSessionId: string): Promise<void> {
    const row = await this.users.findById(user.id);
    if (!row || !(await verifyPassword(dto.currentPassword, row.password_hash))) {
      throw invalidField('body.currentPassword', 'is not your current password; type it again');
    }
    const passwordHash = await hashPassword(dto.newPassword);
    await this.tx.run(async (trx) => {
      await this.users.setPassword(trx, user.id, passwordHash);
      await this.auth.deleteOtherSessions(trx, user.id, keepSessionId);
      await this.activity.record(trx, {
        projectId: null,
        actorId: user.id,
        action: 'account.password_changed',
        summary: `${user.name} changed their password`,
      });
    });
  }
}
