import { Injectable } from '@nestjs/common';
import type { CommitImportResponse } from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import { analyzeMembers } from '../checks/member-analysis';
import { LimitSetsService } from '../checks/limit-sets.service';
import { OverviewRevisionHook } from '../overview/overview-revision-hook';
import { ApiError, notFound } from '../common/api-error';
import { TransactionRunner } from '../db/transaction';
import type { RevisionNotesResult } from '../flags/flag-revision-notes';
import { FlagsService } from '../flags/flags.service';
import { toRevisionSummary } from '../revisions/revisions.mapper';
import { RevisionsRepository, type MemberToWrite, type StoredDiff } from '../revisions/revisions.repository';
import { DraftCache } from './draft-cache';
import { rowsInvalid } from './import-errors';
import { ImportsRepository } from './imports.repository';
import { previewDiff, withVerdicts } from './preview-diff';

/** Progress of a commit: fraction done (0..1) and what it is doing. */
export type CommitProgress = (fraction: number, step: string) => void;

export interface CommitOptions {
  label: string | null;
  /** Who commits (the activity's actor); the revision keeps the uploader. */
  actorId: number | null;
  onProgress?: CommitProgress;
  /**
   * A retried background job: when the draft already became a revision (the
   * first attempt committed, then its process died before saying so), answer
   * with that revision instead of an error.
   */
  idempotent?: boolean;
}

/**
 * Turns a draft into revision N, all or nothing: the revision row (with the
 * original file and the parse report), its members, their loads and the
 * engine's results, the draft's removal and the activity entry are written in
 * ONE transaction. A crash or a kill anywhere before its COMMIT leaves the
 * database as it was (PostgreSQL rolls the transaction back), so a retried
 * job starts from scratch. Commits of one project take turns on a lock of
 * the project row, so revision numbers are consecutive.
 */
@Injectable()
export class ImportCommitService {
  constructor(
    private readonly drafts: ImportsRepository,
    private readonly revisions: RevisionsRepository,
    private readonly limitSets: LimitSetsService,
    private readonly activity: ActivityService,
    private readonly tx: TransactionRunner,
    private readonly cache: DraftCache,
    private readonly overview: OverviewRevisionHook,
    private readonly flags: FlagsService,
  ) {}

  async commit(projectId: number, draftId: string, options: CommitOptions): Promise<CommitImportResponse> {
    const progress = options.onProgress ?? (() => undefined);
    progress(0.02, 'Reading the draft');
    const draft = await this.drafts.find(projectId, draftId);
    if (!draft) return this.alreadyCommitted(projectId, draftId, options.idempotent ?? false);

    const { row: limitRow, set } = await this.limitSets.forProject(projectId);
    if (limitRow.id !== draft.limit_set_id || limitRow.version !== draft.limit_set_version) {
      throw new ApiError('CONFLICT', "The project's limit set changed after this upload was checked, so its verdicts may be out of date. Upload the schedule again to see the new verdicts, then commit.");
    }
    const context = await this.drafts.projectContext(projectId);
    if (!context) throw notFound(`Project ${projectId} was not found, or you are not on its team.`);

    const cached = this.cache.take(draftId, draft.limit_set_id, draft.limit_set_version);
    const members = cached?.members ?? (await this.drafts.members(draftId));
    const total = members.length;
    progress(0.05, 'Checking members');
    const outcome =
      cached?.outcome ??
      analyzeMembers(members, set, {
        onProgress: (done) => progress(0.05 + (0.25 * done) / Math.max(1, total), 'Checking members'),
      });
    if (outcome.problems.length) throw rowsInvalid(outcome.problems);

    const levelIds = new Map(context.levels.map((l) => [l.name.toLowerCase(), l.id]));
    const toWrite: MemberToWrite[] = members.map((member, i) => ({
      member,
      levelId: levelIds.get(member.level.toLowerCase()) ?? null,
      reviewerId: member.reviewerEmail ? (context.team.get(member.reviewerEmail.toLowerCase()) ?? null) : null,
      analysis: outcome.analyses[i],
    }));

    let flagNotes: RevisionNotesResult | null = null;
    const revision = await this.tx.run(async (trx) => {
      progress(0.3, 'Waiting for other commits of this project');
      if (!(await this.revisions.lockProject(trx, projectId))) throw notFound(`Project ${projectId} was not found.`);
      const done = await this.revisions.findBySourceDraft(trx, draftId);
      if (done) {
        if (options.idempotent) return done;
        throw new ApiError('CONFLICT', `This upload was already committed as revision ${done.number}; open it from the revisions list.`);
      }
      // A change of the limit set holds the same lock: it may have landed while this commit waited.
      if (!(await this.limitSets.isCurrent(trx, projectId, limitRow.id, limitRow.version))) {
        throw new ApiError('CONFLICT', "The project's limit set changed after this upload was checked, so its verdicts may be out of date. Upload the schedule again to see the new verdicts, then commit.");
      }
      if (!(await this.drafts.take(trx, projectId, draftId))) throw notFound('This upload was discarded or has expired; upload the schedule again.');

      progress(0.32, 'Comparing with the previous revision');
      const latest = await this.revisions.latest(projectId, trx);
      const previous = latest ? await this.revisions.membersOf(latest.id, trx) : [];
      const diff = previewDiff(latest ?? null, previous, withVerdicts(members, outcome.analyses), context.unitSystem);
      const stored: StoredDiff = {
        against: latest ? { id: latest.id, number: latest.number } : null,
        added: diff.added.length,
        removed: diff.removed.length,
        changed: diff.changed.length,
        flips: diff.flips.length,
        flipped: diff.flips,
      };
      const number = await this.revisions.nextNumber(trx, projectId);
      const revisionId = await this.revisions.insertRevision(trx, {
        projectId,
        number,
        label: options.label,
        uploadedBy: draft.uploaded_by,
        fileName: draft.file_name,
        fileType: draft.file_type,
        fileBytes: draft.file_bytes,
        parseReport: { problems: draft.problems, memberRows: draft.member_count, loadRows: draft.load_row_count },
        diff: stored,
        limitSetId: limitRow.id,
        limitSet: set,
        memberCount: total,
        passCount: outcome.pass,
        failCount: outcome.fail,
        sourceDraftId: draftId,
      });
      progress(0.35, 'Writing members and results');
      await this.drafts.writeMembers(trx, revisionId, toWrite, (rows, all) => progress(0.35 + (0.6 * rows) / all, 'Writing members and results'));
      // Reviewer assignments reach the new members; sign-offs of levels this revision touched are voided.
      await this.overview.onRevisionCommitted(trx, projectId, { id: revisionId, number }, diff);
      // Flags of changed, flipped or removed members get an automatic note (api/src/flags/README.md).
      flagNotes = await this.flags.onRevisionCommitted(trx, projectId, revisionId, [
        ...diff.changed.map((c) => ({ mark: c.mark, verdictBefore: c.verdictBefore, verdictAfter: c.verdict, removed: false, changedFields: c.changes.map((f) => f.label) })),
        ...diff.flips.map((f) => ({ mark: f.mark, verdictBefore: f.from, verdictAfter: f.to, removed: false })),
        ...diff.removed.map((r) => ({ mark: r.mark, verdictBefore: r.verdict, verdictAfter: null, removed: true })),
      ]);
      await this.activity.record(trx, {
        projectId,
        actorId: options.actorId,
        action: 'import.committed',
        summary:
          `Committed revision ${number}${options.label ? ` "${options.label}"` : ''} from ${draft.file_name}: ${total} members, ${outcome.fail} failing` +
          (latest ? ` (against revision ${latest.number}: ${stored.added} added, ${stored.removed} removed, ${stored.changed} changed, ${stored.flips} verdicts flipped)` : ''),
        data: { revisionId, number, fileName: draft.file_name, members: total, fail: outcome.fail, diff: { ...stored, flipped: undefined } },
      });
      progress(0.97, 'Saving');
      return (await this.revisions.findBySourceDraft(trx, draftId))!;
    });
    // The notes' e-mails go once the revision is committed, never for a rolled-back one.
    if (flagNotes) this.flags.deliverRevisionNotes(flagNotes);
    progress(1, 'Done');
    return { revision: toRevisionSummary(revision) };
  }

  private async alreadyCommitted(projectId: number, draftId: string, idempotent: boolean): Promise<CommitImportResponse> {
    const done = await this.revisions.findBySourceDraft(undefined, draftId);
    if (done && done.project_id === projectId) {
      if (idempotent) return { revision: toRevisionSummary(done) };
      throw new ApiError('CONFLICT', `This upload was already committed as revision ${done.number}; open it from the revisions list.`);
    }
    throw notFound('There is no such upload waiting to be committed: it was discarded, has expired (uploads wait 24 hours), or belongs to another project. Upload the schedule again.');
  }
}
