/**
 * The Overview (journey 3): where the project stands per level and per
 * reviewer, flags over time, reviewer assignment and level sign-offs.
 *
 * GET  /api/projects/:projectId/overview                         any member          -> 200 ProjectOverview
 * GET  /api/projects/:projectId/overview/flags-over-time?days=N  any member          -> 200 FlagsOverTime
 * GET  /api/projects/:projectId/reviewer-assignments             any member          -> 200 ReviewerAssignments
 * PUT  /api/projects/:projectId/reviewer-assignments/levels/:levelId  AssignLevelReviewerRequest   manager -> 200 ReviewerAssignments
 * PUT  /api/projects/:projectId/reviewer-assignments/members     AssignMemberReviewersRequest      manager -> 200 AssignMemberReviewersResponse
 * POST /api/projects/:projectId/levels/:levelId/sign-off         SignOffLevelRequest  checker -> 201 LevelSignOff
 * POST /api/projects/:projectId/levels/:levelId/sign-off/withdraw WithdrawSignOffRequest checker -> 200 LevelSignOff
 * Admins count as managers (never as checkers). Viewers read only; a caller
 * not on the project gets 404.
 *
 * Counts are computed in SQL over the LATEST revision's members. A flag is
 * counted on the level and reviewer of its member in the latest revision;
 * flags whose mark left the schedule form their own row (`present: false`).
 * "Overdue": open or answered and past its due date (UTC). "Percent closed":
 * closed and waived flags (nothing left to do) over all flags, null without
 * flags.
 *
 * Reviewers: a manager's assignment of a mark beats the assignment of its
 * level, which beats the schedule's Reviewer column (api/src/overview/README.md).
 *
 * Sign-off: only a checker, only when no flag on the level is open or
 * answered (409 CONFLICT otherwise, naming them), only once until voided. A
 * later revision that adds, removes or changes a member on the level voids it
 * and says which revision did it.
 */
import type { FlagPerson } from './flags';

export interface OverviewCounts {
  members: number;
  pass: number;
  fail: number;
  /** Members no check applies to. */
  unchecked: number;
  flagsOpen: number;
  flagsAnswered: number;
  flagsClosed: number;
  flagsWaived: number;
  flagsTotal: number;
  /** (closed + waived) / total × 100, rounded to one decimal; null without flags. */
  percentClosed: number | null;
  overdue: number;
}

export type SignOffState = 'signed' | 'voided';

export interface LevelSignOff {
  id: number;
  level: { id: number; name: string };
  state: SignOffState;
  signedBy: FlagPerson | null;
  signedAt: string;
  /** The revision that was latest when it was signed. */
  revisionNumber: number;
  comment: string | null;
  voidedAt: string | null;
  /** The revision whose changes voided it (null: withdrawn by a checker, or not voided). */
  voidedInRevisionNumber: number | null;
  voidedBy: FlagPerson | null;
  /** Why it no longer holds, e.g. "Revision 3 changed members on L2: B4 (changed), B9 (added)". */
  voidReason: string | null;
}

export interface OverviewLevelRow extends OverviewCounts {
  /**
   * The project's level; id null for a level name the schedule used that is no
   * longer one of the project's levels; null for flags whose mark is not in the
   * latest revision.
   */
  level: { id: number | null; name: string } | null;
  /** The reviewer a manager assigned to the level, if any. */
  assignedReviewer: FlagPerson | null;
  /** The newest sign-off of the level, live or voided; null when never signed off. */
  signOff: LevelSignOff | null;
}

export interface OverviewReviewerRow extends OverviewCounts {
  /** null: members without a reviewer on the team (`present` true), or flags whose mark left the schedule (`present` false). */
  reviewer: (FlagPerson & { email: string }) | null;
  present: boolean;
}

export interface OverviewRevision {
  id: number;
  number: number;
  label: string | null;
  createdAt: string;
  uploadedBy: FlagPerson | null;
  fileName: string;
  memberCount: number;
  /** Against the revision before (null for revision 1). */
  diff: { againstNumber: number; added: number; removed: number; changed: number; flips: number } | null;
}

export interface ProjectOverview {
  project: { id: number; name: string; number: string };
  latestRevision: OverviewRevision | null;
  totals: OverviewCounts;
  /** Bottom level first; levels without members are listed too; then levels no longer in the project; then flags of marks that left. */
  levels: OverviewLevelRow[];
  /** By reviewer name; members without a reviewer, then flags of marks that left, last. */
  reviewers: OverviewReviewerRow[];
  /** "YYYY-MM-DD" in UTC: the day "overdue" was decided against. */
  today: string;
}

export const OVERVIEW_LIMITS = {
  /** Default and largest number of days of the flags-over-time series. */
  daysDefault: 90,
  daysMax: 730,
  signOffCommentMax: 2000,
  marksMax: 2000,
} as const;

/** One day (UTC) of the flags-over-time series: how many flags were in each status at the end of it. */
export interface FlagsOverTimePoint {
  day: string;
  open: number;
  answered: number;
  closed: number;
  waived: number;
  /** Flags raised that day. */
  raised: number;
}

export interface FlagsOverTime {
  /** First and last day of the series (the last is today, UTC). */
  from: string;
  to: string;
  points: FlagsOverTimePoint[];
}

export interface LevelAssignment {
  level: { id: number; name: string };
  reviewer: FlagPerson | null;
}

export interface MemberAssignment {
  mark: string;
  reviewer: FlagPerson;
}

export interface ReviewerAssignments {
  /** Every level of the project, bottom first, with its assigned reviewer or null. */
  levels: LevelAssignment[];
  /** Members given their own reviewer, in mark order. */
  members: MemberAssignment[];
  /** Who may be assigned: the project's checkers. */
  candidates: (FlagPerson & { email: string })[];
}

export interface AssignLevelReviewerRequest {
  /** A checker of the project; null removes the level's assignment (the schedule's column applies again). */
  reviewerId: number | null;
}

export interface AssignMemberReviewersRequest {
  /** Marks of the latest revision (ignoring case). */
  marks: string[];
  /** A checker of the project; null removes these members' own assignments (their level's or the schedule's reviewer applies again). */
  reviewerId: number | null;
}

export interface AssignMemberReviewersResponse {
  marks: string[];
  reviewer: FlagPerson | null;
}

export interface SignOffLevelRequest {
  comment?: string;
}

export interface WithdrawSignOffRequest {
  /** Why (required). */
  reason: string;
}
