import type { BeamInput, BeamReport } from '../engine';
import type { Flag } from './flags';
import type { ImportFieldChange, LimitRuleView, Verdict } from './imports';
import type { Page } from './projects';

/**
 * Members of a revision (journey 2: the checker filters failing members and
 * opens one). Every route is open to any member of the project (viewers
 * included); anyone else gets 404.
 *
 * GET /api/projects/:projectId/members?…MemberListQuery   -> 200 MembersPage
 * GET /api/projects/:projectId/members/facets?revision=   -> 200 MemberFacets
 * GET /api/projects/:projectId/members/:mark?revision=    -> 200 MemberDetail
 *       (mark URL-encoded, matched ignoring case) | 404 when the revision has no such mark
 *
 * `revision` is `latest` (the default) or a revision id of the project
 * (404 for another project's). A project without any revision answers the
 * list and the facets with `revision: null` and nothing in them.
 *
 * Numbers are SI base units (m, Pa, m^4, N, N/m); screens convert with
 * common/src/units. Filtering, sorting and paging happen in SQL.
 */

/** `sort` of the members list: a field, `-` in front for descending. Ties are broken by mark. Default `mark`. */
export const MEMBER_SORTS = [
  'mark', '-mark', 'level', '-level', 'utilization', '-utilization', 'category', '-category',
  'material', '-material', 'reviewer', '-reviewer', 'verdict', '-verdict',
] as const;
export type MemberSort = (typeof MEMBER_SORTS)[number];

export const MEMBER_LIMITS = {
  pageSizeMax: 500,
  pageSizeDefault: 50,
  /** Longest `q` text. */
  queryMax: 100,
} as const;

/**
 * Query of GET …/members. Lists are comma-separated (`level=3,4`).
 * - level: level ids; category, material: codes (exact);
 * - reviewer: user ids, or `none` (no reviewer on the team);
 * - verdict: `pass`, `fail` or `unchecked` (no check applies);
 * - check: check names, one per parameter (`check=L%2F360%20live&check=…`: names
 *   may hold commas, so they are not split); a member matches when it FAILS one of them;
 * - utilMin / utilMax: bounds (inclusive) on the largest utilisation (1 = at the limit);
 * - q: text the mark or the grid contains, ignoring case.
 * Marks sort naturally (B2 before B10).
 */
export interface MemberListQuery {
  revision?: string;
  level?: string;
  category?: string;
  material?: string;
  reviewer?: string;
  verdict?: string;
  check?: string;
  utilMin?: number;
  utilMax?: number;
  q?: string;
  sort?: MemberSort;
  page?: number;
  pageSize?: number;
}

export interface RevisionRef {
  id: number;
  number: number;
  label: string | null;
  createdAt: string;
}

export interface MemberRow {
  /** The member's row id in this revision (changes with every revision; use the mark to follow a member). */
  id: number;
  mark: string;
  level: { id: number | null; name: string };
  grid: string | null;
  category: string;
  material: string;
  section: string | null;
  /** Supports code of the schedule, e.g. "pinned", "fixed-pinned", "cantilever-left". */
  supports: string;
  /** m, left to right. */
  spans: number[];
  leftOverhang: number;
  rightOverhang: number;
  /** Total length, m. */
  length: number;
  governingCheck: string | null;
  /** Largest utilisation of its checks, null when no check applies. */
  maxUtilization: number | null;
  verdict: Verdict | null;
  /** I (m^4) at which every check would pass; null when no check applies. */
  requiredI: number | null;
  /** m^4 */
  I: number;
  /** The reviewer on the team, or null (reviewerEmail then says who the schedule named). */
  reviewer: { id: number; name: string } | null;
  reviewerEmail: string | null;
  /** Flags of this mark that are open or answered. */
  openFlagCount: number;
}

export interface MembersPage extends Page<MemberRow> {
  /** The revision listed; null when the project has none yet. */
  revision: RevisionRef | null;
}

export interface FacetCount {
  value: string;
  count: number;
  failCount: number;
}

/** GET …/members/facets: what the filters can choose from in one revision, with counts (SQL). */
export interface MemberFacets {
  revision: RevisionRef | null;
  total: number;
  verdicts: { pass: number; fail: number; unchecked: number };
  /** Bottom level first; id null for a level since removed from the project. */
  levels: { id: number | null; name: string; count: number; failCount: number }[];
  categories: FacetCount[];
  materials: FacetCount[];
  /** id null: members whose reviewer is not on the team (or none given). */
  reviewers: { id: number | null; name: string | null; count: number; failCount: number }[];
  /** Every check name of the revision's limit set for the categories it has, with the members failing it. */
  checks: { name: string; failCount: number }[];
}

/** A load as stored, in the engine's shape (SI, positive down), with where in the workbook it came from. */
export interface MemberLoadView {
  /** Index into beamInput.loads (contributions refer to it). */
  position: number;
  case: string;
  kind: 'point' | 'udl' | 'linear' | 'moment';
  /** point and moment: x1 = x; udl and linear: x1..x2. */
  x1: number;
  x2: number | null;
  /** point: P (N); moment: M (N·m); udl: w (N/m); linear: w1 (N/m). */
  value1: number;
  /** linear: w2 (N/m). */
  value2: number | null;
  source: { sheet: string; row: number; column: string | null };
}

/** One stored result: member × check × segment (SI; deflection positive up). */
export interface MemberResultView {
  checkName: string;
  combination: string;
  /** The limit rule behind it (MemberDetail.rules). */
  ruleId: string;
  segmentIndex: number;
  segmentKind: 'span' | 'overhang';
  segmentFrom: number;
  segmentTo: number;
  x: number;
  deflection: number;
  effectiveLength: number;
  spanRatio: number | null;
  limitRatio: number;
  maxAbs: number | null;
  plus: number;
  allowed: number;
  governing: 'ratio' | 'maxAbs';
  utilization: number;
  pass: boolean;
  requiredI: number;
}

/** The member in one revision of its history (oldest first). */
export interface MemberHistoryEntry {
  revision: RevisionRef;
  /** False: the mark is not in this revision (removed, or not added yet). */
  present: boolean;
  verdict: Verdict | null;
  maxUtilization: number | null;
  governingCheck: string | null;
  /** Fields that differ from the previous revision that had the member; empty for the first one. */
  changes: ImportFieldChange[];
}

export interface MemberDetail {
  revision: RevisionRef;
  /** The revision's newest one is this one. */
  isLatest: boolean;
  unitSystem: 'SI' | 'US';
  member: MemberRow & {
    E: number;
    depth: number | null;
    camber: number | null;
    notes: string | null;
    /** Members sheet row of the revision's file. */
    sourceRow: number;
  };
  loads: MemberLoadView[];
  /**
   * What the engine got, built as the import builds it: the member's spans,
   * supports and loads, with the combinations and checks of its category and
   * material from the revision's limit set. Run `analyzeBeam` on it for other
   * probes; `report` is that run.
   */
  beamInput: BeamInput;
  /** analyzeBeam(beamInput): curves and contributions per combination, checks. */
  report: BeamReport;
  /** As stored with the revision (identical numbers to report.checks). */
  results: MemberResultView[];
  /** The rules behind the results, with their sources. */
  rules: LimitRuleView[];
  /** The caution every verdict carries. */
  caution: string;
  /** Every flag of this mark (all statuses), newest first. */
  flags: Flag[];
  /** Every revision of the project, oldest first. */
  history: MemberHistoryEntry[];
}
