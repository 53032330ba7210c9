import { ACTIVITY_KINDS, ACTIVITY_LIMITS, type ActivityKind } from '@sagline/common/api-types';

/**
 * The Activity screen's filters and their address. The URL uses the API's
 * own parameter names (ActivityQuery in common/src/api-types/activity.ts),
 * so a view can be shared and the page sends the same query on to
 * `GET /api/projects/:projectId/activity`.
 */
export interface ActivityView {
  kind: ActivityKind[];
  actorId: number | null;
  /** "YYYY-MM-DD" or "" */
  from: string;
  to: string;
  q: string;
  page: number;
  pageSize: number;
}

export const ACTIVITY_PAGE_SIZES = [25, 50, 100] as const;

export const DEFAULT_ACTIVITY_VIEW: ActivityView = {
  kind: [],
  actorId: null,
  from: '',
  to: '',
  q: '',
  page: 1,
  pageSize: ACTIVITY_LIMITS.pageSizeDefault,
};

/** A real calendar day written YYYY-MM-DD (what the API accepts). */
function isDay(text: string): boolean {
  if (!/^\d{4}-\d{2}-\d{2}$/.test(text)) return false;
  const d = new Date(`${text}T00:00:00Z`);
  return !Number.isNaN(d.getTime()) && d.toISOString().slice(0, 10) === text;
}

function positiveInt(text: string | null, fallback: number, max = Number.MAX_SAFE_INTEGER): number {
  if (text === null || !/^\d{1,9}$/.test(text)) return fallback;
  const n = Number(text);
  return n >= 1 && n <= max ? n : fallback;
}

/** The view an address asks for; what the API would refuse falls back to the default. */
export function readActivityView(params: URLSearchParams): ActivityView {
  const kinds = params
    .getAll('kind')
    .flatMap((k) => k.split(','))
    .map((k) => k.trim())
    .filter((k): k is ActivityKind => (ACTIVITY_KINDS as readonly string[]).includes(k));
  const from = params.get('from') ?? '';
  const to = params.get('to') ?? '';
  return {
    kind: [...new Set(kinds)],
    actorId: positiveInt(params.get('actorId'), 0) || null,
    from: isDay(from) ? from : '',
    to: isDay(to) ? to : '',
    q: (params.get('q') ?? '').slice(0, ACTIVITY_LIMITS.qMax),
    page: positiveInt(params.get('page'), 1),
    pageSize: positiveInt(params.get('pageSize'), DEFAULT_ACTIVITY_VIEW.pageSize, ACTIVITY_LIMITS.pageSizeMax),
  };
}

/** The query string of a view (defaults left out), for the address and for the API alike. */
export function activityViewQuery(view: ActivityView): string {
  const p = new URLSearchParams();
  if (view.kind.length) p.set('kind', view.kind.join(','));
  if (view.actorId !== null) p.set('actorId', String(view.actorId));
  if (view.from) p.set('from', view.from);
  if (view.to) p.set('to', view.to);
  if (view.q.trim()) p.set('q', view.q.trim());
  if (view.page !== 1) p.set('page', String(view.page));
  if (view.pageSize !== DEFAULT_ACTIVITY_VIEW.pageSize) p.set('pageSize', String(view.pageSize));
  return p.toString();
}

/** True when any filter narrows the feed (paging aside). */
export function isFiltered(view: ActivityView): boolean {
  return view.kind.length > 0 || view.actorId !== null || view.from !== '' || view.to !== '' || view.q.trim() !== '';
}
