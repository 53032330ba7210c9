import { Injectable } from '@nestjs/common';
import type { BulkAssignFlagsResponse, FlagDetail, FlagStatus } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ApiError, invalidField } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import type { OutgoingMail } from '../mail/mail.transport';
import { OutboxService } from '../mail/outbox.service';
import { MembersRepository } from '../members/members.repository';
import type { BulkAssignFlagsDto } from './dto/bulk-assign-flags.dto';
import type { AnswerFlagDto, CloseFlagDto, CommentFlagDto, ReopenFlagDto, WaiveFlagDto } from './dto/flag-actions.dto';
import type { UpdateFlagDto } from './dto/update-flag.dto';
import { flagAnsweredMail, flagAssignedMail, flagsAssignedMail, flagStatusMail } from './flag-mails';
import { assertTransition, TARGET, type FlagAction } from './flag-transitions';
import { toFlag, toFlagDetail } from './flags.mapper';
import { FlagsRepository, type FlagChange, type FlagRow, type NewFlagEvent } from './flags.repository';
import { flagNotFound, FlagsService } from './flags.service';

/** What one change does to a flag, decided after the checks passed. */
interface Outcome {
  change: FlagChange;
  events: Omit<NewFlagEvent, 'flagId' | 'actorId'>[];
  activity: { action: string; summary: string; data?: Record<string, unknown> };
  /** E-mails to queue, given the project's name. */
  mails?: (projectName: string) => OutgoingMail[];
}

interface ChangeRules {
  /** The version the client last saw; a different one is 409 STALE_WRITE. Left out: no check (comments). */
  version?: number;
  /** The status move, checked against the machine in flag-transitions.ts. */
  action?: FlagAction;
  /** Row-level rules beyond the route's roles (throws 403). */
  authorize?: (flag: FlagRow) => void;
}

const STATUS_ACTIONS = {
  answered: 'flag.answered',
  closed: 'flag.closed',
  open: 'flag.reopened',
  waived: 'flag.waived',
} as const satisfies Record<FlagStatus, string>;

/**
 * Changes to existing flags. Each runs in one transaction on the locked
 * flag row: 404 for another project's flag, row-level role rules (403),
 * the version (409 STALE_WRITE, with the current flag), the status machine
 * (409 CONFLICT); then the update with version + 1, its history events, an
 * activity entry and the e-mails, all committed together.
 */
@Injectable()
export class FlagChangesService {
  constructor(
    private readonly flags: FlagsRepository,
    private readonly members: MembersRepository,
    private readonly flagsService: FlagsService,
    private readonly activity: ActivityService,
    private readonly outbox: OutboxService,
    private readonly tx: TransactionRunner,
  ) {}

  /** Assignee and/or due date (checker or manager: the guard decides). */
  update(access: ProjectAccess, actor: SessionUser, flagId: number, dto: UpdateFlagDto): Promise<FlagDetail> {
    if (dto.assigneeId === undefined && dto.dueDate === undefined) {
      throw invalidField('body', 'send assigneeId and/or dueDate (with the version): there is nothing else to change');
    }
    return this.change(access, actor, flagId, { version: dto.version, action: 'edit' }, async (flag, trx) => {
      const events: Outcome['events'] = [];
      const said: string[] = [];
      const change: FlagChange = {};
      let newAssignee: { id: number; name: string; email: string } | null = null;
      if (dto.assigneeId !== undefined && dto.assigneeId !== flag.assignee_id) {
        newAssignee = await this.flagsService.assignee(trx, access.projectId, dto.assigneeId, 'body.assigneeId');
        change.assigneeId = newAssignee?.id ?? null;
        events.push(assignEvent(flag, newAssignee));
        said.push(newAssignee ? `assigned it to ${newAssignee.name}` : 'unassigned it');
      }
      if (dto.dueDate !== undefined && dto.dueDate !== flag.due_date) {
        change.dueDate = dto.dueDate;
        events.push({ kind: 'due', data: { from: flag.due_date, to: dto.dueDate } });
        said.push(dto.dueDate ? `set its due date to ${dto.dueDate}` : 'cleared its due date');
      }
      if (events.length === 0) return null;
      const assigned = newAssignee;
      return {
        change,
        events,
        activity: {
          action: 'flag.updated',
          summary: `${actor.name} ${said.join(' and ')} (flag ${flag.id} on ${flag.mark})`,
          data: { flagId: flag.id, mark: flag.mark, ...change },
        },
        mails: (projectName) =>
          assigned && assigned.id !== actor.id
            ? [flagAssignedMail({ to: assigned.email, actorName: actor.name, projectName, flag: { ...this.flagsService.ref(flag), dueDate: change.dueDate !== undefined ? change.dueDate : flag.due_date }, raised: false })]
            : [],
      };
    });
  }

  /** open → answered, by the assignee or any engineer of the project; the raiser is told. */
  answer(access: ProjectAccess, actor: SessionUser, flagId: number, dto: AnswerFlagDto): Promise<FlagDetail> {
    const authorize = (flag: FlagRow) => {
      if (access.role === 'engineer' || flag.assignee_id === actor.id) return;
      throw new ApiError(
        'FORBIDDEN',
        `Only the flag's assignee${flag.assignee_name ? ` (${flag.assignee_name})` : ''} or an engineer of the project can answer flag ${flag.id}; add a comment instead.`,
      );
    };
    return this.moveStatus(access, actor, flagId, 'answer', dto.version, dto.body, authorize, (flag, projectName) =>
      flag.raiser_email && flag.raised_by !== actor.id
        ? [flagAnsweredMail({ to: flag.raiser_email, actorName: actor.name, projectName, flag: this.flagsService.ref(flag), answer: dto.body })]
        : [],
    );
  }

  /** open | answered → closed (checkers); the assignee is told. */
  close(access: ProjectAccess, actor: SessionUser, flagId: number, dto: CloseFlagDto): Promise<FlagDetail> {
    return this.moveStatus(access, actor, flagId, 'close', dto.version, dto.body || null, undefined, (flag, projectName) =>
      this.toAssignee(flag, actor, (to) => flagStatusMail({ to, actorName: actor.name, projectName, flag: this.flagsService.ref(flag), what: 'closed', note: dto.body || null })),
    );
  }

  /** closed | waived → open (checkers), with a comment; the assignee is told. */
  reopen(access: ProjectAccess, actor: SessionUser, flagId: number, dto: ReopenFlagDto): Promise<FlagDetail> {
    return this.moveStatus(access, actor, flagId, 'reopen', dto.version, dto.body, undefined, (flag, projectName) =>
      this.toAssignee(flag, actor, (to) => flagStatusMail({ to, actorName: actor.name, projectName, flag: this.flagsService.ref(flag), what: 'reopened', note: dto.body })),
    );
  }

  /** open | answered → waived (checker or manager), with the reason; the assignee is told. */
  waive(access: ProjectAccess, actor: SessionUser, flagId: number, dto: WaiveFlagDto): Promise<FlagDetail> {
    return this.moveStatus(access, actor, flagId, 'waive', dto.version, dto.reason, undefined, (flag, projectName) =>
      this.toAssignee(flag, actor, (to) => flagStatusMail({ to, actorName: actor.name, projectName, flag: this.flagsService.ref(flag), what: 'waived', note: dto.reason })),
    );
  }

  /** A comment in any status (everyone but viewers). */
  comment(access: ProjectAccess, actor: SessionUser, flagId: number, dto: CommentFlagDto): Promise<FlagDetail> {
    return this.change(access, actor, flagId, {}, async (flag) => ({
      change: {},
      events: [{ kind: 'comment', body: dto.body }],
      activity: { action: 'flag.commented', summary: `${actor.name} commented on flag ${flag.id} (${flag.mark})`, data: { flagId: flag.id, mark: flag.mark } },
    }));
  }

  /**
   * One assignee (and optionally one due date) for many flags. Flags closed
   * or waived, and flags that would not change, are skipped and counted; an id
   * that is not a flag of this project refuses the whole request.
   */
  async bulkAssign(access: ProjectAccess, actor: SessionUser, dto: BulkAssignFlagsDto): Promise<BulkAssignFlagsResponse> {
    const projectId = access.projectId;
    const mailIds: number[] = [];
    const result = await this.tx.run(async (trx) => {
      const latest = await this.members.latestRevision(projectId, trx);
      const assignee = await this.flagsService.assignee(trx, projectId, dto.assigneeId, 'body.assigneeId');
      const rows = await this.flags.findMany(trx, projectId, latest?.id ?? null, [...dto.flagIds].sort((a, b) => a - b));
      const found = new Set(rows.map((r) => r.id));
      const missing = dto.flagIds.map((id, i) => ({ id, i })).filter(({ id }) => !found.has(id));
      if (missing.length) {
        throw new ApiError(
          'VALIDATION_FAILED',
          `Some flags are not flags of this project: ${missing.map(({ id }) => id).join(', ')}. Nothing was changed; reload the Flags screen and try again.`,
          missing.map(({ id, i }) => ({ path: `body.flagIds[${i}]`, message: `flag ${id} was not found in this project` })),
        );
      }
      const toId = assignee?.id ?? null;
      const changed: FlagRow[] = [];
      const skippedIds: number[] = [];
      for (const r of rows) {
        const sameDue = dto.dueDate === undefined || dto.dueDate === r.due_date;
        if (r.status === 'closed' || r.status === 'waived' || (r.assignee_id === toId && sameDue)) skippedIds.push(r.id);
        else changed.push(r);
      }
      if (changed.length) {
        const change: FlagChange = { assigneeId: toId, ...(dto.dueDate !== undefined ? { dueDate: dto.dueDate } : {}) };
        await this.flags.update(trx, changed.map((r) => r.id), change);
        const events: NewFlagEvent[] = [];
        for (const r of changed) {
          if (r.assignee_id !== toId) events.push({ flagId: r.id, actorId: actor.id, ...assignEvent(r, assignee) });
          if (dto.dueDate !== undefined && dto.dueDate !== r.due_date) events.push({ flagId: r.id, actorId: actor.id, kind: 'due', data: { from: r.due_date, to: dto.dueDate } });
        }
        await this.flags.insertEvents(trx, events);
        await this.activity.record(trx, {
          projectId,
          actorId: actor.id,
          action: 'flag.bulk_assigned',
          summary:
            `${actor.name} ${assignee ? `assigned ${changed.length} flag${changed.length === 1 ? '' : 's'} to ${assignee.name}` : `unassigned ${changed.length} flag${changed.length === 1 ? '' : 's'}`}` +
            `${dto.dueDate ? `, due ${dto.dueDate}` : dto.dueDate === null ? ', without due date' : ''}: ${changed.map((r) => r.mark).join(', ')}`,
          data: { flagIds: changed.map((r) => r.id), ...change, skippedIds },
        });
      }
      const updated = changed.length ? await this.flags.list(projectId, latest?.id ?? null, { ids: changed.map((r) => r.id) }, 'mark', 0, changed.length, trx) : [];
      const newlyTheirs = updated.filter((u) => changed.find((r) => r.id === u.id)!.assignee_id !== toId);
      if (assignee && assignee.id !== actor.id && newlyTheirs.length) {
        const projectName = await this.flags.projectName(projectId, trx);
        mailIds.push(
          await this.outbox.enqueue(trx, flagsAssignedMail({ to: assignee.email, actorName: actor.name, projectName, flags: newlyTheirs.map((r) => this.flagsService.ref(r)), raised: false })),
        );
      }
      return { updated: updated.map(toFlag), skipped: skippedIds.length, skippedIds };
    });
    this.outbox.deliverSoon(mailIds);
    return result;
  }

  // ------------------------------------------------------------------ the pipeline

  private moveStatus(
    access: ProjectAccess,
    actor: SessionUser,
    flagId: number,
    action: Exclude<FlagAction, 'edit'>,
    version: number,
    body: string | null,
    authorize: ((flag: FlagRow) => void) | undefined,
    mails: (flag: FlagRow, projectName: string) => OutgoingMail[],
  ): Promise<FlagDetail> {
    const to = TARGET[action];
    return this.change(access, actor, flagId, { version, action, authorize }, async (flag) => ({
      change: { status: to, waiveReason: to === 'waived' ? body : null },
      events: [{ kind: 'status', fromStatus: flag.status, toStatus: to, body }],
      activity: {
        action: STATUS_ACTIONS[to],
        summary: `${actor.name} ${action === 'answer' ? 'answered' : action === 'close' ? 'closed' : action === 'reopen' ? 'reopened' : 'waived'} flag ${flag.id} on ${flag.mark}${body ? `: ${clip(body)}` : ''}`,
        data: { flagId: flag.id, mark: flag.mark, from: flag.status, to },
      },
      mails: (projectName) => mails(flag, projectName),
    }));
  }

  private async change(access: ProjectAccess, actor: SessionUser, flagId: number, rules: ChangeRules, decide: (flag: FlagRow, trx: Trx) => Promise<Outcome | null>): Promise<FlagDetail> {
    const projectId = access.projectId;
    const mailIds: number[] = [];
    const detail = await this.tx.run(async (trx) => {
      const latest = await this.members.latestRevision(projectId, trx);
      const latestId = latest?.id ?? null;
      const flag = await this.flags.find(projectId, flagId, latestId, { trx, lock: true });
      if (!flag) throw flagNotFound(flagId);
      rules.authorize?.(flag);
      if (rules.version !== undefined && rules.version !== flag.version) {
        const current = toFlagDetail(flag, await this.flags.events(flagId, trx));
        const message = `Flag ${flagId} changed since you loaded it (you sent version ${rules.version}, it is at version ${flag.version}, ${flag.status}); look at its current state and try again if your change still applies.`;
        throw new ApiError('STALE_WRITE', message, [{ path: 'body.version', message: `the flag is at version ${flag.version}; details[0].value is the flag as it is now`, value: current }]);
      }
      if (rules.action) assertTransition(rules.action, flag.status, flagId);
      const outcome = await decide(flag, trx);
      if (outcome) {
        await this.flags.update(trx, [flagId], outcome.change);
        await this.flags.insertEvents(trx, outcome.events.map((e) => ({ ...e, flagId, actorId: actor.id })));
        await this.activity.record(trx, { projectId, actorId: actor.id, ...outcome.activity });
        const mails = outcome.mails?.(await this.flags.projectName(projectId, trx)) ?? [];
        for (const mail of mails) mailIds.push(await this.outbox.enqueue(trx, mail));
      }
      const row = (await this.flags.find(projectId, flagId, latestId, { trx }))!;
      return toFlagDetail(row, await this.flags.events(flagId, trx));
    });
    this.outbox.deliverSoon(mailIds);
    return detail;
  }

  private toAssignee(flag: FlagRow, actor: SessionUser, make: (to: string) => OutgoingMail): OutgoingMail[] {
    return flag.assignee_email && flag.assignee_id !== actor.id ? [make(flag.assignee_email)] : [];
  }
}

function assignEvent(flag: FlagRow, to: { id: number; name: string } | null): Omit<NewFlagEvent, 'flagId' | 'actorId'> {
  return {
    kind: 'assign',
    data: {
      fromAssignee: flag.assignee_id !== null ? { id: flag.assignee_id, name: flag.assignee_name ?? '' } : null,
      toAssignee: to ? { id: to.id, name: to.name } : null,
    },
  };
}

/** The first line of a comment, shortened, for activity summaries. */
function clip(text: string, max = 120): string {
  const first = text.split('\n')[0];
  return first.length > max ? `${first.slice(0, max - 1)}…` : first;
}
