import { seedDemoFlags } from '../src/flags/demo-flags';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

describe('demo flags', () => {
  let t: TestApp;
  afterAll(() => t.close());

  it('puts flags at every stage on the most utilised failing members, once', async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const checker = await make.user({ name: 'Ines Okafor' });
    const engineer = await make.user({ name: 'Kasimir Oduya' });
    const project = await make.project({ number: 'HY-TEST', team: [[checker, 'checker'], [engineer, 'engineer']] });
    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe('project HY-TEST has no revision yet: no flags raised');
    // I from 10 to 17 ×10⁶ mm⁴: all fail L/360 live, B1 the most (members-factory.ts).
    await new MembersFactory(t).revision(project.id, engineer.id, Array.from({ length: 8 }, (_, i) => ({ mark: `B${i + 1}`, I: 10 + i })));

    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe('raised 6 demo flags on revision 1 of project HY-TEST (open, overdue, answered, closed, waived, unassigned)');
    const c = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    const summary = (await c.get(`/api/projects/${project.id}/flags/summary`)).body;
    expect({ byStatus: summary.byStatus, overdue: summary.overdue }).toEqual({ byStatus: { open: 3, answered: 1, closed: 1, waived: 1 }, overdue: 1 });
    const list = (await c.get(`/api/projects/${project.id}/flags?sort=mark`)).body.items;
    expect(list.map((f: { mark: string; status: string }) => `${f.mark} ${f.status}`)).toEqual(['B1 open', 'B2 open', 'B3 answered', 'B4 closed', 'B5 waived', 'B6 open']);
    expect(list[5].assignee).toBeNull();
    expect(await seedDemoFlags(t.app, 'HY-TEST')).toBe('project HY-TEST has flags already: none raised');
    expect(await seedDemoFlags(t.app, 'NOPE')).toBe('no project NOPE: no flags raised');
  });
});
