import type { ProjectRole } from '@sagline/common/api-types';
import type { Response } from 'supertest';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * Who may use which overview, assignment and sign-off route: every route ×
 * every kind of caller. Not on the project → 404; on it with another role →
 * 403; viewers read and never write; admins count as managers (not as
 * checkers).
 */
describe('role matrix of the overview, reviewer assignment and sign-off routes', () => {
  type Who = ProjectRole | 'admin' | 'outsider';
  const WHO: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin', 'outsider'];
  const READERS: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin'];

  let t: TestApp;
  let project: TestProject;
  const users = {} as Record<Who, TestUser>;
  const client = {} as Record<Who, ApiClient>;
  let base: string;
  const MARKS = Array.from({ length: 16 }, (_, i) => `M${i + 1}`);
  // Each sign-off test gets a level of its own (sign-offs are once per level).
  let nextLevel = 0;
  const LEVELS = Array.from({ length: 16 }, (_, i) => `F${i + 1}`);

  const level = (name: string) => project.levels.find((l) => l.name === name)!.id;

  /** A signed-off level, signed by the checker: the withdraw routes' target. */
  async function signedLevel(): Promise<number> {
    const id = level(LEVELS[nextLevel++]);
    const res = await client.checker.post(`${base}/levels/${id}/sign-off`, {});
    if (res.status !== 201) throw new Error(`could not sign off: ${JSON.stringify(res.body)}`);
    return id;
  }

  /** `setup`: rows the call writes itself (as the checker) to have something to act on. */
  const ROUTES: { name: string; allowed: Who[]; okStatus: number; setup?: number; call: (c: ApiClient) => Promise<Response> }[] = [
    { name: 'GET overview', allowed: READERS, okStatus: 200, call: (c) => c.get(`${base}/overview`) },
    { name: 'GET overview/flags-over-time', allowed: READERS, okStatus: 200, call: (c) => c.get(`${base}/overview/flags-over-time?days=30`) },
    { name: 'GET reviewer-assignments', allowed: READERS, okStatus: 200, call: (c) => c.get(`${base}/reviewer-assignments`) },
    { name: 'PUT reviewer-assignments/levels/:id', allowed: ['manager', 'admin'], okStatus: 200, call: (c) => c.send('put', `${base}/reviewer-assignments/levels/${level('F1')}`, { reviewerId: users.checker.id }) },
    { name: 'PUT reviewer-assignments/members', allowed: ['manager', 'admin'], okStatus: 200, call: (c) => c.send('put', `${base}/reviewer-assignments/members`, { marks: ['M1'], reviewerId: users.checker.id }) },
    { name: 'POST levels/:id/sign-off', allowed: ['checker'], okStatus: 201, call: (c) => c.post(`${base}/levels/${level(LEVELS[nextLevel++])}/sign-off`, {}) },
    { name: 'POST levels/:id/sign-off/withdraw', allowed: ['checker'], okStatus: 200, setup: 1, call: async (c) => c.post(`${base}/levels/${await signedLevel()}/sign-off/withdraw`, { reason: 'Checking again.' }) },
  ];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    for (const who of WHO) users[who] = await make.user({ isAdmin: who === 'admin', name: `The ${who}` });
    project = await make.project({
      levels: LEVELS,
      team: (['manager', 'engineer', 'checker', 'viewer'] as ProjectRole[]).map((r) => [users[r], r] as [TestUser, ProjectRole]),
    });
    await make.project({ team: [[users.outsider, 'manager']] });
    // One member on each level, so every level can be signed off.
    await new MembersFactory(t).revision(project.id, users.engineer.id, MARKS.map((mark, i) => ({ mark, level: LEVELS[i], I: 100 })));
    for (const who of WHO) client[who] = await ApiClient.signedIn(t.http, users[who].email, PASSWORD);
    base = `/api/projects/${project.id}`;
  });
  afterAll(() => t.close());

  for (const route of ROUTES) {
    for (const who of WHO) {
      const expected = route.allowed.includes(who) ? route.okStatus : who === 'outsider' ? 404 : 403;
      it(`${route.name} as ${who} → ${expected}`, async () => {
        const before = await t.counts(['reviewer_assignments', 'level_sign_offs']);
        const res = await route.call(client[who]);
        if (expected === 404) expectError(res, 404, 'NOT_FOUND', `Project ${project.id} was not found, or you are not on its team.`);
        else if (expected === 403) expectError(res, 403, 'FORBIDDEN', new RegExp(`^Your role on this project \\(${who === 'admin' ? 'none' : who}\\) cannot do this`));
        else expect({ status: res.status, body: res.body }).toEqual({ status: expected, body: expect.anything() });
        if (expected !== route.okStatus) {
          const after = await t.counts(['reviewer_assignments', 'level_sign_offs']);
          expect(after.reviewer_assignments - before.reviewer_assignments + after.level_sign_offs - before.level_sign_offs).toBe(route.setup ?? 0);
        }
      });
    }
  }

  it('answers a signed-out caller 401 on every route', async () => {
    const anon = await ApiClient.anonymous(t.http);
    for (const route of ROUTES) expectError(await route.call(anon), 401, 'UNAUTHENTICATED');
  });
});
