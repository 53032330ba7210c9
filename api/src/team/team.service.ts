import { Inject, Injectable } from '@nestjs/common';
import type { TeamMember } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ApiError, notFound } from '../common/api-error';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { TransactionRunner, type Trx } from '../db/transaction';
import { InvitationsService } from '../invitations/invitations.service';
import { addedToProjectMail, invitationMail } from '../mail/mail-templates';
import { OutboxService } from '../mail/outbox.service';
import { UsersRepository } from '../users/users.repository';
import type { ChangeRoleDto } from './dto/change-role.dto';
import type { InviteDto } from './dto/invite.dto';
import { toTeamMember } from './team.mapper';
import { TeamRepository, type MemberRow } from './team.repository';

@Injectable()
export class TeamService {
  constructor(
    private readonly team: TeamRepository,
    private readonly users: UsersRepository,
    private readonly invitations: InvitationsService,
    private readonly activity: ActivityService,
    private readonly outbox: OutboxService,
    private readonly tx: TransactionRunner,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  async list(access: ProjectAccess): Promise<TeamMember[]> {
    return (await this.team.list(access.projectId)).map(toTeamMember);
  }

  /**
   * Someone with an account gets the role at once and a notice by e-mail. A
   * new e-mail gets an account without password, the role, and an invitation
   * link valid for LIMITS.invitationHours. All of it (account, role, invitation,
   * activity, queued e-mail) is one transaction; the e-mail is sent after it.
   */
  async invite(access: ProjectAccess, actor: SessionUser, dto: InviteDto): Promise<TeamMember> {
    const projectId = access.projectId;
    const projectName = await this.team.projectName(projectId);
    const mailIds: number[] = [];
    const member = await this.tx.run(async (trx) => {
      let user = await this.users.findByEmail(dto.email, trx);
      if (user) {
        const existing = await this.team.findMember(trx, projectId, user.id);
        if (existing) {
          throw new ApiError('CONFLICT', `${dto.email} is on this team already, as ${existing.role}; change their role instead.`);
        }
      } else {
        user = await this.users.insertInvited(trx, { email: dto.email, name: dto.name ?? dto.email.split('@')[0] });
      }
      await this.team.insertRole(trx, projectId, user.id, dto.role);

      if (user.password_hash) {
        mailIds.push(
          await this.outbox.enqueue(trx, addedToProjectMail({
            to: user.email, inviterName: actor.name, projectName, role: dto.role,
            link: `${this.config.publicUrl}/projects/${projectId}`,
          })),
        );
        await this.activity.record(trx, {
          projectId, actorId: actor.id, action: 'team.added',
          summary: `${actor.name} added ${user.name} as ${dto.role}`, data: { userId: user.id, role: dto.role },
        });
      } else {
        const { token, expiresAt } = await this.invitations.create(trx, {
          userId: user.id, email: user.email, name: dto.name ?? null, projectId, role: dto.role, invitedBy: actor.id,
        });
        mailIds.push(
          await this.outbox.enqueue(trx, invitationMail({
            to: user.email, inviterName: actor.name, projectName, role: dto.role,
            link: `${this.config.publicUrl}/invitations/${token}`, expiresAt,
          })),
        );
        await this.activity.record(trx, {
          projectId, actorId: actor.id, action: 'team.invited',
          summary: `${actor.name} invited ${user.email} as ${dto.role}`, data: { userId: user.id, role: dto.role },
        });
      }
      return toTeamMember((await this.team.findMember(trx, projectId, user.id))!);
    });
    this.outbox.deliverSoon(mailIds);
    return member;
  }

  async changeRole(access: ProjectAccess, actor: SessionUser, userId: number, dto: ChangeRoleDto): Promise<TeamMember> {
    return this.tx.run(async (trx) => {
      const member = await this.member(trx, access.projectId, userId);
      if (member.role === dto.role) return toTeamMember(member);
      if (member.role === 'manager') await this.keepOneManager(trx, access.projectId, member, `make ${member.name} ${dto.role}`);
      await this.team.updateRole(trx, access.projectId, userId, dto.role);
      await this.activity.record(trx, {
        projectId: access.projectId, actorId: actor.id, action: 'team.role_changed',
        summary: `${actor.name} changed ${member.name}'s role from ${member.role} to ${dto.role}`,
        data: { userId, from: member.role, to: dto.role },
      });
      return toTeamMember({ ...member, role: dto.role });
    });
  }

  async remove(access: ProjectAccess, actor: SessionUser, userId: number): Promise<void> {
    await this.tx.run(async (trx) => {
      const member = await this.member(trx, access.projectId, userId);
      if (member.role === 'manager') await this.keepOneManager(trx, access.projectId, member, `remove ${member.name}`);
      await this.team.deleteRole(trx, access.projectId, userId);
      await this.invitations.revokeUnused(trx, access.projectId, userId);
      await this.activity.record(trx, {
        projectId: access.projectId, actorId: actor.id, action: 'team.removed',
        summary: `${actor.name} removed ${member.name} (${member.role}) from the team`, data: { userId, role: member.role },
      });
    });
  }

  private async member(trx: Trx, projectId: number, userId: number): Promise<MemberRow> {
    const member = await this.team.findMember(trx, projectId, userId);
    if (!member) throw notFound(`Person ${userId} is not on this project's team.`);
    return member;
  }

  /** A project always keeps a manager: someone must be able to run its team. */
  private async keepOneManager(trx: Trx, projectId: number, member: MemberRow, action: string): Promise<void> {
    const managers = await this.team.lockManagers(trx, projectId);
    if (managers.length <= 1 && managers.includes(member.user_id)) {
      throw new ApiError('CONFLICT', `${member.name} is the only manager of this project; make someone else manager before you ${action}.`);
    }
  }
}
