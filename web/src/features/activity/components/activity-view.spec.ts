import { activityViewQuery, DEFAULT_ACTIVITY_VIEW, readActivityView } from './activity-view';

describe('the Activity address', () => {
  it('reads every filter and writes it back the same way', () => {
    const params = new URLSearchParams('kind=flags,sign-offs&actorId=4&from=2026-11-01&to=2026-11-30&q=B12&page=3&pageSize=50');
    const view = readActivityView(params);
    expect(view).toEqual({ kind: ['flags', 'sign-offs'], actorId: 4, from: '2026-11-01', to: '2026-11-30', q: 'B12', page: 3, pageSize: 50 });
    expect(activityViewQuery(view)).toBe('kind=flags%2Csign-offs&actorId=4&from=2026-11-01&to=2026-11-30&q=B12&page=3&pageSize=50');
  });

  it('drops what the API would refuse from a hand-edited link instead of failing', () => {
    const view = readActivityView(new URLSearchParams('kind=gossip&kind=imports&kind=imports&actorId=x&from=2026-02-30&to=2026-13-01&page=0&pageSize=1000'));
    expect(view).toEqual({ ...DEFAULT_ACTIVITY_VIEW, kind: ['imports'] });
    expect(activityViewQuery(DEFAULT_ACTIVITY_VIEW)).toBe('');
  });
});
