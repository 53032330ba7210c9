import { MEMBER_LIMITS, MEMBER_SORTS, type MemberListQuery, type MemberSort } from '@sagline/common/api-types';

/**
 * The Members screen's view (filters, sort, page) and its address. The URL
 * uses the very parameter names of the API's MemberListQuery (members.ts),
 * so a link such as `/projects/7/members?level=3&verdict=fail` from any
 * screen opens that view, and the page sends its own query string on to
 * `GET /api/projects/7/members` as it is.
 *
 * Lists are comma-separated (`level=3,4`), except check names, which may hold
 * commas: one `check=` parameter each.
 */
export interface MembersView {
  /** `latest` when absent. */
  revision: string | null;
  level: string[];
  category: string[];
  material: string[];
  reviewer: string[];
  verdict: MemberVerdictFilter[];
  check: string[];
  utilMin: number | null;
  utilMax: number | null;
  q: string;
  sort: MemberSort;
  page: number;
  pageSize: number;
}

export const MEMBER_VERDICT_FILTERS = ['pass', 'fail', 'unchecked'] as const;
export type MemberVerdictFilter = (typeof MEMBER_VERDICT_FILTERS)[number];

export const PAGE_SIZES = [20, 50, 100, 200] as const;

export const DEFAULT_VIEW: MembersView = {
  revision: null,
  level: [],
  category: [],
  material: [],
  reviewer: [],
  verdict: [],
  check: [],
  utilMin: null,
  utilMax: null,
  q: '',
  sort: 'mark',
  page: 1,
  pageSize: MEMBER_LIMITS.pageSizeDefault,
};

const LIST_FIELDS = ['level', 'category', 'material', 'reviewer'] as const;

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

function bound(text: string | null): number | null {
  if (text === null || text.trim() === '') return null;
  const n = Number(text);
  return Number.isFinite(n) && n >= 0 ? n : null;
}

function positiveInt(text: string | null, fallback: number, max = Number.MAX_SAFE_INTEGER): number {
  if (text === null || !/^\d{1,9}$/.test(text)) return fallback;
  const n = Number(text);
  return n >= 1 && n <= max ? n : fallback;
}

/**
 * The view an address asks for. What the API would refuse (an unknown sort,
 * a page of 0, a negative bound) falls back to the default rather than
 * showing an error for a hand-edited link; everything else is passed on and
 * the API has the last word (an unknown level id simply matches nothing).
 */
export function readMembersView(params: URLSearchParams): MembersView {
  const sort = params.get('sort');
  const revision = params.get('revision');
  const view: MembersView = {
    ...DEFAULT_VIEW,
    revision: revision && /^(latest|[1-9]\d{0,9})$/.test(revision) && revision !== 'latest' ? revision : null,
    verdict: splitList(params, 'verdict').filter((v): v is MemberVerdictFilter =>
      (MEMBER_VERDICT_FILTERS as readonly string[]).includes(v),
    ),
    check: params.getAll('check').map((c) => c.trim()).filter((c, i, all) => c !== '' && all.indexOf(c) === i),
    utilMin: bound(params.get('utilMin')),
    utilMax: bound(params.get('utilMax')),
    q: (params.get('q') ?? '').trim().slice(0, MEMBER_LIMITS.queryMax),
    sort: sort && (MEMBER_SORTS as readonly string[]).includes(sort) ? (sort as MemberSort) : DEFAULT_VIEW.sort,
    page: positiveInt(params.get('page'), 1),
    pageSize: positiveInt(params.get('pageSize'), DEFAULT_VIEW.pageSize, MEMBER_LIMITS.pageSizeMax),
  };
  for (const f of LIST_FIELDS) view[f] = splitList(params, f);
  return view;
}

/** The address of a view: only what differs from the default, in a fixed order. */
export function membersSearchParams(view: MembersView): URLSearchParams {
  const p = new URLSearchParams();
  if (view.revision) p.set('revision', view.revision);
  for (const f of LIST_FIELDS) if (view[f].length) p.set(f, view[f].join(','));
  if (view.verdict.length) p.set('verdict', view.verdict.join(','));
  for (const c of view.check) p.append('check', c);
  if (view.utilMin !== null) p.set('utilMin', String(view.utilMin));
  if (view.utilMax !== null) p.set('utilMax', String(view.utilMax));
  if (view.q.trim()) p.set('q', view.q.trim());
  if (view.sort !== DEFAULT_VIEW.sort) p.set('sort', view.sort);
  if (view.page !== 1) p.set('page', String(view.page));
  if (view.pageSize !== DEFAULT_VIEW.pageSize) p.set('pageSize', String(view.pageSize));
  return p;
}

/** Any filter set (the revision, sort and paging are not filters). */
export function hasFilters(view: MembersView): boolean {
  return (
    LIST_FIELDS.some((f) => view[f].length > 0) ||
    view.verdict.length > 0 ||
    view.check.length > 0 ||
    view.utilMin !== null ||
    view.utilMax !== null ||
    view.q.trim() !== ''
  );
}

/** "Failing only": exactly the failing members, whatever else is filtered. */
export const isFailingOnly = (view: MembersView) => view.verdict.length === 1 && view.verdict[0] === 'fail';

/**
 * A change of filter: back to the first page (page 3 of another filter means
 * nothing). Sort and page size stay.
 */
export function withFilters(view: MembersView, change: Partial<MembersView>): MembersView {
  return { ...view, ...change, page: 1 };
}

/** The filters alone, as the API's MemberListQuery (for the bulk raise of flags). */
export function toMemberListQuery(view: MembersView): MemberListQuery {
  const q: MemberListQuery = {};
  if (view.revision) q.revision = view.revision;
  for (const f of LIST_FIELDS) if (view[f].length) q[f] = view[f].join(',');
  if (view.verdict.length) q.verdict = view.verdict.join(',');
  // Check names may hold commas; the API reads repeated parameters, the bulk raise a list.
  if (view.check.length) q.check = view.check.length === 1 ? view.check[0] : (view.check as unknown as string);
  if (view.utilMin !== null) q.utilMin = view.utilMin;
  if (view.utilMax !== null) q.utilMax = view.utilMax;
  if (view.q.trim()) q.q = view.q.trim();
  q.sort = view.sort;
  q.page = view.page;
  q.pageSize = view.pageSize;
  return q;
}
