import type { ProjectRole } from '@sagline/common/api-types';
import type { Response } from 'supertest';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * Who may use which flag and member route: every route × every kind of
 * caller. Not on the project → 404 (the same as a missing project); on it
 * with another role → 403; viewers read and never write. Admins count as
 * managers. "Answer" is let through by the guard for every writing role and
 * then allowed to the assignee or an engineer only (the service's 403).
 */
describe('role matrix of the flag and member routes', () => {
  type Who = ProjectRole | 'admin' | 'outsider';
  const WHO: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin', 'outsider'];
  const READERS: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin'];

  let t: TestApp;
  let project: TestProject;
  const users = {} as Record<Who, TestUser>;
  const client = {} as Record<Who, ApiClient>;
  const MARKS = Array.from({ length: 120 }, (_, i) => `M${i + 1}`);
  let next = 0;
  let base: string;

  /** A new open flag (on a mark not flagged yet), assigned to the engineer. */
  async function fresh(): Promise<{ id: number; version: number }> {
    const res = await client.checker.post(base, { mark: MARKS[next++], assigneeId: users.engineer.id });
    if (res.status !== 201) throw new Error(`could not raise: ${JSON.stringify(res.body)}`);
    return { id: res.body.id, version: res.body.version };
  }

  async function freshClosed(): Promise<{ id: number; version: number }> {
    const f = await fresh();
    const res = await client.checker.post(`${base}/${f.id}/close`, { version: f.version });
    return { id: f.id, version: res.body.version };
  }

  /** `setup`: history events the call writes itself (as the checker) to have a flag to act on. */
  const ROUTES: { name: string; allowed: Who[]; okStatus: number; setup?: number; call: (c: ApiClient) => Promise<Response> }[] = [
    { name: 'GET flags', allowed: READERS, okStatus: 200, call: (c) => c.get(base) },
    { name: 'GET flags/summary', allowed: READERS, okStatus: 200, call: (c) => c.get(`${base}/summary`) },
    { name: 'GET flags/:id', allowed: READERS, okStatus: 200, setup: 1, call: async (c) => c.get(`${base}/${(await fresh()).id}`) },
    { name: 'POST flags', allowed: ['checker'], okStatus: 201, call: (c) => c.post(base, { mark: MARKS[next++] }) },
    { name: 'POST flags/bulk', allowed: ['checker'], okStatus: 201, call: (c) => c.post(`${base}/bulk`, { marks: [MARKS[next++], MARKS[next++]] }) },
    { name: 'POST flags/bulk-assign', allowed: ['checker', 'manager', 'admin'], okStatus: 200, setup: 1, call: async (c) => c.post(`${base}/bulk-assign`, { flagIds: [(await fresh()).id], assigneeId: null }) },
    { name: 'PATCH flags/:id', allowed: ['checker', 'manager', 'admin'], okStatus: 200, setup: 1, call: async (c) => { const f = await fresh(); return c.patch(`${base}/${f.id}`, { version: f.version, dueDate: '2027-05-01' }); } },
    { name: 'POST flags/:id/answer', allowed: ['engineer'], okStatus: 200, setup: 1, call: async (c) => { const f = await fresh(); return c.post(`${base}/${f.id}/answer`, { version: f.version, body: 'Section changed.' }); } },
    { name: 'POST flags/:id/close', allowed: ['checker'], okStatus: 200, setup: 1, call: async (c) => { const f = await fresh(); return c.post(`${base}/${f.id}/close`, { version: f.version }); } },
    { name: 'POST flags/:id/reopen', allowed: ['checker'], okStatus: 200, setup: 2, call: async (c) => { const f = await freshClosed(); return c.post(`${base}/${f.id}/reopen`, { version: f.version, body: 'Not fixed.' }); } },
    { name: 'POST flags/:id/waive', allowed: ['checker', 'manager', 'admin'], okStatus: 200, setup: 1, call: async (c) => { const f = await fresh(); return c.post(`${base}/${f.id}/waive`, { version: f.version, reason: 'Accepted by the engineer of record.' }); } },
    { name: 'POST flags/:id/comments', allowed: ['manager', 'engineer', 'checker', 'admin'], okStatus: 201, setup: 1, call: async (c) => c.post(`${base}/${(await fresh()).id}/comments`, { body: 'Noted.' }) },
    { name: 'GET members', allowed: READERS, okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}/members`) },
    { name: 'GET members/facets', allowed: READERS, okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}/members/facets`) },
    { name: 'GET members/:mark', allowed: READERS, okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}/members/M1`) },
  ];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    for (const who of WHO) users[who] = await make.user({ isAdmin: who === 'admin', name: `The ${who}` });
    project = await make.project({
      team: (['manager', 'engineer', 'checker', 'viewer'] as ProjectRole[]).map((r) => [users[r], r] as [TestUser, ProjectRole]),
    });
    // The outsider is on another project: a role elsewhere gives nothing here.
    await make.project({ team: [[users.outsider, 'checker']] });
    await new MembersFactory(t).revision(project.id, users.engineer.id, MARKS.map((mark) => ({ mark, I: 20 })));
    for (const who of WHO) client[who] = await ApiClient.signedIn(t.http, users[who].email, PASSWORD);
    base = `/api/projects/${project.id}/flags`;
  });
  afterAll(() => t.close());

  for (const route of ROUTES) {
    for (const who of WHO) {
      const expected = route.allowed.includes(who) ? route.okStatus : who === 'outsider' ? 404 : 403;
      it(`${route.name} as ${who} → ${expected}`, async () => {
        const before = await t.counts(['flags', 'flag_events']);
        const res = await route.call(client[who]);
        if (expected === 404) expectError(res, 404, 'NOT_FOUND', `Project ${project.id} was not found, or you are not on its team.`);
        else if (expected === 403) expectError(res, 403, 'FORBIDDEN', route.name.endsWith('/answer') && who !== 'viewer' ? /^Only the flag's assignee \(The engineer\) or an engineer/ : new RegExp(`^Your role on this project \\(${who === 'admin' ? 'none' : who}\\) cannot do this`));
        else expect({ status: res.status, body: res.body }).toEqual({ status: expected, body: expect.anything() });
        if (expected !== route.okStatus) {
          // A refused write wrote nothing beyond the flag the test itself raised to have a target.
          const after = await t.counts(['flags', 'flag_events']);
          expect(after.flag_events - before.flag_events).toBe(route.setup ?? 0);
        }
      });
    }
  }

  it('answers a signed-out caller 401 on every route', async () => {
    const anon = await ApiClient.anonymous(t.http);
    for (const route of ROUTES) expectError(await route.call(anon), 401, 'UNAUTHENTICATED');
  });
});
