import type { Project, ProjectRole } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { TestApp } from './support/test-app';

describe('projects', () => {
  let t: TestApp;
  let make: Factories;
  let admin: ApiClient;
  let manager: TestUser;
  let viewer: TestUser;
  let project: TestProject;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    const adminUser = await make.user({ name: 'Rowan Adeyemi', isAdmin: true });
    manager = await make.user({ name: 'Mireille Fontaine' });
    viewer = await make.user({ name: 'Dalia Stroud' });
    project = await make.project({ name: 'Halvercote Yard', number: 'HY-2026', team: [[manager, 'manager'], [viewer, 'viewer']] });
    admin = await ApiClient.signedIn(t.http, adminUser.email, PASSWORD);
  });
  afterAll(() => t.close());

  it('lets an admin create a project with its levels, recorded in the activity', async () => {
    const res = await admin.post('/api/projects', { name: ' Quayside Hall ', number: 'QH-7', unitSystem: 'US', levels: ['Level 1', 'Level 2', 'Roof'] });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(Number),
      name: 'Quayside Hall',
      number: 'QH-7',
      unitSystem: 'US',
      myRole: 'admin',
      createdAt: expect.any(String),
      levels: [
        { id: expect.any(Number), name: 'Level 1', position: 0 },
        { id: expect.any(Number), name: 'Level 2', position: 1 },
        { id: expect.any(Number), name: 'Roof', position: 2 },
      ],
    });
    expect(new Date(res.body.createdAt).getTime()).toBeGreaterThan(Date.now() - 60_000);

    const again = await admin.get(`/api/projects/${res.body.id}`);
    expect(again.status).toBe(200);
    expect(again.body).toEqual(res.body);

    const activity = await admin.get(`/api/projects/${res.body.id}/activity`);
    expect(activity.body).toEqual({
      items: [{ id: expect.any(Number), at: expect.any(String), actor: { id: expect.any(Number), name: 'Rowan Adeyemi' }, action: 'project.created', kind: 'project', summary: 'Rowan Adeyemi created the project Quayside Hall (QH-7) with 3 levels', refs: {} }],
      total: 1,
      page: 1,
      pageSize: 25,
    });
  });

  it('lists only the projects a person is on, with their role; admins see every project', async () => {
    const mine = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    const list = await mine.get('/api/projects');
    expect(list.status).toBe(200);
    expect(list.body).toEqual([{ id: project.id, name: 'Halvercote Yard', number: 'HY-2026', unitSystem: 'SI', myRole: 'manager', createdAt: expect.any(String) }]);

    const all = await admin.get('/api/projects');
    expect(all.body.map((p: { name: string; myRole: string }) => [p.name, p.myRole])).toEqual(
      expect.arrayContaining([['Halvercote Yard', 'admin'], ['Quayside Hall', 'admin']]),
    );
    expectError(await new ApiClient(t.http).get('/api/projects'), 401, 'UNAUTHENTICATED');
  });

  it('lets a manager rename the project and reorder, add and remove levels, keeping ids of kept levels', async () => {
    const c = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    const before = (await c.get(`/api/projects/${project.id}`)).body as Project;
    const res = await c.patch(`/api/projects/${project.id}`, { name: 'Halvercote Yard (phase 1)', levels: ['L1', 'Podium', 'Roof'] });
    expect(res.status).toBe(200);
    const l1 = before.levels.find((l) => l.name === 'L1')!;
    const roof = before.levels.find((l) => l.name === 'Roof')!;
    expect(res.body).toEqual({
      ...before,
      name: 'Halvercote Yard (phase 1)',
      levels: [
        { id: l1.id, name: 'L1', position: 0 },
        { id: expect.any(Number), name: 'Podium', position: 1 },
        { id: roof.id, name: 'Roof', position: 2 },
      ],
    });
    const entry = (await c.get(`/api/projects/${project.id}/activity?pageSize=1`)).body.items[0];
    expect(entry).toMatchObject({ action: 'project.updated', summary: 'Mireille Fontaine changed the name to "Halvercote Yard (phase 1)"; levels to L1, Podium, Roof' });
  });

  it('refuses a level list that names a level twice, and writes nothing', async () => {
    const before = await t.counts();
    const body = expectError(await admin.patch(`/api/projects/${project.id}`, { levels: ['L1', 'l1'] }), 400, 'VALIDATION_FAILED');
    expect(body.details).toEqual([{ path: 'body.levels', message: 'names a level twice (names are compared ignoring case)' }]);
    expect(await t.counts()).toEqual(before);
  });

  it('pages the activity, newest first', async () => {
    const p = await make.project({ team: [[manager, 'manager']] });
    const c = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    for (const name of ['One', 'Two', 'Three']) await c.patch(`/api/projects/${p.id}`, { name });
    const page2 = await c.get(`/api/projects/${p.id}/activity?page=2&pageSize=2`);
    expect(page2.status).toBe(200);
    expect(page2.body).toMatchObject({ total: 3, page: 2, pageSize: 2 });
    expect(page2.body.items.map((i: { summary: string }) => i.summary)).toEqual(['Mireille Fontaine changed the name to "One"']);
    const bad = expectError(await c.get(`/api/projects/${p.id}/activity?pageSize=500`), 400, 'VALIDATION_FAILED');
    expect(bad.details).toEqual([{ path: 'query.pageSize', message: 'must be at most 100' }]);
  });
});

/**
 * Who may use which project route (product.md roles). Admins act with manager
 * rights on every project; a person outside the project gets 404 everywhere.
 */
describe('role matrix of the project routes', () => {
  type Who = ProjectRole | 'admin' | 'outsider';
  const WHO: Who[] = ['manager', 'engineer', 'checker', 'viewer', 'admin', 'outsider'];

  let t: TestApp;
  let make: Factories;
  let project: TestProject;
  const client = {} as Record<Who, ApiClient>;
  let n = 0;

  /** A fresh team member to change or remove, so every attempt has a target. */
  async function target(): Promise<TestUser> {
    const u = await make.user();
    await make.role(project.id, u, 'viewer');
    return u;
  }

  const ROUTES: { name: string; allowed: Who[]; okStatus: number; call: (c: ApiClient) => Promise<import('supertest').Response> }[] = [
    { name: 'GET project', allowed: ['manager', 'engineer', 'checker', 'viewer', 'admin'], okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}`) },
    { name: 'PATCH project', allowed: ['manager', 'admin'], okStatus: 200, call: (c) => c.patch(`/api/projects/${project.id}`, { name: `Renamed ${++n}` }) },
    { name: 'GET team', allowed: ['manager', 'engineer', 'checker', 'viewer', 'admin'], okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}/team`) },
    { name: 'POST invitation', allowed: ['manager', 'admin'], okStatus: 201, call: (c) => c.post(`/api/projects/${project.id}/invitations`, { email: `invitee${++n}@firm.example`, role: 'viewer' }) },
    { name: 'PATCH team member', allowed: ['manager', 'admin'], okStatus: 200, call: async (c) => c.patch(`/api/projects/${project.id}/team/${(await target()).id}`, { role: 'checker' }) },
    { name: 'DELETE team member', allowed: ['manager', 'admin'], okStatus: 204, call: async (c) => c.delete(`/api/projects/${project.id}/team/${(await target()).id}`) },
    { name: 'GET activity', allowed: ['manager', 'engineer', 'checker', 'viewer', 'admin'], okStatus: 200, call: (c) => c.get(`/api/projects/${project.id}/activity`) },
  ];

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    const users = {} as Record<Who, TestUser>;
    for (const who of WHO) users[who] = await make.user({ isAdmin: who === 'admin' });
    project = await make.project({
      team: (['manager', 'engineer', 'checker', 'viewer'] as ProjectRole[]).map((r) => [users[r], r] as [TestUser, ProjectRole]),
    });
    // The outsider is on another project: being signed in and a member elsewhere gives nothing here.
    await make.project({ team: [[users.outsider, 'manager']] });
    for (const who of WHO) client[who] = await ApiClient.signedIn(t.http, users[who].email, PASSWORD);
  });
  afterAll(() => t.close());

  for (const route of ROUTES) {
    for (const who of WHO) {
      const expected = route.allowed.includes(who) ? route.okStatus : who === 'outsider' ? 404 : 403;
      it(`${route.name} as ${who} → ${expected}`, async () => {
        const res = await route.call(client[who]);
        if (expected === 404) expectError(res, 404, 'NOT_FOUND', `Project ${project.id} was not found, or you are not on its team.`);
        else if (expected === 403) expectError(res, 403, 'FORBIDDEN', new RegExp(`^Your role on this project \\(${who}\\) cannot do this; it needs manager\\.`));
        else expect({ status: res.status, body: res.body }).toEqual({ status: expected, body: expected === 204 ? {} : expect.anything() });
      });
    }
  }

  it('answers a project that does not exist exactly like one you are not on', async () => {
    for (const path of ['/api/projects/999999', '/api/projects/999999/team', '/api/projects/abc']) {
      const res = await client.manager.get(path);
      expectError(res, 404, 'NOT_FOUND', /was not found, or you are not on its team\.$/);
    }
  });

  it('keeps project creation and the people list to admins', async () => {
    const body = { name: 'Tower', number: 'T-1', unitSystem: 'SI', levels: ['L1'] };
    for (const who of ['manager', 'engineer', 'checker', 'viewer', 'outsider'] as Who[]) {
      expectError(await client[who].post('/api/projects', body), 403, 'FORBIDDEN', 'Only an admin can do this; ask an admin of your firm.');
      expectError(await client[who].get('/api/users'), 403, 'FORBIDDEN');
    }
    expect((await client.admin.post('/api/projects', body)).status).toBe(201);
    const people = await client.admin.get('/api/users');
    expect(people.status).toBe(200);
    expect(people.body).toEqual(expect.arrayContaining([{ id: expect.any(Number), email: expect.any(String), name: expect.any(String), isAdmin: true }]));
    expect(Object.keys(people.body[0]).sort()).toEqual(['email', 'id', 'isAdmin', 'name']);
  });

  it('shows a signed-out person 401 on every project route, before anything else', async () => {
    const anon = await ApiClient.anonymous(t.http);
    for (const route of ROUTES) expectError(await route.call(anon), 401, 'UNAUTHENTICATED');
  });
});
