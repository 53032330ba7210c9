import { Injectable } from '@nestjs/common';
import type { AssignMemberReviewersResponse, ReviewerAssignments } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ApiError, invalidField, notFound } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import type { AssignLevelReviewerDto, AssignMemberReviewersDto } from './dto/assign-reviewer.dto';
import { ReviewerAssignmentsRepository, type PersonRow } from './reviewer-assignments.repository';

/**
 * Managers assign reviewers (checkers) per level or per member. The effective
 * reviewer (mark's assignment, else level's, else the schedule's column) is
 * written into the latest revision's members at once, and into every later
 * revision by the import commit (OverviewRevisionHook), so the Members list,
 * its filter and facets and the Overview all read the same thing.
 */
@Injectable()
export class ReviewerAssignmentsService {
  constructor(
    private readonly repo: ReviewerAssignmentsRepository,
    private readonly activity: ActivityService,
    private readonly tx: TransactionRunner,
  ) {}

  async list(access: ProjectAccess): Promise<ReviewerAssignments> {
    const [levels, members, candidates] = await Promise.all([
      this.repo.levelAssignments(access.projectId),
      this.repo.markAssignments(access.projectId),
      this.repo.checkers(access.projectId),
    ]);
    return {
      levels: levels.map((l) => ({
        level: { id: l.level_id, name: l.level_name },
        reviewer: l.reviewer_id !== null && l.reviewer_name !== null ? { id: l.reviewer_id, name: l.reviewer_name } : null,
      })),
      members: members.map((m) => ({ mark: m.mark, reviewer: { id: m.reviewer_id, name: m.reviewer_name } })),
      candidates,
    };
  }

  async assignLevel(access: ProjectAccess, actor: SessionUser, levelId: number, dto: AssignLevelReviewerDto): Promise<ReviewerAssignments> {
    const projectId = access.projectId;
    await this.tx.run(async (trx) => {
      await this.repo.lockProject(trx, projectId);
      const level = await this.repo.level(trx, projectId, levelId);
      if (!level) throw notFound(`Level ${levelId} is not a level of this project; the Overview lists the levels there are.`);
      const reviewer = await this.reviewer(trx, projectId, dto.reviewerId);
      await this.repo.setLevel(trx, projectId, level.id, reviewer?.id ?? null, actor.id);
      const latest = await this.repo.latestRevision(trx, projectId);
      const changed = latest ? await this.repo.refresh(trx, projectId, latest.id, { levelId: level.id }) : 0;
      await this.activity.record(trx, {
        projectId,
        actorId: actor.id,
        action: reviewer ? 'reviewer.assigned' : 'reviewer.unassigned',
        summary: reviewer
          ? `${actor.name} assigned ${reviewer.name} to review ${level.name}`
          : `${actor.name} removed the assigned reviewer of ${level.name} (members' own or the schedule's reviewers apply again)`,
        data: { levelId: level.id, levelName: level.name, userId: reviewer?.id ?? null, membersChanged: changed, revisionId: latest?.id ?? null },
      });
    });
    return this.list(access);
  }

  async assignMembers(access: ProjectAccess, actor: SessionUser, dto: AssignMemberReviewersDto): Promise<AssignMemberReviewersResponse> {
    const projectId = access.projectId;
    return this.tx.run(async (trx) => {
      await this.repo.lockProject(trx, projectId);
      const latest = await this.repo.latestRevision(trx, projectId);
      if (!latest) throw new ApiError('CONFLICT', 'This project has no revision yet: import a member schedule first, then assign reviewers to its members.');
      const found = await this.repo.marksIn(trx, latest.id, dto.marks);
      const known = new Set(found.map((m) => m.toLowerCase()));
      const missing = dto.marks.map((m, i) => ({ m, i })).filter(({ m }) => !known.has(m.trim().toLowerCase()));
      if (missing.length) {
        throw new ApiError(
          'VALIDATION_FAILED',
          `Some marks are not in revision ${latest.number}: ${missing.map(({ m }) => m).join(', ')}. Nothing was assigned; correct or remove them.`,
          missing.map(({ m, i }) => ({ path: `body.marks[${i}]`, message: `there is no member "${m}" in revision ${latest.number} (the latest)` })),
        );
      }
      const reviewer = await this.reviewer(trx, projectId, dto.reviewerId);
      await this.repo.setMarks(trx, projectId, found, reviewer?.id ?? null, actor.id);
      const changed = await this.repo.refresh(trx, projectId, latest.id, { marks: found });
      const list = preview(found);
      await this.activity.record(trx, {
        projectId,
        actorId: actor.id,
        action: reviewer ? 'reviewer.assigned' : 'reviewer.unassigned',
        summary: reviewer
          ? `${actor.name} assigned ${reviewer.name} to review ${list}`
          : `${actor.name} removed the own reviewer of ${list} (their level's or the schedule's reviewer applies again)`,
        data: { marks: found, userId: reviewer?.id ?? null, membersChanged: changed, revisionId: latest.id },
      });
      return { marks: found, reviewer: reviewer ? { id: reviewer.id, name: reviewer.name } : null };
    });
  }

  /** The reviewer must be a checker of the project (checkers review members, product.md). */
  private async reviewer(trx: Trx, projectId: number, reviewerId: number | null): Promise<PersonRow | null> {
    if (reviewerId === null) return null;
    const checkers = await this.repo.checkers(projectId, trx);
    const found = checkers.find((c) => c.id === reviewerId);
    if (!found) {
      throw invalidField(
        'body.reviewerId',
        `user ${reviewerId} is not a checker on this project; reviewers are checkers (${checkers.map((c) => c.name).join(', ') || 'the project has none: add one on the Team screen'})`,
      );
    }
    return found;
  }
}

/** "B1, B2, B3 and 4 more". */
function preview(marks: string[]): string {
  return marks.length <= 5 ? marks.join(', ') : `${marks.slice(0, 5).join(', ')} and ${marks.length - 5} more`;
}
