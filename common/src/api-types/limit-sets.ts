import type { LimitRuleView, ProjectLimitSet } from './imports';

/**
 * The Limit sets screen (product.md, "Limit sets"): the presets that ship with
 * their sources, the project's own editable copies, and which one the
 * project's verdicts follow.
 *
 * GET  /api/projects/:projectId/limit-sets                    -> 200 LimitSetsOverview (any member)
 * POST /api/projects/:projectId/limit-sets    CopyLimitSetRequest -> 201 ProjectLimitSetView (manager, admin)
 * PUT  /api/projects/:projectId/limit-sets/:setId  UpdateLimitSetRequest
 *        -> 200 LimitSetChangeResponse, or 202 LimitSetJobAccepted when the set is the
 *           project's active one and its latest revision is above the job threshold
 * POST /api/projects/:projectId/limit-sets/:setId/use  UseLimitSetRequest
 *        -> 200 LimitSetChangeResponse | 202 LimitSetJobAccepted (manager, admin)
 * GET  /api/projects/:projectId/limit-sets/jobs/:jobId         -> 200 LimitSetJobStatus (any member)
 *
 * Lengths (maxAbs, plus, lengthRange) are metres, as in common/src/limits;
 * screens convert with common/src/units. Editing or choosing the ACTIVE set
 * recomputes the results of the project's latest revision, together with the
 * change, in one transaction (all or nothing), and records an activity entry.
 * Validation failures answer 400 VALIDATION_FAILED with one detail per
 * problem, `path` like `body.rules[2].ratio`; nothing is written.
 * A stale `version` answers 409 STALE_WRITE with the set as stored now.
 */

/** Longest texts of a limit set and its rules (the DTO and the form read these). */
export const LIMIT_SET_LIMITS = {
  nameMax: 120,
  descriptionMax: 2000,
  rulesMax: 400,
  checkMax: 120,
  sourceFieldMax: 300,
  noteMax: 2000,
} as const;

/** A shipped preset (common/src/limits), read-only; copied into a project to be edited. */
export interface LimitPresetView {
  /** e.g. "ibc-2021". */
  id: string;
  name: string;
  description: string;
  categories: { id: string; label: string; description: string }[];
  rules: LimitSetRuleView[];
  notes: { text: string; sourceText: string }[];
}

/** A rule as shown by the Limit sets screen: the common view plus what an edit must send back. */
export interface LimitSetRuleView extends LimitRuleView {
  /** Cases whose factor is the long-term multiplier λΔ (ACI 318-19 §24.2.4.1.1), or null. */
  longTermCases: string[] | null;
}

/** A project's own set: editable by managers and admins. */
export interface ProjectLimitSetView extends Omit<ProjectLimitSet, 'rules'> {
  rules: LimitSetRuleView[];
  /** Counts edits; send it back with an edit (a stale one answers 409). */
  version: number;
  /** The set the project's verdicts follow. */
  active: boolean;
  createdAt: string;
}

/** Which set produced the verdicts of the latest revision, and whether that is still the active set as it stands. */
export interface LimitSetResultsState {
  revisionId: number;
  revisionNumber: number;
  memberCount: number;
  passCount: number;
  failCount: number;
  /** The project set the revision's results were computed with (null if that set was removed). */
  limitSetId: number | null;
  limitSetName: string;
  /** True when the results follow the active set's current rules. */
  upToDate: boolean;
}

export interface LimitSetsOverview {
  /** The project's active set id. */
  activeId: number;
  presets: LimitPresetView[];
  /** The project's sets, active first, then newest first. */
  projectSets: ProjectLimitSetView[];
  /** Null when the project has no revision yet (nothing to recompute). */
  results: LimitSetResultsState | null;
  /** A recompute queued or running, if any (the screen shows its progress). */
  openJob: LimitSetJobStatus | null;
  /** Whether the caller may copy, edit and choose (managers and admins). */
  canEdit: boolean;
  /** The caution every verdict carries. */
  caution: string;
}

/** Copy a preset, or one of the project's sets, into the project as a new editable set (not yet active). */
export interface CopyLimitSetRequest {
  /** A preset id (e.g. "ibc-2021"). Exactly one of fromPreset and fromSetId. */
  fromPreset?: string;
  /** One of the project's sets. */
  fromSetId?: number;
  /** The copy's name; default "<name> (project copy)". */
  name?: string;
}

/** One rule as an edit sends it (lengths in m). */
export interface LimitSetRuleInput {
  /** Kept from the copied rule; left out for a new rule (the server gives one). */
  id?: string;
  category: string;
  check: string;
  combination: Record<string, number>;
  ratio: number;
  maxAbs: number | null;
  plus?: number | null;
  materials?: string[] | null;
  lengthRange?: { min?: number; max?: number } | null;
  longTermCases?: string[] | null;
  source: { document: string; edition: string; clause: string; trust: string; note?: string };
}

export interface UpdateLimitSetRequest {
  /** The version the edit was made on. */
  version: number;
  name: string;
  description?: string;
  /** The member categories, in display order; left out: the set's own plus any new category a rule uses. */
  categories?: string[];
  rules: LimitSetRuleInput[];
}

export interface UseLimitSetRequest {
  /** Optional: the version the person looked at (a stale one answers 409). */
  version?: number;
}

/** What a recompute changed in the latest revision. */
export interface RecomputeSummary {
  revisionId: number;
  revisionNumber: number;
  memberCount: number;
  before: { pass: number; fail: number };
  after: { pass: number; fail: number; unchecked: number };
  /** Members whose verdict changed (pass → fail or fail → pass), at most 50 listed. */
  flipped: { mark: string; level: string; from: 'pass' | 'fail' | null; to: 'pass' | 'fail' | null }[];
  flippedCount: number;
  /** Levels whose sign-off a flipped verdict voided, by name. */
  signOffsVoided: string[];
  /** Flags on flipped members that got an automatic note (their assignees an e-mail). */
  flagsNoted: number;
}

/** 200: the change is stored; `recompute` is null when nothing needed recomputing (an inactive set, or no revision). */
export interface LimitSetChangeResponse {
  set: ProjectLimitSetView;
  recompute: RecomputeSummary | null;
}

/** 202: the change and the recompute run as one background job; poll its status. */
export interface LimitSetJobAccepted {
  jobId: string;
}

export type LimitSetJobState = 'queued' | 'running' | 'completed' | 'failed';

export interface LimitSetJobStatus {
  jobId: string;
  kind: 'use' | 'edit';
  limitSetId: number;
  state: LimitSetJobState;
  /** 0..1 */
  progress: number;
  step: string | null;
  attempts: number;
  result?: LimitSetChangeResponse;
  error?: { statusCode: number; code: string; message: string; details?: { path?: string; message: string }[] };
  createdAt: string;
  updatedAt: string;
}
