import { randomUUID } from 'node:crypto';
import { Injectable } from '@nestjs/common';
import {
  findPreset,
  LIMIT_SET_PRESETS,
  VERDICT_CAUTION,
  type LimitRule,
  type LimitSet,
} from '@sagline/common/limits';
import type {
  ApiErrorDetail,
  LimitSetChangeResponse,
  LimitSetJobStatus,
  LimitSetsOverview,
  ProjectLimitSetView,
  RecomputeSummary,
  UpdateLimitSetRequest,
} from '@sagline/common/api-types';
import { ActivityService } from '../activity/activity.service';
import type { ProjectAccess } from '../auth/project-access';
import { ApiError, notFound } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import type { LimitSetCause, RecomputedMemberFlip, RevisionNotesResult } from '../flags/flag-revision-notes';
import { FlagsService } from '../flags/flags.service';
import { OverviewRevisionHook } from '../overview/overview-revision-hook';
import { JobQueue } from '../jobs/job-queue';
import { RevisionsRepository } from '../revisions/revisions.repository';
import { toPresetView, toProjectLimitSetView, toRecomputeJobStatus, toResultsState } from './checks.mapper';
import { categoriesOf, parseRules, setProblems } from './limit-set-input';
import { LimitSetsRepository, toLimitSet, type LimitSetRow } from './limit-sets.repository';
import { LimitSetsService } from './limit-sets.service';
import { analyzeMembers } from './member-analysis';
import { RecomputeSettings } from './recompute-settings';
import { RecomputeJobsRepository, type RecomputeJobRow } from './recompute-jobs.repository';

/** The pg-boss queue of limit-set changes on large projects. */
export const RECOMPUTE_QUEUE = 'limit-set-recompute';

export interface RecomputeJobData {
  jobId: string;
}

/** A change of the project's active set: choosing another set, or an edit of the active one. */
export type ActiveChange =
  | { kind: 'use'; setId: number; version?: number }
  | { kind: 'edit'; setId: number; edit: CheckedEdit };

/** An edit that passed validation: what will be stored. */
export interface CheckedEdit {
  version: number;
  name: string;
  description: string;
  categories: string[];
  rules: LimitRule[];
}

export type ChangeOutcome = { kind: 'done'; response: LimitSetChangeResponse } | { kind: 'queued'; jobId: string };

export type Progress = (fraction: number, step: string) => void;

/** A member of the latest revision whose verdict the recompute changed, with its governing check under the new set. */
type VerdictFlip = RecomputedMemberFlip & { level: string };

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/**
 * The Limit sets screen on the server: copies of presets into the project,
 * edits with validation, and the choice of the set the project's verdicts
 * follow. A change of the ACTIVE set (choosing another one, or editing the
 * one in use) and the recompute of the latest revision's results are ONE
 * transaction under the project's row lock: the set, the pointer, every
 * result, every member's verdict, the revision's copy of the set and the
 * activity entry are stored together or not at all. Above the import job
 * threshold the same transaction runs as a pg-boss job with progress.
 */
@Injectable()
export class LimitSetChangesService {
  constructor(
    private readonly repo: LimitSetsRepository,
    private readonly limitSets: LimitSetsService,
    private readonly revisions: RevisionsRepository,
    private readonly activity: ActivityService,
    private readonly tx: TransactionRunner,
    private readonly jobs: RecomputeJobsRepository,
    private readonly queue: JobQueue,
    private readonly settings: RecomputeSettings,
    private readonly overviewHook: OverviewRevisionHook,
    private readonly flags: FlagsService,
  ) {}

  // ------------------------------------------------------------------ reads

  async overview(access: ProjectAccess): Promise<LimitSetsOverview> {
    const { row: active } = await this.limitSets.forProject(access.projectId);
    const [own, latest, open] = await Promise.all([
      this.repo.listForProject(access.projectId),
      this.repo.latestRevision(access.projectId),
      this.jobs.findOpen(access.projectId),
    ]);
    const sets = own.map((row) => toProjectLimitSetView(row, active.id));
    sets.sort((a, b) => Number(b.active) - Number(a.active));
    return {
      activeId: active.id,
      presets: LIMIT_SET_PRESETS.map(toPresetView),
      projectSets: sets,
      results: latest ? toResultsState(latest) : null,
      openJob: open ? toRecomputeJobStatus(open) : null,
      canEdit: access.canManage,
      caution: VERDICT_CAUTION,
    };
  }

  async jobStatus(projectId: number, jobId: string): Promise<LimitSetJobStatus> {
    const row = UUID.test(jobId) ? await this.jobs.find(projectId, jobId) : undefined;
    if (!row) throw notFound(`There is no limit-set job ${jobId} in this project.`);
    return toRecomputeJobStatus(row);
  }

  // ------------------------------------------------------------------ copy

  /** A preset, or one of the project's sets, copied into the project as a new set (not active yet). */
  async copy(projectId: number, actorId: number, req: { fromPreset?: string; fromSetId?: number; name?: string }): Promise<ProjectLimitSetView> {
    if ((req.fromPreset === undefined) === (req.fromSetId === undefined)) {
      throw new ApiError('VALIDATION_FAILED', 'Say what to copy: either fromPreset (a preset id) or fromSetId (one of the project\'s sets), not both.', [
        { path: 'body.fromPreset', message: 'give either fromPreset or fromSetId' },
      ]);
    }
    const active = (await this.limitSets.forProject(projectId)).row;
    let source: Omit<LimitSet, 'id'>;
    let presetId: string | null;
    let from: string;
    let suffix = '(project copy)';
    if (req.fromPreset !== undefined) {
      const preset = findPreset(req.fromPreset);
      if (!preset) {
        throw new ApiError('VALIDATION_FAILED', `There is no preset "${req.fromPreset}". Presets: ${LIMIT_SET_PRESETS.map((p) => p.id).join(', ')}.`, [
          { path: 'body.fromPreset', message: `is not a preset id; use one of ${LIMIT_SET_PRESETS.map((p) => p.id).join(', ')}` },
        ]);
      }
      source = preset;
      presetId = preset.id;
      from = `the preset "${preset.name}"`;
    } else {
      const own = await this.repo.findOwn(projectId, req.fromSetId as number);
      if (!own) {
        throw new ApiError('VALIDATION_FAILED', `The project has no limit set ${req.fromSetId}.`, [{ path: 'body.fromSetId', message: 'is not one of the project\'s limit sets' }]);
      }
      source = toLimitSet(own);
      presetId = own.source_preset_id;
      from = `"${own.name}"`;
      suffix = '(copy)';
    }
    const name = req.name?.trim() || `${source.name} ${suffix}`;
    const actor = await this.actorName(actorId);
    const id = await this.tx.run(async (trx) => {
      const setId = await this.repo.insertOwn(trx, projectId, { ...source, name }, presetId);
      await this.activity.record(trx, {
        projectId,
        actorId,
        action: 'limit_set.copied',
        summary: `${actor} copied ${from} into the project as "${name}" (not in use yet).`,
        data: { limitSetId: setId, limitSetName: name, fromPreset: req.fromPreset ?? null, fromSetId: req.fromSetId ?? null },
      });
      return setId;
    });
    const row = (await this.repo.findOwn(projectId, id))!;
    return toProjectLimitSetView(row, active.id);
  }

  // ------------------------------------------------------------------ edit

  /**
   * An edit of one of the project's sets. Every problem is answered at once
   * (400, paths like `body.rules[2].ratio`) and nothing is written. An
   * inactive set is just stored; the active one is stored together with
   * the recompute (inline, or as a job on a large project).
   */
  async update(projectId: number, setId: number, actorId: number, req: UpdateLimitSetRequest): Promise<ChangeOutcome> {
    const row = await this.repo.findOwn(projectId, setId);
    if (!row) throw notFound(`The project has no limit set ${setId}.`);
    const edit = this.checkEdit(row, req);
    if (edit.version !== row.version) throw stale(row);
    const activeId = await this.repo.activeId(projectId);
    if (activeId === setId) return this.changeActive(projectId, actorId, { kind: 'edit', setId, edit });

    const actor = await this.actorName(actorId);
    const response = await this.tx.run(async (trx) => {
      const locked = await this.repo.findOwn(projectId, setId, trx, true);
      if (!locked) throw notFound(`The project has no limit set ${setId}.`);
      // It may have become the active set since the check above: then it must go with a recompute.
      if ((await this.repo.activeId(projectId, trx)) === setId) throw new ApiError('CONFLICT', 'This set was just made the project\'s limit set by someone else; reload and edit it again (its results will be recomputed).');
      if (!(await this.repo.updateOwn(trx, setId, edit.version, edit))) throw stale(locked);
      await this.activity.record(trx, {
        projectId,
        actorId,
        action: 'limit_set.edited',
        summary: `${actor} edited limit set "${edit.name}" (not in use; version ${edit.version} → ${edit.version + 1}): ${describeRuleChanges(locked.rules, edit.rules)}.`,
        data: { limitSetId: setId, limitSetName: edit.name, fromVersion: edit.version, toVersion: edit.version + 1, active: false },
      });
      return { set: toProjectLimitSetView((await this.repo.findOwn(projectId, setId, trx))!, activeId), recompute: null };
    });
    return { kind: 'done', response };
  }

  /** Validates an edit against the stored set; 400 with every problem, or the edit to store. */
  checkEdit(row: LimitSetRow, req: UpdateLimitSetRequest): CheckedEdit {
    const parsed = parseRules(req.rules, row.rules);
    const cats = categoriesOf(req.categories, row.categories, parsed.rules);
    const edit: CheckedEdit = {
      version: req.version,
      name: req.name.trim(),
      description: (req.description ?? row.description).trim(),
      categories: cats.categories,
      rules: parsed.rules,
    };
    const problems: ApiErrorDetail[] = [...parsed.problems, ...cats.problems];
    const seen = new Set(problems.map((p) => p.path));
    for (const p of setProblems({ id: String(row.id), name: edit.name, description: edit.description, categories: edit.categories, rules: edit.rules, notes: row.notes })) {
      if (!seen.has(p.path)) problems.push(p);
    }
    if (problems.length) {
      // In the order of the form: the set's own fields, then rule by rule.
      const at = (d: ApiErrorDetail) => Number(/rules\[(\d+)\]/.exec(d.path ?? '')?.[1] ?? -1);
      problems.sort((a, b) => at(a) - at(b));
      const first = problems[0];
      throw new ApiError(
        'VALIDATION_FAILED',
        `The limit set was not saved: ${problems.length === 1 ? 'one problem' : `${problems.length} problems`}, first ${first.path}: ${first.message}`,
        problems,
      );
    }
    return edit;
  }

  // ------------------------------------------------------------------ choose

  /** Makes one of the project's sets the one its verdicts follow, and recomputes the latest revision. */
  async use(projectId: number, setId: number, actorId: number, version?: number): Promise<ChangeOutcome> {
    const row = await this.repo.findOwn(projectId, setId);
    if (!row) throw notFound(`The project has no limit set ${setId}.`);
    if (version !== undefined && version !== row.version) throw stale(row);
    return this.changeActive(projectId, actorId, { kind: 'use', setId, version });
  }

  // ------------------------------------------------------------------ delete

  /**
   * Deletes a set the project does not use. The set in use (409: choose another first) and a set a
   * change being applied is about to use (409) stay. Revisions checked against it keep their copy.
   */
  async remove(projectId: number, setId: number, actorId: number): Promise<void> {
    const actor = await this.actorName(actorId);
    await this.tx.run(async (trx) => {
      if (!(await this.repo.lockProject(trx, projectId))) throw notFound(`Project ${projectId} was not found.`);
      const row = await this.repo.findOwn(projectId, setId, trx, true);
      if (!row) throw notFound(`The project has no limit set ${setId}.`);
      if ((await this.repo.activeId(projectId, trx)) === setId) {
        throw new ApiError('CONFLICT', `"${row.name}" is the set the project is checked against, so it cannot be deleted. Choose another set with "Use this set" first, then delete this one.`);
      }
      const open = await this.jobs.findOpen(projectId);
      if (open && open.limit_set_id === setId) {
        throw new ApiError('CONFLICT', `A change to "${row.name}" is being applied right now; wait for it to finish, then delete the set if you still want to.`);
      }
      await this.repo.deleteOwn(trx, projectId, setId);
      await this.activity.record(trx, {
        projectId,
        actorId,
        action: 'limit_set.deleted',
        summary: `${actor} deleted the limit set "${row.name}" (not in use; revisions checked against it keep their copy of its rules).`,
        data: { limitSetId: setId, limitSetName: row.name, version: row.version },
      });
    });
  }

  // ------------------------------------------------------------------ the change of the active set

  private async changeActive(projectId: number, actorId: number, change: ActiveChange): Promise<ChangeOutcome> {
    const open = await this.jobs.findOpen(projectId);
    if (open) {
      throw new ApiError('CONFLICT', 'A change of the project\'s limit set is being applied right now; wait for it to finish (its progress is on the Limit sets screen), then try again.');
    }
    const latest = await this.repo.latestRevision(projectId);
    if (latest && latest.member_count > this.settings.jobThresholdMembers) {
      const jobId = randomUUID();
      const request = change.kind === 'edit' ? { edit: change.edit } : { version: change.version ?? null };
      await this.jobs.insert({ id: jobId, projectId, limitSetId: change.setId, kind: change.kind, requestedBy: actorId, request });
      await this.queue.send(RECOMPUTE_QUEUE, { jobId } satisfies RecomputeJobData, {
        id: jobId,
        retryLimit: this.settings.jobRetries,
        expireInSeconds: this.settings.jobExpireSeconds,
      });
      return { kind: 'queued', jobId };
    }
    return { kind: 'done', response: await this.applyChange(projectId, actorId, change) };
  }

  /** The job's work: the change as it was requested, rebuilt from the job row. */
  applyJob(row: RecomputeJobRow, onProgress: Progress): Promise<LimitSetChangeResponse> {
    if (row.limit_set_id === null) throw notFound('The limit set of this job was removed; nothing was changed.');
    const change: ActiveChange =
      row.kind === 'edit'
        ? { kind: 'edit', setId: row.limit_set_id, edit: row.request.edit as CheckedEdit }
        : { kind: 'use', setId: row.limit_set_id, version: (row.request.version as number | null) ?? undefined };
    return this.applyChange(row.project_id, row.requested_by, change, onProgress, row.id);
  }

  /**
   * ONE transaction: lock the project, apply the change, recompute the
   * latest revision under the resulting set, record the activity. Any
   * failure (a member the new set cannot check, a stale edit) rolls all of
   * it back.
   */
  async applyChange(projectId: number, actorId: number | null, change: ActiveChange, onProgress: Progress = () => undefined, jobId?: string): Promise<LimitSetChangeResponse> {
    const actor = await this.actorName(actorId);
    const { response, notes } = await this.tx.run(async (trx) => {
      let notes: RevisionNotesResult | null = null;
      onProgress(0.02, 'Waiting for other changes of this project');
      if (!(await this.repo.lockProject(trx, projectId))) throw notFound(`Project ${projectId} was not found.`);
      const before = await this.repo.findOwn(projectId, change.setId, trx, true);
      if (!before) throw notFound(`The project has no limit set ${change.setId}.`);
      const fromId = await this.repo.activeId(projectId, trx);
      const fromRow = fromId !== null ? await this.repo.findOwn(projectId, fromId, trx) : undefined;

      if (change.kind === 'edit') {
        if (fromId !== change.setId) throw new ApiError('CONFLICT', 'This set is no longer the project\'s limit set; reload the screen and edit it again.');
        if (!(await this.repo.updateOwn(trx, change.setId, change.edit.version, change.edit))) throw stale(before);
      } else {
        if (change.version !== undefined && change.version !== before.version) throw stale(before);
        await this.repo.setActive(trx, projectId, change.setId);
      }
      const after = (await this.repo.findOwn(projectId, change.setId, trx))!;
      const recomputed = await this.recompute(trx, projectId, after, onProgress);
      const recompute = recomputed?.summary ?? null;
      if (recomputed && recomputed.flips.length) {
        // What a flipped verdict means elsewhere, in this same transaction: notes on its flags, its level's sign-off voided.
        onProgress(0.95, 'Noting flipped verdicts on flags and sign-offs');
        const cause: LimitSetCause = { kind: change.kind === 'edit' ? 'edited' : 'applied', limitSetId: after.id, limitSetName: after.name, actorId };
        const revision = { id: recomputed.summary.revisionId, number: recomputed.summary.revisionNumber };
        recomputed.summary.signOffsVoided = await this.overviewHook.onResultsRecomputed(trx, projectId, revision, recomputed.flips, cause);
        notes = await this.flags.onResultsRecomputed(trx, projectId, revision, recomputed.flips, cause);
        recomputed.summary.flagsNoted = notes.notedFlagIds.length;
      }

      onProgress(0.97, 'Recording the change');
      const results = recompute
        ? ` Revision ${recompute.revisionNumber} recomputed: ${recompute.before.fail} → ${recompute.after.fail} failing of ${recompute.memberCount}, ${recompute.flippedCount} ${recompute.flippedCount === 1 ? 'verdict' : 'verdicts'} flipped.`
        : ' No revision yet, so no results to recompute.';
      const data = {
        limitSetId: after.id,
        limitSetName: after.name,
        from: fromRow ? { id: fromRow.id, name: fromRow.name, version: fromRow.version } : null,
        to: { id: after.id, name: after.name, version: after.version },
        revisionId: recompute?.revisionId ?? null,
        revisionNumber: recompute?.revisionNumber ?? null,
        before: recompute?.before ?? null,
        after: recompute?.after ?? null,
        marks: recompute?.flipped.map((f) => f.mark) ?? [],
      };
      if (change.kind === 'edit') {
        await this.activity.record(trx, {
          projectId,
          actorId,
          action: 'limit_set.edited',
          summary: `${actor} edited the project's limit set "${after.name}" (version ${before.version} → ${after.version}): ${describeRuleChanges(before.rules, after.rules)}.${results}`,
          data: { ...data, active: true },
        });
      } else {
        await this.activity.record(trx, {
          projectId,
          actorId,
          action: 'limit_set.applied',
          summary: `${actor} changed the project's limit set from ${fromRow ? `"${fromRow.name}"` : 'none'} to "${after.name}".${results}`,
          data,
        });
      }
      onProgress(0.99, 'Saving');
      const response = { set: toProjectLimitSetView(after, after.id), recompute };
      if (jobId) await this.jobs.completedIn(trx, jobId, response);
      return { response, notes };
    });
    // Committed: the assignees' e-mails about flipped verdicts go now.
    if (notes) this.flags.deliverRevisionNotes(notes);
    return response;
  }

  /**
   * The latest revision's results under `row`: engine over every member
   * (the import's member-analysis), old results out, new ones in (the
   * import's COPY writer), members' verdicts and the revision's copy of the set
   * and counts updated. Null when the project has no revision. `flips` lists
   * every member whose verdict changed (the summary keeps the first 50).
   */
  private async recompute(trx: Trx, projectId: number, row: LimitSetRow, onProgress: Progress): Promise<{ summary: RecomputeSummary; flips: VerdictFlip[] } | null> {
    const latest = await this.repo.latestRevision(projectId, trx);
    if (!latest) return null;
    onProgress(0.05, 'Reading the members');
    const stored = await this.revisions.membersOf(latest.id, trx);
    const set = toLimitSet(row);
    const total = stored.length;
    onProgress(0.1, 'Checking members');
    const outcome = analyzeMembers(
      stored.map((s) => s.member),
      set,
      { onProgress: (done) => onProgress(0.1 + (0.4 * done) / Math.max(1, total), 'Checking members') },
    );
    if (outcome.problems.length) {
      const n = outcome.problems.length;
      throw new ApiError(
        'VALIDATION_FAILED',
        `"${set.name}" cannot check ${n === 1 ? 'one member' : `${n} members`} of revision ${latest.number}, so nothing was changed: ${outcome.problems[0].message.replace(/ Correct the member's spans, supports or loads\.$/, '')} Give the set the categories these members use (or a new revision that changes the members), then try again.`,
        outcome.problems.slice(0, 100).map((p) => ({ path: `members.${p.mark}`, row: p.row, message: p.message.replace(/ Correct the member's spans, supports or loads\.$/, '') })),
      );
    }
    const ids = await this.repo.memberIds(trx, latest.id);
    const memberIds = stored.map((s) => ids.get(s.member.mark.toLowerCase()) as number);

    onProgress(0.5, 'Writing results');
    await this.repo.deleteResults(trx, latest.id);
    const resultRows = outcome.analyses.reduce((n, a) => n + a.results.length, 0);
    let written = 0;
    await this.repo.writeResults(trx, latest.id, memberIds, outcome.analyses, (rows) => {
      written += rows;
      onProgress(0.5 + (0.4 * written) / Math.max(1, resultRows), 'Writing results');
    });
    onProgress(0.92, 'Updating verdicts');
    await this.repo.updateMemberSummaries(
      trx,
      outcome.analyses.map((a, k) => ({ id: memberIds[k], governingCheck: a.governingCheck, maxUtilization: a.maxUtilization, verdict: a.verdict, requiredI: a.requiredI })),
    );
    await this.repo.updateRevisionResults(trx, latest.id, row.id, set, outcome.pass, outcome.fail);

    const flips: VerdictFlip[] = [];
    stored.forEach((s, k) => {
      const a = outcome.analyses[k];
      if (s.verdict === a.verdict) return;
      flips.push({ mark: s.member.mark, level: s.member.level, verdictBefore: s.verdict, verdictAfter: a.verdict, governingCheck: a.governingCheck, utilization: a.maxUtilization });
    });
    const summary: RecomputeSummary = {
      revisionId: latest.id,
      revisionNumber: latest.number,
      memberCount: total,
      before: { pass: latest.pass_count, fail: latest.fail_count },
      after: { pass: outcome.pass, fail: outcome.fail, unchecked: outcome.unchecked },
      flipped: flips.slice(0, 50).map((f) => ({ mark: f.mark, level: f.level, from: f.verdictBefore, to: f.verdictAfter })),
      flippedCount: flips.length,
      signOffsVoided: [],
      flagsNoted: 0,
    };
    return { summary, flips };
  }

  private async actorName(actorId: number | null): Promise<string> {
    return (await this.repo.userName(actorId)) ?? 'Someone';
  }
}

function stale(current: LimitSetRow): ApiError {
  return new ApiError(
    'STALE_WRITE',
    `Limit set "${current.name}" was changed by someone else since you opened it (it is now at version ${current.version}). Reload it, then make your change again.`,
  );
}

const fmt = (v: unknown): string => (v === null || v === undefined ? 'none' : typeof v === 'object' ? JSON.stringify(v) : String(v));

/** One readable line of what an edit changed, rule by rule (for the activity feed). */
export function describeRuleChanges(before: readonly LimitRule[], after: readonly LimitRule[]): string {
  const old = new Map(before.map((r) => [r.id, r]));
  const now = new Map(after.map((r) => [r.id, r]));
  const parts: string[] = [];
  for (const r of after) {
    const o = old.get(r.id);
    if (!o) {
      parts.push(`added "${r.check}" (${r.category}, L/${r.ratio})`);
      continue;
    }
    const fields: string[] = [];
    if (o.check !== r.check) fields.push(`name "${o.check}" → "${r.check}"`);
    if (o.category !== r.category) fields.push(`category ${o.category} → ${r.category}`);
    if (o.ratio !== r.ratio) fields.push(`ratio L/${o.ratio} → L/${r.ratio}`);
    if (o.maxAbs !== r.maxAbs) fields.push(`cap ${fmt(o.maxAbs)} → ${fmt(r.maxAbs)} m`);
    if (o.plus !== r.plus) fields.push(`allowance ${fmt(o.plus)} → ${fmt(r.plus)} m`);
    if (JSON.stringify(o.combination) !== JSON.stringify(r.combination)) fields.push(`combination ${fmt(o.combination)} → ${fmt(r.combination)}`);
    if (JSON.stringify(o.materials) !== JSON.stringify(r.materials)) fields.push('materials');
    if (JSON.stringify(o.source) !== JSON.stringify(r.source)) fields.push('source');
    if (fields.length) parts.push(`"${r.check}" (${r.category}): ${fields.join(', ')}`);
  }
  for (const r of before) if (!now.has(r.id)) parts.push(`removed "${r.check}" (${r.category})`);
  if (parts.length === 0) return 'no rule changed';
  return parts.length > 4 ? `${parts.slice(0, 4).join('; ')}; and ${parts.length - 4} more changes` : parts.join('; ');
}
