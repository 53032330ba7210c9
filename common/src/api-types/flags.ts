import type { Page } from './projects';
import type { Verdict } from './imports';

/**
 * Flags (journey 2: a checker raises a member for action; journey 3: the
 * manager chases them). A flag belongs to a member by its MARK, not by the
 * member row of one revision, so it follows the member across revisions; the
 * member facts shown with it (level, verdict, utilisation) are those of the
 * latest revision, `member: null` when the mark is no longer in it.
 *
 * Roles (admins count as managers; anyone not on the project gets 404):
 * GET    /api/projects/:projectId/flags?…FlagListQuery      any member   -> 200 Page<Flag>
 * GET    /api/projects/:projectId/flags/summary             any member   -> 200 FlagSummary
 * GET    /api/projects/:projectId/flags/:flagId             any member   -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags          RaiseFlagRequest        checker -> 201 FlagDetail
 * POST   /api/projects/:projectId/flags/bulk     BulkRaiseFlagsRequest   checker -> 201 BulkRaiseFlagsResponse
 * POST   /api/projects/:projectId/flags/bulk-assign BulkAssignFlagsRequest checker, manager -> 200 BulkAssignFlagsResponse
 * PATCH  /api/projects/:projectId/flags/:flagId  UpdateFlagRequest       checker, manager -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags/:flagId/answer  AnswerFlagRequest the assignee, or any engineer -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags/:flagId/close   CloseFlagRequest  checker -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags/:flagId/reopen  ReopenFlagRequest checker -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags/:flagId/waive   WaiveFlagRequest  checker, manager -> 200 FlagDetail
 * POST   /api/projects/:projectId/flags/:flagId/comments CommentFlagRequest manager, engineer, checker -> 201 FlagDetail
 * Viewers are read-only everywhere (403 on every write).
 *
 * Status machine (anything else is 409 CONFLICT with a message saying why):
 *   raise → open;  answer: open → answered;  close: open | answered → closed;
 *   waive: open | answered → waived (reason required);  reopen: closed | waived → open (comment required).
 * Assignee and due date change (PATCH, bulk-assign) only while open or answered.
 * Comments are allowed in every status.
 *
 * Assignees must hold the ENGINEER role on the project (engineers answer
 * flags, product.md); anyone else is 400 VALIDATION_FAILED on `body.assigneeId`.
 *
 * Optimistic concurrency: every change bumps `version`. PATCH, answer, close,
 * reopen and waive carry the `version` the client last saw; when the flag has
 * moved on, the answer is 409 STALE_WRITE and `details[0]` is a
 * StaleFlagDetail: `{ path: 'body.version', message, value: FlagDetail }`,
 * the current flag with its events, so the screen can show what changed.
 * Comments and bulk routes carry no version (they never overwrite anything).
 *
 * E-mail (plain text with the link `${PUBLIC_URL}/projects/:projectId/flags/:flagId`):
 * to the assignee when a flag is raised for or assigned to them (bulk routes:
 * one e-mail per assignee listing their flags), to the raiser when it is
 * answered, to the assignee when it is closed, reopened or waived. Nobody is
 * e-mailed about their own action.
 */

export const FLAG_STATUSES = ['open', 'answered', 'closed', 'waived'] as const;
export type FlagStatus = (typeof FLAG_STATUSES)[number];

/** Statuses in which a flag still needs someone's action (counted as "open flags" of a member). */
export const FLAG_ACTIVE_STATUSES = ['open', 'answered'] as const satisfies readonly FlagStatus[];

/**
 * Kinds of history entries: `status` (raised, answered, closed, reopened,
 * waived: fromStatus → toStatus, body = the comment, answer or reason),
 * `comment`, `assign`, `due`, and `revision` (automatic, actor null: a new
 * revision changed the member or left it out).
 */
export const FLAG_EVENT_KINDS = ['comment', 'status', 'assign', 'due', 'revision'] as const;
export type FlagEventKind = (typeof FLAG_EVENT_KINDS)[number];

export const FLAG_LIMITS = {
  titleMax: 200,
  /** Comments, answers, waive reasons. */
  bodyMax: 4000,
  markMax: 60,
  checkNameMax: 120,
  /** Marks (or failing members of a filter) one bulk raise may flag. */
  bulkMax: 500,
  /** Flags one bulk-assign may touch. */
  bulkAssignMax: 500,
  pageSizeMax: 200,
  pageSizeDefault: 50,
} as const;

/** `sort` of the flag list: a field, `-` in front for descending. Default `-updated`. */
export const FLAG_SORTS = ['created', '-created', 'updated', '-updated', 'due', '-due', 'mark', '-mark', 'status', '-status'] as const;
export type FlagSort = (typeof FLAG_SORTS)[number];

export interface FlagPerson {
  id: number;
  name: string;
}

/** The member a flag is on, as the latest revision has it (SI). */
export interface FlagMember {
  level: { id: number | null; name: string };
  category: string;
  verdict: Verdict | null;
  governingCheck: string | null;
  maxUtilization: number | null;
  reviewer: FlagPerson | null;
}

export interface Flag {
  id: number;
  projectId: number;
  /** The member's mark, as the revision it was raised in spells it. */
  mark: string;
  /** The check raised (e.g. "L/360 live"); null for the member as a whole. */
  checkName: string | null;
  title: string;
  /** The raiser's description, when given. */
  comment: string | null;
  status: FlagStatus;
  assignee: FlagPerson | null;
  raisedBy: FlagPerson | null;
  /** Calendar date "YYYY-MM-DD", or null. */
  dueDate: string | null;
  /** Open or answered with a due date before today (UTC). */
  overdue: boolean;
  /** Why it was waived (status waived), else null. */
  waiveReason: string | null;
  /** The revision that was latest when the flag was raised. */
  raisedInRevision: { id: number; number: number } | null;
  /** Null when the mark is not in the latest revision. */
  member: FlagMember | null;
  /** Send it back with every change; see STALE_WRITE above. */
  version: number;
  createdAt: string;
  updatedAt: string;
}

export interface FlagEvent {
  id: number;
  kind: FlagEventKind;
  /** Null for automatic entries (revision notes). */
  actor: FlagPerson | null;
  fromStatus: FlagStatus | null;
  toStatus: FlagStatus | null;
  /** Comment, answer, reason, or the text of an automatic note. */
  body: string | null;
  /**
   * assign: { fromAssignee: FlagPerson | null, toAssignee: FlagPerson | null };
   * due: { from: string | null, to: string | null };
   * revision: { revisionId, revisionNumber, verdictBefore, verdictAfter, removed, changedFields: string[] };
   * status (raise): { revisionId } ; otherwise {}.
   */
  data: Record<string, unknown>;
  createdAt: string;
}

export interface FlagDetail extends Flag {
  /** Oldest first. */
  events: FlagEvent[];
}

/** The element of `details` of a 409 STALE_WRITE answer of a flag route. */
export interface StaleFlagDetail {
  path: 'body.version';
  message: string;
  value: FlagDetail;
}

/**
 * Query of GET …/flags. Lists are comma-separated (`status=open,answered`).
 * `assignee`: user ids, `me`, or `none` (unassigned). `level`: level ids (of
 * the member in the latest revision). `mark`: text the mark contains (no case).
 * `overdue=true`: only overdue flags. `check`: exact check names, one per
 * parameter (not split at commas).
 */
export interface FlagListQuery {
  status?: string;
  assignee?: string;
  level?: string;
  mark?: string;
  check?: string;
  overdue?: 'true' | 'false';
  sort?: FlagSort;
  page?: number;
  pageSize?: number;
}

export type FlagPage = Page<Flag>;

export interface FlagCountsByStatus {
  open: number;
  answered: number;
  closed: number;
  waived: number;
}

/** GET …/flags/summary: counts computed in SQL, for the overview and the status board. */
export interface FlagSummary {
  total: number;
  byStatus: FlagCountsByStatus;
  /** Open or answered and past their due date. */
  overdue: number;
  /**
   * By the member's level in the latest revision, bottom level first; level
   * null for marks no longer in it (id null: a level since removed from the project).
   */
  byLevel: ({ level: { id: number | null; name: string } | null } & FlagCountsByStatus)[];
  /** By assignee; assignee null = unassigned. Ordered by name. */
  byAssignee: ({ assignee: FlagPerson | null; overdue: number } & FlagCountsByStatus)[];
}

export interface RaiseFlagRequest {
  /** A mark of the latest revision (matched ignoring case). */
  mark: string;
  /** One of the member's checks in the latest revision; leave out for the member as a whole. */
  checkName?: string | null;
  /** Default: "<mark> fails <check> (utilisation 1.24)" or "<mark> needs a look". */
  title?: string;
  comment?: string;
  /** An engineer of the project. */
  assigneeId?: number | null;
  /** "YYYY-MM-DD". */
  dueDate?: string | null;
}

/**
 * Raise one flag per member: either `marks` (each a mark of the latest
 * revision; an unknown one refuses the whole request) or `filter` (every
 * FAILING member of the latest revision matching it, the same filter as the
 * Members list). Exactly one of the two. Marks with an open or answered flag
 * of the same check (null counts as a check) are skipped and counted.
 */
export interface BulkRaiseFlagsRequest {
  marks?: string[];
  filter?: BulkFlagMemberFilter;
  checkName?: string | null;
  /** Default per member as in RaiseFlagRequest. */
  title?: string;
  comment?: string;
  assigneeId?: number | null;
  dueDate?: string | null;
}

/** The Members list filter (members.ts MemberListQuery) without revision, verdict (always fail), sort and paging. */
export interface BulkFlagMemberFilter {
  /** As in the query: comma-separated text, or a list. */
  level?: string | string[];
  category?: string | string[];
  material?: string | string[];
  reviewer?: string | string[];
  /** One check name, or a list (never split at commas). */
  check?: string | string[];
  utilMin?: number;
  utilMax?: number;
  q?: string;
}

export interface BulkRaiseFlagsResponse {
  created: Flag[];
  /** Marks that already had an open or answered flag of the same check. */
  skipped: number;
  skippedMarks: string[];
}

export interface BulkAssignFlagsRequest {
  flagIds: number[];
  /** An engineer of the project, or null to unassign. */
  assigneeId: number | null;
  /** Also set (or with null clear) the due date; leave out to keep each flag's own. */
  dueDate?: string | null;
}

export interface BulkAssignFlagsResponse {
  updated: Flag[];
  /** Flags closed or waived (not changed), or already so assigned. */
  skipped: number;
  skippedIds: number[];
}

/** PATCH: at least one of assigneeId and dueDate. */
export interface UpdateFlagRequest {
  version: number;
  assigneeId?: number | null;
  dueDate?: string | null;
}

export interface AnswerFlagRequest {
  version: number;
  body: string;
}

export interface CloseFlagRequest {
  version: number;
  body?: string;
}

export interface ReopenFlagRequest {
  version: number;
  body: string;
}

export interface WaiveFlagRequest {
  version: number;
  reason: string;
}

export interface CommentFlagRequest {
  body: string;
}
