import { FLAG_LIMITS, FLAG_SORTS, FLAG_STATUSES, type FlagListQuery, type FlagSort, type FlagStatus } from '@sagline/common/api-types';

/**
 * The Flags screen's view and its address. The URL uses the very parameter
 * names of the API's FlagListQuery (flags.ts), so the Overview can link to
 * `/projects/7/flags?status=open&assignee=4&overdue=true` and the page sends
 * the same query on to `GET /api/projects/7/flags`. `view=board` (the status
 * board) is the only parameter of the screen's own.
 */
export interface FlagsView {
  status: FlagStatus[];
  /** User ids, `me`, `none`. */
  assignee: string[];
  /** Level ids. */
  level: string[];
  mark: string;
  check: string | null;
  overdue: boolean;
  sort: FlagSort;
  page: number;
  pageSize: number;
  board: boolean;
}

export const FLAG_PAGE_SIZES = [20, 50, 100, 200] as const;

export const DEFAULT_FLAGS_VIEW: FlagsView = {
  status: [],
  assignee: [],
  level: [],
  mark: '',
  check: null,
  overdue: false,
  sort: '-updated',
  page: 1,
  pageSize: FLAG_LIMITS.pageSizeDefault,
  board: false,
};

function splitList(params: URLSearchParams, name: string): string[] {
  const out: string[] = [];
  for (const v of params.getAll(name)) {
    for (const part of v.split(',')) {
      const t = part.trim();
      if (t && !out.includes(t)) out.push(t);
    }
  }
  return out;
}

function positiveInt(text: string | null, fallback: number, max = Number.MAX_SAFE_INTEGER): number {
  if (text === null || !/^\d{1,9}$/.test(text)) return fallback;
  const n = Number(text);
  return n >= 1 && n <= max ? n : fallback;
}

/**
 * The view an address asks for. What the API would refuse (an unknown status
 * or sort, page 0) falls back to the default rather than an error for a
 * hand-edited link; ids are passed on and the API has the last word.
 */
export function readFlagsView(params: URLSearchParams): FlagsView {
  const sort = params.get('sort');
  return {
    status: splitList(params, 'status').filter((s): s is FlagStatus => (FLAG_STATUSES as readonly string[]).includes(s)),
    assignee: splitList(params, 'assignee').filter((a) => a === 'me' || a === 'none' || /^\d{1,9}$/.test(a)),
    level: splitList(params, 'level').filter((l) => /^\d{1,9}$/.test(l)),
    mark: (params.get('mark') ?? '').slice(0, FLAG_LIMITS.markMax),
    check: params.get('check') || null,
    overdue: params.get('overdue') === 'true',
    sort: sort && (FLAG_SORTS as readonly string[]).includes(sort) ? (sort as FlagSort) : DEFAULT_FLAGS_VIEW.sort,
    page: positiveInt(params.get('page'), 1),
    pageSize: positiveInt(params.get('pageSize'), DEFAULT_FLAGS_VIEW.pageSize, FLAG_LIMITS.pageSizeMax),
    board: params.get('view') === 'board',
  };
}

/** The API query of a view (the board asks per status; see boardQuery). */
export function toFlagListQuery(view: FlagsView): FlagListQuery {
  const q: FlagListQuery = {};
  if (view.status.length) q.status = view.status.join(',');
  if (view.assignee.length) q.assignee = view.assignee.join(',');
  if (view.level.length) q.level = view.level.join(',');
  if (view.mark.trim()) q.mark = view.mark.trim();
  if (view.check) q.check = view.check;
  if (view.overdue) q.overdue = 'true';
  q.sort = view.sort;
  q.page = view.page;
  q.pageSize = view.pageSize;
  return q;
}

/** One column of the board: the view's filters, that status, soonest due first. */
export function boardQuery(view: FlagsView, status: FlagStatus): FlagListQuery {
  return { ...toFlagListQuery({ ...view, status: [status], page: 1, pageSize: 100 }), sort: 'due' };
}

/** The address of a view: defaults left out, so a plain link stays plain. */
export function flagsSearchParams(view: FlagsView): URLSearchParams {
  const p = new URLSearchParams();
  if (view.status.length) p.set('status', view.status.join(','));
  if (view.assignee.length) p.set('assignee', view.assignee.join(','));
  if (view.level.length) p.set('level', view.level.join(','));
  if (view.mark.trim()) p.set('mark', view.mark.trim());
  if (view.check) p.set('check', view.check);
  if (view.overdue) p.set('overdue', 'true');
  if (view.sort !== DEFAULT_FLAGS_VIEW.sort) p.set('sort', view.sort);
  if (view.page !== 1) p.set('page', String(view.page));
  if (view.pageSize !== DEFAULT_FLAGS_VIEW.pageSize) p.set('pageSize', String(view.pageSize));
  if (view.board) p.set('view', 'board');
  return p;
}

/** A change of filters goes back to page 1. */
export function withFlagFilters(view: FlagsView, change: Partial<FlagsView>): FlagsView {
  return { ...view, ...change, page: 'page' in change ? (change.page ?? 1) : 1 };
}

export function hasFlagFilters(view: FlagsView): boolean {
  return Boolean(view.status.length || view.assignee.length || view.level.length || view.mark.trim() || view.check || view.overdue);
}
