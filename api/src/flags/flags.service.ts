import { Inject, Injectable } from '@nestjs/common';
import { FLAG_LIMITS, type BulkRaiseFlagsResponse, type Flag, type FlagDetail, type FlagSummary, type Page } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ApiError, invalidField, notFound } from '../common/api-error';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { ReadCache } from '../db/read-cache';
import { TransactionRunner, type Trx } from '../db/transaction';
import type { OutgoingMail } from '../mail/mail.transport';
import { OutboxService } from '../mail/outbox.service';
import { toMemberFilter } from '../members/member-filter';
import { MembersRepository, type MemberBrief, type MemberCheckRow, type RevisionRefRow } from '../members/members.repository';
import type { BulkRaiseFlagsDto } from './dto/bulk-raise-flags.dto';
import type { ListFlagsQuery } from './dto/list-flags.dto';
import type { RaiseFlagDto } from './dto/raise-flag.dto';
import { flagAssignedMail, flagsAssignedMail, flagsLimitSetMail, flagsRevisionMail, type FlagRef } from './flag-mails';
import {
  limitSetChangeWords,
  limitSetNote,
  mergeChanges,
  revisionNote,
  type LimitSetCause,
  type RecomputedMemberFlip,
  type RevisionMemberChange,
  type RevisionNotesResult,
} from './flag-revision-notes';
import { defaultFlagTitle } from './flag-title';
import { toFlag, toFlagDetail, toFlagSummary } from './flags.mapper';
import { FlagsRepository, type FlagFilter, type FlagRow, type NewFlag, type OpenOrWaivedFlagRow, type PersonRow } from './flags.repository';

/** The link a flag e-mail carries (the web app's flag page). */
export function flagLink(publicUrl: string, projectId: number, flagId: number): string {
  return `${publicUrl}/projects/${projectId}/flags/${flagId}`;
}

export function flagNotFound(flagId: number): ApiError {
  return notFound(`Flag ${flagId} was not found in this project; the Flags screen lists the ones there are.`);
}

/**
 * Reading and raising flags, and the automatic notes a new revision leaves
 * on them. Changes to one flag (answer, close, …) are FlagChangesService's.
 */
@Injectable()
export class FlagsService {
  constructor(
    private readonly flags: FlagsRepository,
    private readonly members: MembersRepository,
    private readonly activity: ActivityService,
    private readonly outbox: OutboxService,
    private readonly tx: TransactionRunner,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly cache: ReadCache,
  ) {}

  // ------------------------------------------------------------------ reads

  async list(access: ProjectAccess, user: SessionUser, q: ListFlagsQuery): Promise<Page<Flag>> {
    const latest = await this.members.latestRevision(access.projectId);
    const assignees = q.assignee ?? [];
    const filter: FlagFilter = {
      statuses: q.status,
      assigneeIds: assignees.filter((a) => /^\d+$/.test(a)).map(Number).concat(assignees.includes('me') ? [user.id] : []),
      unassigned: assignees.includes('none'),
      levelIds: q.level?.map(Number),
      markContains: q.mark || undefined,
      checks: q.check,
      overdue: q.overdue,
    };
    const [rows, total] = await Promise.all([
      this.flags.list(access.projectId, latest?.id ?? null, filter, q.sort, (q.page - 1) * q.pageSize, q.pageSize),
      this.flags.count(access.projectId, latest?.id ?? null, filter),
    ]);
    return { items: rows.map(toFlag), total, page: q.page, pageSize: q.pageSize };
  }

  /** Kept in memory while no data changed (db/read-cache.ts). */
  summary(access: ProjectAccess): Promise<FlagSummary> {
    return this.cache.get(`flags-summary:${access.projectId}`, async () => {
      const latest = await this.members.latestRevision(access.projectId);
      return toFlagSummary(await this.flags.summary(access.projectId, latest?.id ?? null));
    });
  }

  async detail(access: ProjectAccess, flagId: number): Promise<FlagDetail> {
    const latest = await this.members.latestRevision(access.projectId);
    const row = await this.flags.find(access.projectId, flagId, latest?.id ?? null);
    if (!row) throw flagNotFound(flagId);
    return toFlagDetail(row, await this.flags.events(flagId));
  }

  /** Every flag of a mark (all statuses), newest first: the Member screen's list. */
  async forMark(projectId: number, latestRevisionId: number | null, mark: string): Promise<Flag[]> {
    const rows = await this.flags.list(projectId, latestRevisionId, { mark }, '-created', 0, 1000);
    return rows.map(toFlag);
  }

  // ------------------------------------------------------------------ raising

  /**
   * One flag on a member of the latest revision. Refused when the mark is not
   * in it, the check is not one of the member's, the assignee is not an
   * engineer, or a flag of the same mark and check still needs action.
   */
  async raise(access: ProjectAccess, actor: SessionUser, dto: RaiseFlagDto): Promise<FlagDetail> {
    const projectId = access.projectId;
    const mailIds: number[] = [];
    const detail = await this.tx.run(async (trx) => {
      await this.flags.lockRaising(trx, projectId);
      const latest = await this.latestOrRefuse(trx, projectId);
      const member = await this.members.findByMark(projectId, latest.id, dto.mark, trx);
      if (!member) {
        throw invalidField('body.mark', `there is no member "${dto.mark}" in revision ${latest.number} (the latest); check the mark on the Members screen`);
      }
      const checkName = dto.checkName ?? null;
      const checks = await this.members.checksOf([member.id], trx);
      if (checkName && !checks.some((c) => c.check_name === checkName)) {
        const names = checks.map((c) => `"${c.check_name}"`).join(', ');
        throw invalidField('body.checkName', `${member.mark} has no check "${checkName}" in revision ${latest.number}; its checks are ${names || 'none (no check applies to it)'}`);
      }
      const assignee = await this.assignee(trx, projectId, dto.assigneeId, 'body.assigneeId');
      const live = await this.flags.liveFlagsFor(trx, projectId, [member.mark.toLowerCase()], checkName);
      if (live.length) {
        throw new ApiError(
          'CONFLICT',
          `${member.mark} already has an open flag ${checkName ? `for ${checkName}` : 'on the member as a whole'} (flag ${live[0].id}); add a comment to that one instead.`,
        );
      }
      const title = dto.title ?? defaultFlagTitle(member, checkName, checks);
      const [id] = await this.flags.insertFlags(trx, [this.newFlag(projectId, member.mark, checkName, latest, title, dto, assignee, actor)]);
      await this.flags.insertEvents(trx, [this.raiseEvent(id, actor, dto.comment, latest, assignee, dto.dueDate ?? null)]);
      await this.activity.record(trx, {
        projectId,
        actorId: actor.id,
        action: 'flag.raised',
        summary: `${actor.name} raised flag ${id} on ${member.mark}: ${title}${assignee ? `, assigned to ${assignee.name}` : ''}`,
        data: { flagId: id, mark: member.mark, checkName, assigneeId: assignee?.id ?? null, revisionId: latest.id },
      });
      const row = (await this.flags.find(projectId, id, latest.id, { trx }))!;
      if (assignee && assignee.id !== actor.id) {
        const projectName = await this.flags.projectName(projectId, trx);
        mailIds.push(await this.outbox.enqueue(trx, flagAssignedMail({ to: assignee.email, actorName: actor.name, projectName, flag: this.ref(row), raised: true })));
      }
      return toFlagDetail(row, await this.flags.events(id, trx));
    });
    this.outbox.deliverSoon(mailIds);
    return detail;
  }

  /**
   * One flag per member: the marks listed, or every failing member of a
   * Members filter. All or nothing: an unknown mark refuses the request.
   * Marks that already have a flag of the same check still needing action
   * are skipped and counted. One activity entry and at most one e-mail for
   * the whole batch (a checker flagging a floor must not send fifty).
   */
  async bulkRaise(access: ProjectAccess, actor: SessionUser, dto: BulkRaiseFlagsDto): Promise<BulkRaiseFlagsResponse> {
    const projectId = access.projectId;
    if ((dto.marks === undefined) === (dto.filter === undefined)) {
      throw invalidField('body', dto.marks ? 'send either marks or filter, not both' : 'send marks (a list of marks) or filter (the Members filter of the failing members to flag)');
    }
    const checkName = dto.checkName ?? null;
    const mailIds: number[] = [];
    const result = await this.tx.run(async (trx) => {
      await this.flags.lockRaising(trx, projectId);
      const latest = await this.latestOrRefuse(trx, projectId);
      const targets = dto.marks ? await this.membersOfMarks(trx, latest, dto.marks) : await this.failingMembersOf(trx, latest, dto, checkName);
      const checks = await this.members.checksOf(targets.map((m) => m.id), trx);
      if (checkName && dto.marks) {
        const lacking = targets.filter((m) => !checks.some((c) => c.member_id === m.id && c.check_name === checkName));
        if (lacking.length) {
          throw invalidField('body.checkName', `${lacking.map((m) => m.mark).join(', ')} ${lacking.length === 1 ? 'has' : 'have'} no check "${checkName}" in revision ${latest.number}; leave them out or raise them without a check`);
        }
      }
      const assignee = await this.assignee(trx, projectId, dto.assigneeId, 'body.assigneeId');
      const live = await this.flags.liveFlagsFor(trx, projectId, targets.map((m) => m.mark.toLowerCase()), checkName);
      const skip = new Set(live.map((f) => f.mark.toLowerCase()));
      const toRaise = targets.filter((m) => !skip.has(m.mark.toLowerCase()));
      const skippedMarks = targets.filter((m) => skip.has(m.mark.toLowerCase())).map((m) => m.mark);

      const checksOf = (id: number): MemberCheckRow[] => checks.filter((c) => c.member_id === id);
      const ids = await this.flags.insertFlags(
        trx,
        toRaise.map((m) => this.newFlag(projectId, m.mark, checkName, latest, dto.title ?? defaultFlagTitle(m, checkName, checksOf(m.id)), dto, assignee, actor)),
      );
      await this.flags.insertEvents(trx, ids.map((id) => this.raiseEvent(id, actor, dto.comment, latest, assignee, dto.dueDate ?? null)));
      if (ids.length) {
        await this.activity.record(trx, {
          projectId,
          actorId: actor.id,
          action: 'flag.bulk_raised',
          summary:
            `${actor.name} raised ${ids.length} flag${ids.length === 1 ? '' : 's'}${checkName ? ` for ${checkName}` : ''} on ${preview(toRaise.map((m) => m.mark))}` +
            `${assignee ? `, assigned to ${assignee.name}` : ''}${skippedMarks.length ? ` (${skippedMarks.length} skipped: already flagged)` : ''}`,
          data: { flagIds: ids, checkName, assigneeId: assignee?.id ?? null, skippedMarks, revisionId: latest.id },
        });
      }
      const rows = ids.length ? await this.flags.list(projectId, latest.id, { ids }, 'mark', 0, ids.length, trx) : [];
      if (assignee && assignee.id !== actor.id && rows.length) {
        const projectName = await this.flags.projectName(projectId, trx);
        mailIds.push(await this.outbox.enqueue(trx, flagsAssignedMail({ to: assignee.email, actorName: actor.name, projectName, flags: rows.map((r) => this.ref(r)), raised: true })));
      }
      return { created: rows.map(toFlag), skipped: skippedMarks.length, skippedMarks };
    });
    this.outbox.deliverSoon(mailIds);
    return result;
  }

  // ------------------------------------------------------------------ revisions

  /**
   * Call inside the import commit's transaction, after the revision and its
   * members are written: every flag that is not closed, on a mark the new
   * revision changed or left out, gets an automatic `revision` event ("Revision 3
   * changed this member: verdict fail → pass", "Member no longer in revision 3"),
   * its version moves on (an open screen then reloads instead of overwriting),
   * one activity entry sums it up, and each assignee gets one e-mail, queued in
   * the same transaction. After the commit, pass the result to
   * `deliverRevisionNotes` to send those e-mails at once (the outbox sweep would
   * otherwise send them within MAIL_RETRY_SECONDS).
   */
  async onRevisionCommitted(trx: Trx, projectId: number, revisionId: number, changes: readonly RevisionMemberChange[]): Promise<RevisionNotesResult> {
    const none: RevisionNotesResult = { notedFlagIds: [], mailIds: [] };
    if (changes.length === 0) return none;
    const revision = await this.flags.revision(trx, revisionId);
    if (!revision || revision.project_id !== projectId) throw new Error(`onRevisionCommitted: revision ${revisionId} is not a revision of project ${projectId}`);
    const byKey = mergeChanges(changes);
    const flagged = await this.flags.openOrWaivedFor(trx, projectId, [...byKey.keys()]);
    if (flagged.length === 0) return none;

    const notes = flagged.map((f) => {
      const change = byKey.get(f.mark.toLowerCase())!;
      return { flag: f, change, text: revisionNote(revision.number, change) };
    });
    const ids = await this.writeAutomaticNotes(
      trx,
      projectId,
      notes.map((n) => ({
        flagId: n.flag.id,
        text: n.text,
        data: {
          revisionId,
          revisionNumber: revision.number,
          verdictBefore: n.change.verdictBefore,
          verdictAfter: n.change.removed ? null : n.change.verdictAfter,
          removed: n.change.removed,
          changedFields: n.change.changedFields ?? [],
        },
      })),
      { actorId: null, summary: `Revision ${revision.number} changed or removed the members of ${notes.length} flag${notes.length === 1 ? '' : 's'}: ${preview([...new Set(notes.map((n) => n.flag.mark))])}`, data: { revisionId } },
    );

    const mailIds = await this.queueNoteMails(trx, projectId, notes, (to, projectName, list) =>
      flagsRevisionMail({ to, projectName, revisionNumber: revision.number, notes: list }),
    );
    return { notedFlagIds: ids, mailIds };
  }

  /**
   * Call inside the transaction of a recompute of the latest revision under a
   * new limit set (LimitSetChangesService.applyChange, inline or as a job):
   * every flag that is not closed, on a mark whose verdict flipped, gets an
   * automatic `revision` event (`Limit set changed to "X": verdict pass → fail
   * (L/360 live 1.12)`, data.cause 'limit_set'), its version moves on, one
   * `flag.revision_noted` activity entry sums it up, and each assignee gets
   * one e-mail, queued in the same transaction. After the commit, pass the
   * result to `deliverRevisionNotes`.
   */
  async onResultsRecomputed(trx: Trx, projectId: number, revision: { id: number; number: number }, flips: readonly RecomputedMemberFlip[], cause: LimitSetCause): Promise<RevisionNotesResult> {
    const none: RevisionNotesResult = { notedFlagIds: [], mailIds: [] };
    const byKey = new Map<string, RecomputedMemberFlip>();
    for (const f of flips) if (f.verdictBefore !== f.verdictAfter) byKey.set(f.mark.trim().toLowerCase(), f);
    if (byKey.size === 0) return none;
    const flagged = await this.flags.openOrWaivedFor(trx, projectId, [...byKey.keys()]);
    if (flagged.length === 0) return none;
    const notes = flagged.map((flag) => {
      const flip = byKey.get(flag.mark.toLowerCase())!;
      return { flag, flip, text: limitSetNote(cause, flip) };
    });
    const ids = await this.writeAutomaticNotes(
      trx,
      projectId,
      notes.map(({ flag, flip, text }) => ({
        flagId: flag.id,
        text,
        data: {
          cause: 'limit_set',
          limitSetId: cause.limitSetId,
          limitSetName: cause.limitSetName,
          changedBy: cause.actorId,
          revisionId: revision.id,
          revisionNumber: revision.number,
          verdictBefore: flip.verdictBefore,
          verdictAfter: flip.verdictAfter,
          governingCheck: flip.governingCheck,
          utilization: flip.utilization,
          removed: false,
          changedFields: [],
        },
      })),
      {
        actorId: null,
        summary: `${limitSetChangeWords(cause)}: verdicts flipped on the members of ${notes.length} flag${notes.length === 1 ? '' : 's'}: ${preview([...new Set(notes.map((n) => n.flag.mark))])}`,
        data: { revisionId: revision.id, limitSetId: cause.limitSetId },
      },
    );
    const mailIds = await this.queueNoteMails(trx, projectId, notes, (to, projectName, list) =>
      flagsLimitSetMail({ to, projectName, change: limitSetChangeWords(cause), notes: list }),
    );
    return { notedFlagIds: ids, mailIds };
  }

  /** One e-mail per assignee of the noted flags, made by `mail` and queued in the transaction; returns their outbox ids. */
  private async queueNoteMails(
    trx: Trx,
    projectId: number,
    notes: readonly { flag: OpenOrWaivedFlagRow; text: string }[],
    mail: (to: string, projectName: string, notes: { flag: FlagRef; note: string }[]) => OutgoingMail,
  ): Promise<number[]> {
    const projectName = await this.flags.projectName(projectId, trx);
    const byAssignee = new Map<string, { flag: FlagRef; note: string }[]>();
    for (const n of notes) {
      if (!n.flag.assignee_email) continue;
      const ref = { id: n.flag.id, mark: n.flag.mark, title: n.flag.title, dueDate: null, link: flagLink(this.config.publicUrl, projectId, n.flag.id) };
      const list = byAssignee.get(n.flag.assignee_email);
      if (list) list.push({ flag: ref, note: n.text });
      else byAssignee.set(n.flag.assignee_email, [{ flag: ref, note: n.text }]);
    }
    const mailIds: number[] = [];
    for (const [to, list] of byAssignee) mailIds.push(await this.outbox.enqueue(trx, mail(to, projectName, list)));
    return mailIds;
  }

  /** Automatic `revision` events on flags, their versions moved on, one activity entry; returns the flag ids. */
  private async writeAutomaticNotes(
    trx: Trx,
    projectId: number,
    notes: { flagId: number; text: string; data: Record<string, unknown> }[],
    entry: { actorId: number | null; summary: string; data: Record<string, unknown> },
  ): Promise<number[]> {
    await this.flags.insertEvents(trx, notes.map((n) => ({ flagId: n.flagId, actorId: null, kind: 'revision' as const, body: n.text, data: n.data })));
    const ids = notes.map((n) => n.flagId);
    await this.flags.update(trx, ids, {});
    await this.activity.record(trx, { projectId, actorId: entry.actorId, action: 'flag.revision_noted', summary: entry.summary, data: { ...entry.data, flagIds: ids } });
    return ids;
  }

  /** After the commit of the transaction onRevisionCommitted or onResultsRecomputed ran in: send its e-mails now. */
  deliverRevisionNotes(result: RevisionNotesResult): void {
    this.outbox.deliverSoon(result.mailIds);
  }

  // ------------------------------------------------------------------ helpers

  private async latestOrRefuse(trx: Trx, projectId: number): Promise<RevisionRefRow> {
    const latest = await this.members.latestRevision(projectId, trx);
    if (!latest) {
      throw new ApiError('CONFLICT', 'This project has no revision yet: flags are raised on the members of a committed revision. Upload a member schedule first.');
    }
    return latest;
  }

  /** The listed marks in the latest revision, each once; every unknown one is reported. */
  private async membersOfMarks(trx: Trx, latest: RevisionRefRow, marks: string[]): Promise<MemberBrief[]> {
    const found = await this.members.findByMarks(latest.id, marks, trx);
    const known = new Set(found.map((m) => m.mark.toLowerCase()));
    const missing = marks.map((m, i) => ({ m, i })).filter(({ m }) => !known.has(m.trim().toLowerCase()));
    if (missing.length) {
      const details = missing.map(({ m, i }) => ({ path: `body.marks[${i}]`, message: `there is no member "${m}" in revision ${latest.number} (the latest)` }));
      throw new ApiError('VALIDATION_FAILED', `Some marks are not in revision ${latest.number}: ${missing.map(({ m }) => m).join(', ')}. Nothing was raised; correct or remove them.`, details);
    }
    return found;
  }

  /** Failing members of the Members filter (with checkName: those failing that check). */
  private async failingMembersOf(trx: Trx, latest: RevisionRefRow, dto: BulkRaiseFlagsDto, checkName: string | null): Promise<MemberBrief[]> {
    const filter = toMemberFilter(dto.filter!);
    if (checkName) {
      const given = filter.failingChecks ?? [];
      if (given.length && !(given.length === 1 && given[0] === checkName)) {
        throw invalidField('body.filter.check', 'leave it out when checkName is given: the flags go on the members failing checkName');
      }
      filter.failingChecks = [checkName];
    }
    const found = await this.members.failingMembers(latest.id, filter, FLAG_LIMITS.bulkMax + 1, trx);
    if (found.length > FLAG_LIMITS.bulkMax) {
      throw invalidField('body.filter', `matches more than ${FLAG_LIMITS.bulkMax} failing members in revision ${latest.number}; narrow it (by level, category or check) and raise them in parts`);
    }
    return found;
  }

  /** The assignee, who must hold the engineer role (engineers answer flags, product.md). */
  async assignee(trx: Trx, projectId: number, id: number | null | undefined, path: string): Promise<PersonRow | null> {
    if (id === undefined || id === null) return null;
    const person = await this.flags.engineer(trx, projectId, id);
    if (!person) throw invalidField(path, `person ${id} is not an engineer on this project; flags are assigned to engineers (a manager can change roles on the Team screen)`);
    return person;
  }

  private newFlag(projectId: number, mark: string, checkName: string | null, latest: RevisionRefRow, title: string, dto: { comment?: string; dueDate?: string | null }, assignee: PersonRow | null, actor: SessionUser): NewFlag {
    return {
      projectId,
      mark,
      checkName,
      raisedInRevisionId: latest.id,
      title,
      comment: dto.comment || null,
      assigneeId: assignee?.id ?? null,
      raisedBy: actor.id,
      dueDate: dto.dueDate ?? null,
    };
  }

  private raiseEvent(flagId: number, actor: SessionUser, comment: string | undefined, latest: RevisionRefRow, assignee: PersonRow | null, dueDate: string | null) {
    return {
      flagId,
      actorId: actor.id,
      kind: 'status' as const,
      fromStatus: null,
      toStatus: 'open' as const,
      body: comment || null,
      data: { raised: true, revisionId: latest.id, revisionNumber: latest.number, assignee: assignee ? { id: assignee.id, name: assignee.name } : null, dueDate },
    };
  }

  ref(row: FlagRow): FlagRef {
    return { id: row.id, mark: row.mark, title: row.title, dueDate: row.due_date, link: flagLink(this.config.publicUrl, row.project_id, row.id) };
  }
}

/** "B1, B2, B3 and 12 more". */
function preview(marks: string[], max = 8): string {
  if (marks.length <= max) return marks.join(', ');
  return `${marks.slice(0, max).join(', ')} and ${marks.length - max} more`;
}
