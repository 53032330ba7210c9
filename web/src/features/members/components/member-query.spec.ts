import { DEFAULT_VIEW, membersSearchParams, readMembersView, toMemberListQuery, withFilters } from './member-query';

const read = (search: string) => readMembersView(new URLSearchParams(search));

describe('the Members view and its address', () => {
  it('reads the API parameter names, lists comma-separated, checks one per parameter', () => {
    const view = read('level=3,4&category=floor&material=steel&reviewer=7,none&verdict=fail&check=L%2F240%2C+total&check=L%2F360+live&utilMin=0.9&utilMax=1.5&q=+B1+&sort=-utilization&page=3&pageSize=100&revision=31');
    expect(view).toEqual({
      revision: '31',
      level: ['3', '4'],
      category: ['floor'],
      material: ['steel'],
      reviewer: ['7', 'none'],
      verdict: ['fail'],
      check: ['L/240, total', 'L/360 live'],
      utilMin: 0.9,
      utilMax: 1.5,
      q: 'B1',
      sort: '-utilization',
      page: 3,
      pageSize: 100,
    });
    // Written back in a fixed order, the same parameters again.
    expect(read(membersSearchParams(view).toString())).toEqual(view);
  });

  it('writes only what differs from the default', () => {
    expect(membersSearchParams(DEFAULT_VIEW).toString()).toBe('');
    expect(membersSearchParams({ ...DEFAULT_VIEW, verdict: ['fail'], level: ['3'] }).toString()).toBe('level=3&verdict=fail');
  });

  it('falls back to the default for what the API would refuse in a hand-edited link', () => {
    expect(read('sort=height&page=0&pageSize=100000&utilMin=-1&utilMax=abc&verdict=maybe,fail&revision=x')).toEqual({
      ...DEFAULT_VIEW,
      verdict: ['fail'],
    });
  });

  it('goes back to page 1 on a filter change, keeping the sort', () => {
    const view = { ...DEFAULT_VIEW, sort: '-utilization' as const, page: 4 };
    expect(withFilters(view, { level: ['3'] })).toEqual({ ...view, level: ['3'], page: 1 });
  });

  it('hands the bulk raise the filters as MemberListQuery', () => {
    expect(toMemberListQuery({ ...DEFAULT_VIEW, level: ['3', '4'], check: ['L/360 live'], utilMin: 1 })).toMatchObject({
      level: '3,4',
      check: 'L/360 live',
      utilMin: 1,
    });
  });
});
