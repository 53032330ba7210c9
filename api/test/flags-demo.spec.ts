import { DEMO_PASSWORD, DEMO_PEOPLE, seedDemo } from '@sagline/database';
import type { ActivityPage, FlagsOverTime, ProjectOverview } from '@sagline/common/api-types';
import { seedDemoFlags } from '../src/flags/demo-flags';
import { seedDemoRevision } from '../src/imports/demo-seed';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/** The UTC day `n` days before today, "YYYY-MM-DD". */
const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);

describe('demo flags', () => {
  let t: TestApp;
  afterEach(() => t?.close());

  it('puts flags at every stage on the most utilised failing members, once', async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const checker = await make.user({ name: 'Ines Okafor' });
    const engineer = await make.user({ name: 'Kasimir Oduya' });
    const project = await make.project({ number: 'HY-TEST', team: [[checker, 'checker'], [engineer, 'engineer']] });
    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe('project HY-TEST has no revision yet: no flags raised');
    // I from 10 to 17 ×10⁶ mm⁴: all fail L/360 live, B1 the most (members-factory.ts).
    await new MembersFactory(t).revision(project.id, engineer.id, Array.from({ length: 8 }, (_, i) => ({ mark: `B${i + 1}`, I: 10 + i })));

    // The revision was uploaded just now: no flag may be dated before it, so the story's dates are not used.
    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe(
      'raised 6 demo flags on revision 1 of project HY-TEST (open, overdue, answered, closed, waived, unassigned), dated now (the revision is newer than their story)',
    );
    const c = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    const summary = (await c.get(`/api/projects/${project.id}/flags/summary`)).body;
    expect({ byStatus: summary.byStatus, overdue: summary.overdue }).toEqual({ byStatus: { open: 3, answered: 1, closed: 1, waived: 1 }, overdue: 1 });
    const list = (await c.get(`/api/projects/${project.id}/flags?sort=mark`)).body.items;
    expect(list.map((f: { mark: string; status: string }) => `${f.mark} ${f.status}`)).toEqual(['B1 open', 'B2 open', 'B3 answered', 'B4 closed', 'B5 waived', 'B6 open']);
    expect(list[5].assignee).toBeNull();
    const series: FlagsOverTime = (await c.get(`/api/projects/${project.id}/overview/flags-over-time?days=30`)).body;
    expect(series.points.filter((p) => p.raised > 0).map((p) => p.day)).toEqual([daysAgo(0)]);
    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe('project HY-TEST has flags already: none raised');
    expect(await seedDemoFlags(t.app, 'NOPE')).toBe('no project NOPE: no flags raised');
  });

  it('gives the demo project a history over the last weeks: the chart moves on several days, the counts are those of every stage', async () => {
    t = await TestApp.start();
    await seedDemo(t.knex);
    expect(await seedDemoRevision(t.app)).toMatch(/^imported halvercote-yard\.xlsx into Halvercote Yard as revision 1 \(uploaded by Kasimir Oduya, dated 25 days ago\): 391 members, 28 failing/);
    expect(await seedDemoFlags(t.app)).toBe('raised 6 demo flags on revision 1 of project HY-2026 (open, overdue, answered, closed, waived, unassigned), their history dated from 23 to 2 days ago');

    const manager = DEMO_PEOPLE.find((p) => p.role === 'manager')!;
    const c = await ApiClient.signedIn(t.http, manager.email, DEMO_PASSWORD);
    const projectId = (await t.knex('projects').where({ number: 'HY-2026' }).first('id')).id;
    const api = `/api/projects/${projectId}`;

    // The overview counts as before the history was dated: members, failing, every stage, one overdue (due 3 days ago).
    const overview: ProjectOverview = (await c.get(`${api}/overview`)).body;
    expect(overview.totals).toMatchObject({ members: 391, fail: 28, flagsOpen: 3, flagsAnswered: 1, flagsClosed: 1, flagsWaived: 1, flagsTotal: 6, overdue: 1 });
    expect(overview.latestRevision).toMatchObject({ number: 1, uploadedBy: { name: 'Kasimir Oduya' } });
    expect(overview.latestRevision!.createdAt.slice(0, 10)).toBe(daysAgo(25));

    // The chart: flags raised on six days, changes on four more, and the last day agrees with the overview.
    const series: FlagsOverTime = (await c.get(`${api}/overview/flags-over-time?days=30`)).body;
    expect(series.points.filter((p) => p.raised > 0).map((p) => p.day)).toEqual([23, 22, 15, 12, 9, 2].map(daysAgo));
    const moves = series.points.filter((p, i) => i > 0 && ['open', 'answered', 'closed', 'waived'].some((k) => p[k as 'open'] !== series.points[i - 1][k as 'open']));
    expect(moves.map((p) => p.day)).toEqual([23, 22, 20, 18, 17, 15, 12, 9, 5, 2].map(daysAgo));
    expect(series.points.find((p) => p.day === daysAgo(18))).toMatchObject({ open: 1, answered: 0, closed: 1, waived: 0 });
    const last = series.points[series.points.length - 1];
    expect(last).toMatchObject({ day: overview.today, open: 3, answered: 1, closed: 1, waived: 1, raised: 0 });

    // The activity feed tells the same story, newest first: the last raise two days ago, the project's creation first.
    const feed: ActivityPage = (await c.get(`${api}/activity?pageSize=50`)).body;
    expect(feed.items.map((e) => `${e.at.slice(0, 10)} ${e.action}`)).toEqual([
      `${daysAgo(2)} flag.raised`,
      `${daysAgo(5)} flag.answered`,
      `${daysAgo(9)} flag.raised`,
      `${daysAgo(12)} flag.raised`,
      `${daysAgo(15)} flag.raised`,
      `${daysAgo(17)} flag.waived`,
      `${daysAgo(18)} flag.closed`,
      `${daysAgo(20)} flag.answered`,
      `${daysAgo(22)} flag.raised`,
      `${daysAgo(23)} flag.raised`,
      `${daysAgo(25)} import.committed`,
      `${daysAgo(27)} project.created`,
    ]);
  }, 120_000);
});
