/**
 * The project's activity feed (who did what, when) and what reaches people
 * by e-mail beyond single notices: the daily digest and its preference.
 *
 * GET   /api/projects/:projectId/activity?ActivityQuery   any member -> 200 Page<ActivityEntry>
 * GET   /api/projects/:projectId/activity/people          any member -> 200 ActivityPerson[]
 *       (everyone who appears as the actor of an entry, by name: the person filter)
 * GET   /api/me/preferences                               signed in  -> 200 Preferences
 * PATCH /api/me/preferences  UpdatePreferencesRequest      signed in  -> 200 Preferences
 * POST  /api/digests/send    SendDigestRequest            admin      -> 200 DigestRunReport
 *       (the daily digest on demand, for development and tests; the
 *       scheduled job does the same every day at DIGEST_CRON)
 * GET   /api/projects/:projectId/flags.xlsx                any member -> the flags workbook
 *
 * Writing entries (api): `ActivityService.record(trx, { projectId, actorId,
 * action, summary, data })` inside the transaction of the change. `action`
 * is `<kind prefix>.<verb>` (ACTIVITY_ACTIONS lists the known ones); the
 * prefix decides the entry's kind, so the Activity screen's kind filter
 * finds it. `summary` is one readable sentence naming the actor
 * ("Ilse Varga signed off L3"). `data` keys the screen turns into links
 * (ActivityEntry.refs): flagId, flagIds, mark, marks, revisionId,
 * revisionNumber (or number, for imports), levelId, levelName, userId,
 * limitSetId, limitSetName.
 */
import type { Page } from './projects';

/** The kinds of the feed's filter, each with the action prefixes it covers. */
export const ACTIVITY_KINDS = ['imports', 'flags', 'assignments', 'sign-offs', 'limit-sets', 'team', 'project'] as const;
export type ActivityKind = (typeof ACTIVITY_KINDS)[number];

export const ACTIVITY_KIND_LABELS: Record<ActivityKind, string> = {
  imports: 'Imports',
  flags: 'Flags',
  assignments: 'Reviewer assignments',
  'sign-offs': 'Sign-offs',
  'limit-sets': 'Limit sets',
  team: 'Team',
  project: 'Project settings',
};

/** An action `<prefix>.<verb>` belongs to the kind of its prefix. */
export const ACTIVITY_KIND_PREFIXES: Record<ActivityKind, string> = {
  imports: 'import',
  flags: 'flag',
  assignments: 'reviewer',
  'sign-offs': 'sign_off',
  'limit-sets': 'limit_set',
  team: 'team',
  project: 'project',
};

/**
 * Every action written today. Add new ones here (with the right prefix) so
 * the screen can label them; an unknown action still shows with its summary.
 */
export const ACTIVITY_ACTIONS = [
  'import.committed',
  'flag.raised',
  'flag.bulk_raised',
  'flag.updated',
  'flag.bulk_assigned',
  'flag.answered',
  'flag.closed',
  'flag.reopened',
  'flag.waived',
  'flag.commented',
  'flag.revision_noted',
  /** A reviewer given to (or taken from) a level or to members; data: levelId/levelName or marks, userId. */
  'reviewer.assigned',
  'reviewer.unassigned',
  /** A checker signed off a level (data: levelId, levelName). */
  'sign_off.signed',
  /** A later revision changed a member on a signed-off level (actor null; data: levelId, levelName, revisionId, revisionNumber, marks, signOffId), or a limit-set change flipped a verdict on it (actor: the manager who made it; data adds limitSetId, limitSetName). */
  'sign_off.voided',
  /** The sign-off was taken back by hand. */
  'sign_off.withdrawn',
  /** A preset copied into the project (data: limitSetId, limitSetName). */
  'limit_set.copied',
  /** Rules of the project's limit set edited. */
  'limit_set.edited',
  /** The project's limit set changed, results recomputed (data: limitSetId, limitSetName, revisionId). */
  'limit_set.applied',
  /** A set the project did not use deleted (data: limitSetId, limitSetName, version). */
  'limit_set.deleted',
  'team.added',
  'team.invited',
  'team.role_changed',
  'team.removed',
  'project.created',
  'project.updated',
] as const;
export type ActivityAction = (typeof ACTIVITY_ACTIONS)[number];

/** The kind of an action, or null for an action outside every kind. */
export function activityKindOf(action: string): ActivityKind | null {
  const prefix = action.split('.')[0];
  return ACTIVITY_KINDS.find((k) => ACTIVITY_KIND_PREFIXES[k] === prefix) ?? null;
}

export const ACTIVITY_LIMITS = {
  pageSizeMax: 100,
  pageSizeDefault: 25,
  qMax: 200,
} as const;

/** Filters of the feed; all optional, combined with AND. Dates are UTC calendar days, both ends included. */
export interface ActivityQuery {
  /** One kind or several, comma-separated in the query string. */
  kind?: ActivityKind[];
  /** Entries by this person. */
  actorId?: number;
  /** "YYYY-MM-DD" */
  from?: string;
  to?: string;
  /** Words found in the entry's sentence (case ignored). */
  q?: string;
  page?: number;
  pageSize?: number;
}

export interface ActivityPerson {
  id: number;
  name: string;
}

/** What an entry is about, for links (only what the entry's data names). */
export interface ActivityRefs {
  flagIds?: number[];
  marks?: string[];
  revision?: { id: number; number: number | null };
  level?: { id: number | null; name: string };
  user?: { id: number; name: string | null };
  limitSet?: { id: number | null; name: string | null };
}

export interface ActivityEntry {
  id: number;
  at: string;
  /** Null for automatic entries (a revision note, a voided sign-off). */
  actor: ActivityPerson | null;
  /** e.g. 'project.created', 'team.invited', 'import.committed', 'flag.closed'. */
  action: string;
  kind: ActivityKind | null;
  summary: string;
  refs: ActivityRefs;
}

export type ActivityPage = Page<ActivityEntry>;

/** A person's e-mail preferences. */
export interface Preferences {
  /** The daily e-mail of what waits on you (flags assigned to you, answers to close, overdue flags of projects you manage). */
  digest: boolean;
}

export interface UpdatePreferencesRequest {
  digest: boolean;
}

export interface SendDigestRequest {
  /** The day the digest is for ("YYYY-MM-DD", UTC); default today. One digest per person and day. */
  date?: string;
}

export interface DigestRunReport {
  date: string;
  /** People who got a digest now. */
  queued: number;
  /** People with nothing waiting on them. */
  nothingWaiting: number;
  /** People with the digest turned off. */
  off: number;
  /** People who had this day's digest already. */
  alreadySent: number;
}
