import request from 'supertest';
import { CSRF_COOKIE, SESSION_COOKIE, type FlagSummary, type ProjectOverview } from '@sagline/common/api-types';
import { SessionStore } from '../src/db/session-store';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * A read repeated with the same session is answered at the door
 * (db/answer-replay.ts), before the session, guards and route run again,
 * from what the whole pipeline answered to the same request. What a person
 * must never see: a replay after anything changed (their data, their
 * session, their role), or a replay of somebody else's answer.
 */
describe('a repeated read answered at the door', () => {
  let t: TestApp;
  let project: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let manager: TestUser;
  let managerC: ApiClient;
  let checkerC: ApiClient;
  let base: string;
  /** How many requests went through express-session (the door answers without it). */
  let sessionReads: jest.SpyInstance;
  const throughPipeline = async (ask: () => Promise<request.Response>): Promise<{ res: request.Response; pipeline: boolean }> => {
    const before = sessionReads.mock.calls.length;
    const res = await ask();
    return { res, pipeline: sessionReads.mock.calls.length > before };
  };
  const expiresOf = (res: request.Response): number => {
    const line = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
    return Date.parse(/Expires=([^;]+)/.exec(line)![1]);
  };

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    checker = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Kasimir Oduya' });
    manager = await make.user({ name: 'Mireille Fontaine' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checker, 'checker'], [engineer, 'engineer'], [manager, 'manager']] });
    await new MembersFactory(t).revision(project.id, engineer.id, [
      { mark: 'B1', I: 20 },
      { mark: 'B2', I: 100 },
    ]);
    managerC = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    checkerC = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    base = `/api/projects/${project.id}`;
    sessionReads = jest.spyOn(t.app.get(SessionStore).store, 'get');
  });

  afterAll(async () => {
    sessionReads?.mockRestore();
    await t?.close();
  });

  it('answers the same read again without the pipeline: the same answer and ETag, its own request id, the session cookie renewed', async () => {
    const first = await throughPipeline(() => managerC.get(`${base}/overview`));
    expect(first.res.status).toBe(200);
    expect(first.pipeline).toBe(true);
    await new Promise((r) => setTimeout(r, 1_100)); // cookie expiry has whole seconds
    const again = await throughPipeline(() => managerC.get(`${base}/overview`));
    expect(again.pipeline).toBe(false);
    expect(again.res.status).toBe(200);
    expect(again.res.text).toBe(first.res.text);
    expect(again.res.headers.etag).toBe(first.res.headers.etag);
    expect(again.res.headers['content-type']).toBe(first.res.headers['content-type']);
    expect(again.res.headers['content-security-policy']).toBe(first.res.headers['content-security-policy']);
    expect(again.res.headers['x-request-id']).not.toBe(first.res.headers['x-request-id']);
    expect(expiresOf(again.res)).toBeGreaterThan(expiresOf(first.res));
    expect(managerC.cookie(SESSION_COOKIE)).toBeDefined();
  });

  it('answers 304 to a client that already has the answer', async () => {
    const first = await managerC.get(`${base}/flags/summary`);
    const cookies = `${SESSION_COOKIE}=${managerC.cookie(SESSION_COOKIE)}; ${CSRF_COOKIE}=${managerC.cookie(CSRF_COOKIE)}`;
    const fresh = await throughPipeline(() => request(t.http).get(`${base}/flags/summary`).set('Cookie', cookies).set('If-None-Match', first.headers.etag));
    expect(fresh.pipeline).toBe(false);
    expect(fresh.res.status).toBe(304);
    expect(fresh.res.text).toBe('');
  });

  it('a change by anyone shows on the next read', async () => {
    const before = (await managerC.get(`${base}/flags/summary`)).body as FlagSummary;
    await managerC.get(`${base}/flags/summary`);
    const raised = await checkerC.post(`${base}/flags`, { mark: 'B1', checkName: 'L/360 live', assigneeId: engineer.id });
    expect(raised.status).toBe(201);
    const after = await throughPipeline(() => managerC.get(`${base}/flags/summary`));
    expect(after.pipeline).toBe(true);
    expect((after.res.body as FlagSummary).total).toBe(before.total + 1);
    // Written straight to the database, as another process or psql would.
    await t.knex('flags').where({ project_id: project.id }).update({ status: 'answered' });
    await t.settled();
    const overview = (await managerC.get(`${base}/overview`)).body as ProjectOverview;
    expect(overview.totals.flagsAnswered).toBe(1);
  });

  it('does not replay to another person, another address, or a client without the CSRF cookie', async () => {
    await managerC.get(`${base}/overview`);
    const checkersRead = await throughPipeline(() => checkerC.get(`${base}/overview`));
    expect(checkersRead.pipeline).toBe(true);
    const otherAddress = await throughPipeline(() => managerC.get(`${base}/overview/`));
    expect(otherAddress.pipeline).toBe(true);
    const onlySession = await throughPipeline(() => request(t.http).get(`${base}/overview`).set('Cookie', `${SESSION_COOKIE}=${managerC.cookie(SESSION_COOKIE)}`));
    expect(onlySession.pipeline).toBe(true);
    expect(onlySession.res.status).toBe(200);
    // The pipeline hands that client its CSRF cookie, as on any first read.
    expect((onlySession.res.headers['set-cookie'] as unknown as string[]).some((c) => c.startsWith(`${CSRF_COOKIE}=`))).toBe(true);
    const anonymous = await request(t.http).get(`${base}/overview`);
    expect(anonymous.status).toBe(401);
  });

  it('a session signed out is refused at once, even with its old cookie', async () => {
    const other = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    await other.get(`${base}/overview`);
    expect((await throughPipeline(() => other.get(`${base}/overview`))).pipeline).toBe(false);
    const oldCookies = `${SESSION_COOKIE}=${other.cookie(SESSION_COOKIE)}; ${CSRF_COOKIE}=${other.cookie(CSRF_COOKIE)}`;
    expect((await other.post('/api/auth/sign-out')).status).toBeLessThan(300);
    const replayed = await request(t.http).get(`${base}/overview`).set('Cookie', oldCookies);
    expect(replayed.status).toBe(401);
  });

  it('a role taken away straight in the database is refused once its notification arrives', async () => {
    const other = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    await other.get(`${base}/flags/summary`);
    expect((await throughPipeline(() => other.get(`${base}/flags/summary`))).pipeline).toBe(false);
    await t.knex('project_roles').where({ project_id: project.id, user_id: engineer.id }).delete();
    await t.settled();
    expect((await other.get(`${base}/flags/summary`)).status).toBe(404);
    await t.knex('project_roles').insert({ project_id: project.id, user_id: engineer.id, role: 'engineer' });
    await t.settled();
  });

  it('goes the whole way on a new UTC day (answers count overdue flags), and moves the session expiry in the database', async () => {
    await managerC.get(`${base}/overview`);
    expect((await throughPipeline(() => managerC.get(`${base}/overview`))).pipeline).toBe(false);
    const sid = decodeURIComponent(managerC.cookie(SESSION_COOKIE)!).slice(2).split('.')[0];
    const expireBefore = (await t.knex('sessions').where({ sid }).first('expire')).expire as Date;
    const realNow = Date.now;
    // A minute later (a session's expiry is written at most once a minute): still replayed, expiry moved.
    const inAMinute = realNow() + 61_000;
    if (new Date(inAMinute).getUTCDate() === new Date(realNow()).getUTCDate()) {
      const clock = jest.spyOn(Date, 'now').mockImplementation(() => inAMinute);
      try {
        expect((await throughPipeline(() => managerC.get(`${base}/overview`))).pipeline).toBe(false);
      } finally {
        clock.mockRestore();
      }
      await new Promise((r) => setTimeout(r, 200)); // the expiry is written after the answer
      const expireAfter = (await t.knex('sessions').where({ sid }).first('expire')).expire as Date;
      expect(expireAfter.getTime()).toBeGreaterThan(expireBefore.getTime());
    }
    const tomorrow = jest.spyOn(Date, 'now').mockImplementation(() => realNow() + 86_400_000);
    try {
      expect((await throughPipeline(() => managerC.get(`${base}/overview`))).pipeline).toBe(true);
    } finally {
      tomorrow.mockRestore();
    }
  });

  it('READ_CACHE=pipeline keeps the door shut (every request through the pipeline)', async () => {
    const other = await TestApp.start({ env: { READ_CACHE: 'pipeline' } });
    try {
      const make = new Factories(other.knex);
      const person = await make.user({ name: 'Ottoline Brask' });
      const p = await make.project({ name: 'Halvercote Yard', team: [[person, 'manager']] });
      const c = await ApiClient.signedIn(other.http, person.email, PASSWORD);
      const reads = jest.spyOn(other.app.get(SessionStore).store, 'get');
      for (let i = 0; i < 3; i++) expect((await c.get(`/api/projects/${p.id}/overview`)).status).toBe(200);
      expect(reads).toHaveBeenCalledTimes(3);
    } finally {
      await other.close();
    }
  });
});
