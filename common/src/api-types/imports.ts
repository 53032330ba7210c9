import type { UnitSystem } from './constraints';

/**
 * Imports (journey 1: the engineer uploads a member schedule as a new
 * revision), revisions and the project's limit set.
 *
 * Upload and commit need the role engineer or manager (admins count as
 * managers); every read is open to any member of the project, viewers included.
 * Unsafe methods need the CSRF header (see auth.ts).
 *
 * GET  /api/projects/:projectId/imports/template   -> 200 xlsx: the blank member schedule template in the project's unit system
 * GET  /api/projects/:projectId/imports/example    -> 200 xlsx: the same template with a few example members filled in
 * POST /api/projects/:projectId/imports            multipart/form-data, field `file` (.xlsx or .csv, at most IMPORT_LIMITS.maxFileBytes)
 *        -> 201 ImportPreview (a draft waiting for commit; nothing is a revision yet)
 *        -> 400 IMPORT_FILE_INVALID (not a spreadsheet, damaged, a zip bomb, no file attached)
 *        -> 413 PAYLOAD_TOO_LARGE (over the size cap)
 *        -> 422 IMPORT_ROWS_INVALID, `details`: ImportProblemDetail[] (any fatal problem; NOTHING is stored)
 * POST /api/projects/:projectId/imports/:draftId/commit  CommitImportRequest
 *        -> 201 CommitImportResponse (small drafts: committed in the request)
 *        -> 202 ImportJobAccepted (drafts above IMPORT_LIMITS.jobThresholdMembers: a background job)
 *        -> 404 NOT_FOUND (no such draft: already committed, expired, or another project's)
 *        -> 409 CONFLICT (the project's limit set changed since the preview: upload again)
 * DELETE /api/projects/:projectId/imports/:draftId   -> 204 (discard a draft)
 * GET  /api/projects/:projectId/imports/jobs/:jobId -> 200 ImportJobStatus (poll about once a second for a progress bar)
 * GET  /api/projects/:projectId/revisions           -> 200 RevisionSummary[] (newest first)
 * GET  /api/projects/:projectId/revisions/:revisionId        -> 200 RevisionDetail
 * GET  /api/projects/:projectId/revisions/:revisionId/file   -> 200 the original uploaded file, byte for byte (Content-Disposition: attachment; filename=…)
 * GET  /api/projects/:projectId/revisions/:revisionId/results.xlsx -> 200 the results workbook
 * GET  /api/projects/:projectId/limit-set           -> 200 ProjectLimitSet
 *
 * Numbers in these types are SI base units (m, N, N/m, N·m, Pa, m^4) unless a
 * field says otherwise; screens convert with common/src/units. Field changes
 * of the diff also carry `beforeText` / `afterText`, already formatted in the
 * project's unit system.
 */

/** Caps of an upload. The server may be configured lower or higher; these are its defaults. */
export const IMPORT_LIMITS = {
  /** Largest file accepted, bytes (20 MiB). */
  maxFileBytes: 20 * 1024 * 1024,
  /** Member rows on the Members sheet (the Loads sheet may have four times as many). */
  maxRows: 20_000,
  /** Drafts with more members than this commit as a background job (202 + polling). */
  jobThresholdMembers: 2_000,
  /** Hours a draft waits for its commit before it is discarded. */
  draftHours: 24,
  /** Longest revision label, characters. */
  labelMax: 120,
} as const;

/** File types an upload may be, decided from the file's content (not its name). */
export const IMPORT_FILE_TYPES = ['xlsx', 'csv'] as const;
export type ImportFileType = (typeof IMPORT_FILE_TYPES)[number];

export type Verdict = 'pass' | 'fail';

/**
 * One problem of an upload: where it is (sheet, spreadsheet row with the
 * header as row 1, column as "Spans [m] (column G)"), the cell as read, and
 * what is wrong and how to fix it. `severity: 'error'` is fatal.
 * `code` is a schedule problem code (common/src/schedule ProblemCode) or one
 * of the file-level codes of the api (MERGED_CELLS, NO_MEMBERS_SHEET,
 * REVIEWER_NOT_ON_TEAM, ENGINE_REJECTED, …).
 */
export interface ImportProblem {
  severity: 'error' | 'warning';
  code: string;
  sheet: string;
  row: number;
  /** Header text and column letter, e.g. "Spans [m] (column G)"; null for a whole row or sheet. */
  column: string | null;
  /** The member's mark when known. */
  mark?: string;
  /** The cell as read (formulas as "=…", dates as ISO text). */
  value: string | number | boolean | null;
  message: string;
}

/**
 * An element of `details` of a 422 IMPORT_ROWS_INVALID answer: an
 * ImportProblem in the shape of ApiErrorDetail (sheet, row, column, value,
 * message), with its severity and code. Warnings are listed after the errors.
 */
export interface ImportProblemDetail {
  severity: 'error' | 'warning';
  code: string;
  sheet: string;
  row: number;
  /** As in ImportProblem; absent for a whole row or sheet. */
  column?: string;
  mark?: string;
  value: string | number | boolean | null;
  message: string;
}

/** A member as the diff names it. */
export interface ImportMemberRef {
  mark: string;
  level: string;
  category: string;
  /** The verdict in its own revision (new verdict for added, old for removed); null when no check applies. */
  verdict: Verdict | null;
  /** Largest utilisation of its checks (1 = at the limit), null when no check applies. */
  maxUtilization: number | null;
}

/** One field of a member that differs from the previous revision. */
export interface ImportFieldChange {
  /** A member field (level, spans, E, I, …) or "loads.<case>" for the loads of one load case. */
  field: string;
  /** What a person reads: "Spans", "I", "Loads L". */
  label: string;
  /** SI values (loads in the engine's shape). */
  before: unknown;
  after: unknown;
  /** Formatted in the project's unit system, e.g. "7.2 m", "186 ×10⁶ mm⁴"; loads as a short list. */
  beforeText: string;
  afterText: string;
}

export interface ImportChangedMember extends ImportMemberRef {
  /** Verdict in the previous revision. */
  verdictBefore: Verdict | null;
  changes: ImportFieldChange[];
}

/** A member whose verdict turned (present in both revisions). */
export interface ImportVerdictFlip {
  mark: string;
  level: string;
  from: Verdict;
  to: Verdict;
  /** The check that governs in the new revision, e.g. "L/360 live". */
  governingCheck: string | null;
  maxUtilization: number | null;
}

export interface ImportDiff {
  /** The revision compared against: the latest committed one, or null for the first upload. */
  against: { id: number; number: number; label: string | null } | null;
  added: ImportMemberRef[];
  removed: ImportMemberRef[];
  changed: ImportChangedMember[];
  /** Pass → fail and fail → pass, among the members of both revisions. */
  flips: ImportVerdictFlip[];
  unchanged: number;
}

/** 201 answer of an upload: a validated draft and what committing it would change. */
export interface ImportPreview {
  draftId: string;
  fileName: string;
  fileType: ImportFileType;
  /** Bytes of the uploaded file. */
  fileSize: number;
  unitSystem: UnitSystem;
  memberCount: number;
  loadRowCount: number;
  /** Warnings only (an upload with an error is refused with 422). */
  problems: ImportProblem[];
  /** Always false in a 201: fatal uploads are answered 422 and stored nowhere. */
  fatal: boolean;
  diff: ImportDiff;
  /** Verdicts of the new members (members without any check count in neither). */
  summary: { pass: number; fail: number; unchecked: number };
  /** The limit set the verdicts come from. */
  limitSet: { id: number; name: string };
  createdAt: string;
  /** The draft is discarded after this (ISO time). */
  expiresAt: string;
}

export interface CommitImportRequest {
  /** e.g. "Rev C, issued for permit"; at most IMPORT_LIMITS.labelMax characters. */
  label?: string;
}

export type RevisionStatus = 'committed';

export interface RevisionSummary {
  id: number;
  /** 1, 2, 3 … per project, in commit order. */
  number: number;
  label: string | null;
  uploadedBy: { id: number; name: string } | null;
  createdAt: string;
  fileName: string;
  fileType: ImportFileType;
  fileSize: number;
  memberCount: number;
  passCount: number;
  failCount: number;
  status: RevisionStatus;
}

/** Counts of the revision's diff to the one before it (the member lists live in `diff`). */
export interface RevisionDiffSummary {
  against: { id: number; number: number } | null;
  added: number;
  removed: number;
  changed: number;
  flips: number;
}

export interface RevisionDetail extends RevisionSummary {
  /** The parse report kept with the revision: its warnings (a committed revision has no errors). */
  parseReport: { problems: ImportProblem[]; memberRows: number; loadRows: number };
  diff: RevisionDiffSummary & { flipped: ImportVerdictFlip[] };
  limitSet: { id: number; name: string };
}

export interface CommitImportResponse {
  revision: RevisionSummary;
}

/** 202 answer: the work goes on in the background; poll ImportJobStatus. */
export interface ImportJobAccepted {
  jobId: string;
}

export type ImportJobState = 'queued' | 'running' | 'completed' | 'failed';

export interface ImportJobStatus {
  jobId: string;
  kind: 'commit';
  state: ImportJobState;
  /** 0..1, for a progress bar. */
  progress: number;
  /** What the work is doing now, for a person ("Writing results"). */
  step: string | null;
  /** Attempts so far (a job cut short by a crash starts again from scratch). */
  attempts: number;
  /** When state is 'completed'. */
  result?: CommitImportResponse;
  /** When state is 'failed': the error as the synchronous route would have answered it. */
  error?: { statusCode: number; code: string; message: string };
  createdAt: string;
  updatedAt: string;
}

/** A limit rule as the api shows it (SI: maxAbs and plus in m). */
export interface LimitRuleView {
  id: string;
  category: string;
  check: string;
  /** Factors per load case, e.g. { D: 0.5, L: 1 }. */
  combination: Record<string, number>;
  /** Its stable name, e.g. "0.5D+L". */
  combinationName: string;
  ratio: number;
  maxAbs: number | null;
  plus: number | null;
  materials: string[] | null;
  lengthRange: { min?: number; max?: number } | null;
  source: { document: string; edition: string; clause: string; trust: string; note?: string };
  /** One line: "IBC 2021, Table 1604.3, … (from memory)". */
  sourceText: string;
}

export interface ProjectLimitSet {
  id: number;
  name: string;
  description: string;
  /** The preset it was copied from (common/src/limits), or null for a set of the project's own. */
  sourcePresetId: string | null;
  categories: { id: string; label: string; description: string }[];
  rules: LimitRuleView[];
  notes: { text: string; sourceText: string }[];
  /** The caution every verdict carries. */
  caution: string;
  updatedAt: string;
}
