import { Injectable } from '@nestjs/common';
import type { ImportDiff, LevelSignOff, Verdict } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ApiError, notFound } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import type { SignOffLevelDto, WithdrawSignOffDto } from './dto/sign-off.dto';
import { toSignOff } from './overview.mapper';
import { ReviewerAssignmentsRepository } from './reviewer-assignments.repository';
import { SignOffsRepository } from './sign-offs.repository';

/** How a member of a new revision touches a level. */
interface LevelTouch {
  mark: string;
  /** 'added', 'removed', 'changed', 'verdict flipped', or "pass → fail" for a recompute. */
  how: string;
}

/**
 * A checker's sign-off of a level, refused while a flag on it needs action,
 * voided by the next revision that touches a member on it.
 */
/** A member whose verdict a limit-set recompute changed, as the sign-off voiding needs it. */
export interface LevelFlip {
  mark: string;
  level: string | null;
  verdictBefore: Verdict | null;
  verdictAfter: Verdict | null;
}

/** Why results were recomputed: a set chosen or the set in use edited, and by whom. */
export interface RecomputeCause {
  kind: 'applied' | 'edited';
  limitSetId: number;
  limitSetName: string;
  actorId: number | null;
}

@Injectable()
export class SignOffsService {
  constructor(
    private readonly repo: SignOffsRepository,
    private readonly assignments: ReviewerAssignmentsRepository,
    private readonly activity: ActivityService,
    private readonly tx: TransactionRunner,
  ) {}

  async signOff(access: ProjectAccess, actor: SessionUser, levelId: number, dto: SignOffLevelDto): Promise<LevelSignOff> {
    const projectId = access.projectId;
    const id = await this.tx.run(async (trx) => {
      // Waits for a running import commit, so the sign-off is given against the revision the level really has.
      await this.assignments.lockProject(trx, projectId);
      const level = await this.repo.lockLevel(trx, projectId, levelId);
      if (!level) throw notFound(`Level ${levelId} is not a level of this project; the Overview lists the levels there are.`);
      const latest = await this.assignments.latestRevision(trx, projectId);
      if (!latest) throw new ApiError('CONFLICT', `${level.name} cannot be signed off yet: the project has no revision. Import a member schedule first.`);
      if (await this.repo.live(trx, level.id)) {
        throw new ApiError('CONFLICT', `${level.name} is already signed off (and no revision has changed it since); the Overview shows who signed it and when.`);
      }
      if ((await this.repo.memberCount(trx, latest.id, level.id)) === 0) {
        throw new ApiError('CONFLICT', `${level.name} has no members in revision ${latest.number}, so there is nothing to sign off.`);
      }
      const live = await this.repo.liveFlagsOnLevel(trx, projectId, latest.id, level.id);
      if (live.length) {
        const open = live.filter((f) => f.status === 'open').length;
        const answered = live.length - open;
        const parts = [open ? `${open} open` : '', answered ? `${answered} answered` : ''].filter(Boolean).join(' and ');
        const shown = live.slice(0, 10).map((f) => `${f.mark} (flag ${f.id}, ${f.status})`).join(', ');
        throw new ApiError(
          'CONFLICT',
          `${level.name} cannot be signed off: ${parts} flag${live.length === 1 ? '' : 's'} on it still need${live.length === 1 ? 's' : ''} action: ${shown}${live.length > 10 ? ` and ${live.length - 10} more` : ''}. Close or waive ${live.length === 1 ? 'it' : 'them'} first.`,
          live.map((f) => ({ path: `flags[${f.id}]`, message: `${f.mark}: flag ${f.id} is ${f.status}` })),
        );
      }
      const signOffId = await this.repo.insert(trx, { projectId, levelId: level.id, revisionId: latest.id, revisionNumber: latest.number, signedBy: actor.id, comment: dto.comment || null });
      await this.activity.record(trx, {
        projectId,
        actorId: actor.id,
        action: 'sign_off.signed',
        summary: `${actor.name} signed off ${level.name} at revision ${latest.number}${dto.comment ? `: ${dto.comment}` : ''}`,
        data: { levelId: level.id, levelName: level.name, revisionId: latest.id, revisionNumber: latest.number, signOffId },
      });
      return signOffId;
    });
    return toSignOff((await this.repo.find(id))!);
  }

  async withdraw(access: ProjectAccess, actor: SessionUser, levelId: number, dto: WithdrawSignOffDto): Promise<LevelSignOff> {
    const projectId = access.projectId;
    const id = await this.tx.run(async (trx) => {
      const level = await this.repo.lockLevel(trx, projectId, levelId);
      if (!level) throw notFound(`Level ${levelId} is not a level of this project; the Overview lists the levels there are.`);
      const live = await this.repo.live(trx, level.id);
      if (!live) throw new ApiError('CONFLICT', `${level.name} has no sign-off in force to withdraw.`);
      await this.repo.void(trx, live.id, { reason: `Withdrawn by ${actor.name}: ${dto.reason}`, revisionId: null, by: actor.id });
      await this.activity.record(trx, {
        projectId,
        actorId: actor.id,
        action: 'sign_off.withdrawn',
        summary: `${actor.name} withdrew the sign-off of ${level.name}: ${dto.reason}`,
        data: { levelId: level.id, levelName: level.name, signOffId: live.id },
      });
      return live.id;
    });
    return toSignOff((await this.repo.find(id))!);
  }

  /**
   * Inside the import commit's transaction, after the new revision's members
   * are written: every live sign-off of a level on which the revision added,
   * removed or changed a member (a member moved between levels touches both;
   * a verdict that flipped counts as a change) is voided, saying which
   * revision did it and to which marks. Returns the levels voided.
   */
  async voidTouchedLevels(trx: Trx, projectId: number, revision: { id: number; number: number }, diff: ImportDiff): Promise<string[]> {
    const touches = new Map<string, LevelTouch[]>();
    // Marks already listed per level (lower case): a Set, as a first revision touches every member (10,000 in one level's list).
    const listed = new Map<string, Set<string>>();
    const touch = (level: unknown, t: LevelTouch) => {
      if (typeof level !== 'string' || !level) return;
      const key = level.toLowerCase();
      const list = touches.get(key) ?? [];
      const marks = listed.get(key) ?? new Set<string>();
      const mark = t.mark.toLowerCase();
      if (!marks.has(mark)) {
        marks.add(mark);
        list.push(t);
      }
      touches.set(key, list);
      listed.set(key, marks);
    };
    for (const m of diff.added) touch(m.level, { mark: m.mark, how: 'added' });
    for (const m of diff.removed) touch(m.level, { mark: m.mark, how: 'removed' });
    for (const m of diff.changed) {
      touch(m.level, { mark: m.mark, how: 'changed' });
      const moved = m.changes.find((c) => c.field === 'level');
      if (moved) touch(moved.before, { mark: m.mark, how: 'changed' });
    }
    for (const f of diff.flips) touch(f.level, { mark: f.mark, how: 'verdict flipped' });
    if (touches.size === 0) return [];

    return this.voidLevels(trx, projectId, touches, {
      reason: (level, shown) => `Revision ${revision.number} changed members on ${level}: ${shown}`,
      revisionId: revision.id,
      by: null,
      data: { revisionId: revision.id, revisionNumber: revision.number },
    });
  }

  /**
   * Inside the transaction of a recompute of the latest revision under a new
   * limit set (inline or as a job): every live sign-off of a level on which a
   * member's verdict flipped is voided, "The limit set changed to "X"
   * (verdicts flipped on L2: C3 (pass → fail), C1 (fail → pass))", by the
   * person who changed the set, with a `sign_off.voided` activity entry.
   * `voidedInRevisionNumber` stays null: no revision changed the members.
   * Returns the levels voided.
   */
  async voidFlippedLevels(
    trx: Trx,
    projectId: number,
    revision: { id: number; number: number },
    flips: readonly LevelFlip[],
    cause: RecomputeCause,
  ): Promise<string[]> {
    const touches = new Map<string, LevelTouch[]>();
    const word = (v: Verdict | null) => v ?? 'unchecked';
    for (const f of flips) {
      if (f.verdictBefore === f.verdictAfter || !f.level) continue;
      const key = f.level.toLowerCase();
      const list = touches.get(key) ?? [];
      list.push({ mark: f.mark, how: `${word(f.verdictBefore)} → ${word(f.verdictAfter)}` });
      touches.set(key, list);
    }
    if (touches.size === 0) return [];
    const what = cause.kind === 'applied' ? `The limit set changed to "${cause.limitSetName}"` : `The limit set "${cause.limitSetName}" was edited`;
    return this.voidLevels(trx, projectId, touches, {
      reason: (level, shown) => `${what} (verdicts flipped on ${level}: ${shown})`,
      revisionId: null,
      by: cause.actorId,
      data: { revisionId: revision.id, revisionNumber: revision.number, limitSetId: cause.limitSetId, limitSetName: cause.limitSetName },
    });
  }

  /** Voids the live sign-offs of the touched levels (by lower-case name), each with its reason and activity entry. */
  private async voidLevels(
    trx: Trx,
    projectId: number,
    touches: Map<string, LevelTouch[]>,
    v: { reason: (level: string, shown: string) => string; revisionId: number | null; by: number | null; data: Record<string, unknown> },
  ): Promise<string[]> {
    const ids = await this.repo.levelIdsByName(trx, projectId);
    const levelIds = [...touches.keys()].map((k) => ids.get(k)).filter((id): id is number => id !== undefined);
    const live = await this.repo.liveOnLevels(trx, projectId, levelIds);
    for (const s of live) {
      const list = touches.get(s.level_name.toLowerCase()) ?? [];
      const shown = list.slice(0, 8).map((t) => `${t.mark} (${t.how})`).join(', ') + (list.length > 8 ? ` and ${list.length - 8} more` : '');
      const reason = v.reason(s.level_name, shown);
      await this.repo.void(trx, s.id, { reason, revisionId: v.revisionId, by: v.by });
      await this.activity.record(trx, {
        projectId,
        actorId: v.by,
        action: 'sign_off.voided',
        summary: `The sign-off of ${s.level_name} no longer holds: ${reason}`,
        data: { levelId: s.level_id, levelName: s.level_name, ...v.data, marks: list.map((t) => t.mark), signOffId: s.id },
      });
    }
    return live.map((s) => s.level_name);
  }
}
