import { combinationName, describeSource, findCategory, VERDICT_CAUTION, type LimitRule, type LimitSet } from '@sagline/common/limits';
import type {
  LimitPresetView,
  LimitSetChangeResponse,
  LimitSetJobStatus,
  LimitSetResultsState,
  LimitSetRuleView,
  ProjectLimitSet as ProjectLimitSetResponse,
  ProjectLimitSetView,
} from '@sagline/common/api-types';
import type { LatestRevisionRow, LimitSetRow } from './limit-sets.repository';
import type { RecomputeJobRow } from './recompute-jobs.repository';

export function toProjectLimitSetResponse(row: LimitSetRow): ProjectLimitSetResponse {
  return {
    id: row.id,
    name: row.name,
    description: row.description,
    sourcePresetId: row.source_preset_id,
    categories: row.categories.map((id) => {
      const c = findCategory(id);
      return { id, label: c?.label ?? id, description: c?.description ?? '' };
    }),
    rules: row.rules.map((r) => ({
      id: r.id,
      category: r.category,
      check: r.check,
      combination: r.combination,
      combinationName: combinationName(r.combination),
      ratio: r.ratio,
      maxAbs: r.maxAbs,
      plus: r.plus,
      materials: r.materials,
      lengthRange: r.lengthRange,
      source: r.source,
      sourceText: describeSource(r.source),
    })),
    notes: row.notes.map((n) => ({ text: n.text, sourceText: describeSource(n.source) })),
    caution: VERDICT_CAUTION,
    updatedAt: row.updated_at.toISOString(),
  };
}

function ruleView(r: LimitRule): LimitSetRuleView {
  return {
    id: r.id,
    category: r.category,
    check: r.check,
    combination: r.combination,
    combinationName: combinationName(r.combination),
    ratio: r.ratio,
    maxAbs: r.maxAbs,
    plus: r.plus,
    materials: r.materials,
    lengthRange: r.lengthRange,
    longTermCases: r.longTermCases ?? null,
    source: r.source,
    sourceText: describeSource(r.source),
  };
}

function categoryViews(ids: readonly string[]): LimitPresetView['categories'] {
  return ids.map((id) => {
    const c = findCategory(id);
    return { id, label: c?.label ?? id, description: c?.description ?? '' };
  });
}

/** A project's own set as the Limit sets screen shows it. */
export function toProjectLimitSetView(row: LimitSetRow, activeId: number | null): ProjectLimitSetView {
  return {
    ...toProjectLimitSetResponse(row),
    rules: row.rules.map(ruleView),
    version: row.version,
    active: row.id === activeId,
    createdAt: row.created_at.toISOString(),
  };
}

/** A shipped preset, read-only. */
export function toPresetView(set: LimitSet): LimitPresetView {
  return {
    id: set.id,
    name: set.name,
    description: set.description,
    categories: categoryViews(set.categories),
    rules: set.rules.map(ruleView),
    notes: set.notes.map((n) => ({ text: n.text, sourceText: describeSource(n.source) })),
  };
}

export function toResultsState(row: LatestRevisionRow): LimitSetResultsState {
  return {
    revisionId: row.id,
    revisionNumber: row.number,
    memberCount: row.member_count,
    passCount: row.pass_count,
    failCount: row.fail_count,
    limitSetId: row.limit_set_id,
    limitSetName: row.limit_set_name,
    upToDate: row.up_to_date,
  };
}

export function toRecomputeJobStatus(row: RecomputeJobRow): LimitSetJobStatus {
  const status: LimitSetJobStatus = {
    jobId: row.id,
    kind: row.kind,
    limitSetId: row.limit_set_id ?? 0,
    state: row.state,
    progress: row.progress,
    step: row.step,
    attempts: row.attempts,
    createdAt: row.created_at.toISOString(),
    updatedAt: row.updated_at.toISOString(),
  };
  if (row.state === 'completed' && row.result) status.result = row.result as LimitSetChangeResponse;
  if (row.error && (row.state === 'failed' || row.state === 'queued')) status.error = row.error;
  return status;
}
