import request from 'supertest';
import { SESSION_COOKIE, type FlagSummary, type MembersPage, type ProjectOverview } from '@sagline/common/api-types';
import { DataVersion } from '../src/db/data-version';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * The api keeps sessions, roles and the answers of its busiest reads in
 * memory (db/read-cache.ts) until PostgreSQL tells it the data changed. What
 * a person must never see: an answer older than a change they made, or older
 * (by more than the notification's trip) than a change someone else made
 * through another process, psql or a job; a session or a role that was taken
 * away still working.
 */
describe('answers kept in memory follow every change', () => {
  let t: TestApp;
  let project: TestProject;
  let checker: TestUser;
  let engineer: TestUser;
  let manager: TestUser;
  let checkerC: ApiClient;
  let managerC: ApiClient;
  let base: string;

  /** Asks until `ok` holds (a change by another connection arrives with its notification), at most 3 s. */
  async function eventually<T>(ask: () => Promise<T>, ok: (v: T) => boolean): Promise<T> {
    const until = Date.now() + 3_000;
    for (;;) {
      const v = await ask();
      if (ok(v) || Date.now() > until) return v;
      await new Promise((r) => setTimeout(r, 25));
    }
  }

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    checker = await make.user({ name: 'Priya Castellanos' });
    engineer = await make.user({ name: 'Kasimir Oduya' });
    manager = await make.user({ name: 'Mireille Fontaine' });
    project = await make.project({ name: 'Halvercote Yard', team: [[checker, 'checker'], [engineer, 'engineer'], [manager, 'manager']] });
    await new MembersFactory(t).revision(project.id, engineer.id, [
      { mark: 'B1', I: 20 },
      { mark: 'B2', I: 20 },
      { mark: 'B3', I: 100 },
    ]);
    checkerC = await ApiClient.signedIn(t.http, checker.email, PASSWORD);
    managerC = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
    base = `/api/projects/${project.id}`;
  });

  afterAll(async () => {
    await t?.close();
  });

  it('listens for changes once started', () => {
    expect(t.app.get(DataVersion).current()).not.toBeNull();
  });

  it('shows a change this person made on their very next read, without waiting for the notification', async () => {
    const before = (await managerC.get(`${base}/flags/summary`)).body as FlagSummary;
    await managerC.get(`${base}/overview`);
    const raised = await checkerC.post(`${base}/flags`, { mark: 'B1', checkName: 'L/360 live', assigneeId: engineer.id });
    expect(raised.status).toBe(201);
    // The checker's own next reads, at once.
    const summary = (await checkerC.get(`${base}/flags/summary`)).body as FlagSummary;
    expect(summary.total).toBe(before.total + 1);
    const overview = (await checkerC.get(`${base}/overview`)).body as ProjectOverview;
    expect(overview.totals.flagsOpen).toBe(1);
  });

  it('a writing request moves the version itself: its answer is never followed by an older read, notification or not', async () => {
    const version = t.app.get(DataVersion);
    // Deaf to notifications for this test: only the api's own bump can refresh what it keeps.
    const listener = (version as unknown as { client: { query(sql: string): Promise<unknown> } }).client;
    await listener.query('UNLISTEN *');
    try {
      const before = (await managerC.get(`${base}/overview`)).body as ProjectOverview;
      const level = before.levels.find((l) => l.level?.name === 'L1')!;
      const flags = (await managerC.get(`${base}/flags?status=open`)).body as { items: { id: number; version: number }[] };
      for (const f of flags.items) {
        const closed = await checkerC.post(`${base}/flags/${f.id}/waive`, { version: f.version, reason: 'Agreed with the engineer of record.' });
        expect(closed.status).toBe(200);
      }
      const signed = await checkerC.post(`${base}/levels/${level.level!.id}/sign-off`, {});
      expect(signed.status).toBe(201);
      const after = (await checkerC.get(`${base}/overview`)).body as ProjectOverview;
      expect(after.levels.find((l) => l.level?.name === 'L1')!.signOff?.state).toBe('signed');
    } finally {
      await listener.query(`LISTEN sagline_data_changed`);
    }
  });

  it('shows a change written by another connection (another api process, psql, a job) once its notification arrives', async () => {
    const page = async () => (await managerC.get(`${base}/members?sort=mark`)).body as MembersPage;
    expect((await page()).items.map((m) => m.verdict)).toEqual(['fail', 'fail', 'pass']);
    // Written as another process would: straight to the database.
    await t.knex('members').where({ mark: 'B3' }).update({ verdict: 'fail' });
    const after = await eventually(page, (p) => p.items[2].verdict === 'fail');
    expect(after.items.map((m) => m.verdict)).toEqual(['fail', 'fail', 'fail']);
    await t.knex('members').where({ mark: 'B3' }).update({ verdict: 'pass' });
    await t.settled();
    expect((await page()).items[2].verdict).toBe('pass');
  });

  it('a renamed person shows under the new name (people are part of the watched data)', async () => {
    await managerC.get('/api/auth/me');
    await t.knex('users').where({ id: manager.id }).update({ name: 'Mireille Fontaine-Arlen' });
    await t.settled();
    expect((await managerC.get('/api/auth/me')).body.user.name).toBe('Mireille Fontaine-Arlen');
  });

  it('a session ended elsewhere (signed out in another process) stops working', async () => {
    const other = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    expect((await other.get(`${base}/overview`)).status).toBe(200);
    await t.knex('sessions').whereRaw(`sess -> 'passport' ->> 'user' = ?`, [String(engineer.id)]).delete();
    await t.settled();
    expect((await other.get(`${base}/overview`)).status).toBe(401);
  });

  it('a role taken away elsewhere is refused at once after the notification', async () => {
    const viewer = await new Factories(t.knex).user({ name: 'Dalia Stroud' });
    await t.knex('project_roles').insert({ project_id: project.id, user_id: viewer.id, role: 'viewer' });
    await t.settled();
    const viewerC = await ApiClient.signedIn(t.http, viewer.email, PASSWORD);
    expect((await viewerC.get(`${base}/members`)).status).toBe(200);
    await t.knex('project_roles').where({ project_id: project.id, user_id: viewer.id }).delete();
    await t.settled();
    expect((await viewerC.get(`${base}/members`)).status).toBe(404);
  });

  it('answers from the database while the notification connection is lost, and listens again', async () => {
    const version = t.app.get(DataVersion);
    const page = async () => (await managerC.get(`${base}/members?sort=mark`)).body as MembersPage;
    await page();
    await t.knex.raw(`select pg_terminate_backend(pid) from pg_stat_activity where application_name = 'sagline-api-listen' and datname = current_database()`);
    await eventually(async () => version.current(), (v) => v === null);
    expect(version.current()).toBeNull();
    // Nothing can tell the api now; it must read the database.
    await t.knex('members').where({ mark: 'B2' }).update({ verdict: 'pass' });
    expect((await page()).items[1].verdict).toBe('pass');
    await eventually(async () => version.current(), (v) => v !== null);
    expect(version.current()).not.toBeNull();
    await t.knex('members').where({ mark: 'B2' }).update({ verdict: 'fail' });
    await t.settled();
    expect((await page()).items[1].verdict).toBe('fail');
  });

  it('a kept answer is sent as the same bytes with its ETag, and 304 to a client that has them', async () => {
    const cookie = `${SESSION_COOKIE}=${managerC.cookie(SESSION_COOKIE)}`;
    const first = await request(t.http).get(`${base}/overview`).set('Cookie', cookie);
    const second = await request(t.http).get(`${base}/overview`).set('Cookie', cookie);
    expect(first.status).toBe(200);
    expect(first.headers['content-type']).toBe('application/json; charset=utf-8');
    expect(second.text).toBe(first.text);
    expect(second.headers.etag).toBe(first.headers.etag);
    expect(first.headers.etag).toMatch(/^W\/"[0-9a-f]+-/);
    const again = await request(t.http).get(`${base}/overview`).set('Cookie', cookie).set('If-None-Match', first.headers.etag);
    expect(again.status).toBe(304);
  });

  it('a bad query is refused every time, also after the same good query was answered', async () => {
    expect((await managerC.get(`${base}/members?pageSize=5`)).status).toBe(200);
    for (let i = 0; i < 2; i++) {
      const bad = await managerC.get(`${base}/members?pageSize=0`);
      expect(bad.status).toBe(400);
      expect(bad.body.details).toEqual([{ path: 'query.pageSize', message: 'must be 1 or more' }]);
    }
  });
});

describe('READ_CACHE=off', () => {
  let t: TestApp;
  afterAll(async () => {
    await t?.close();
  });

  it('keeps nothing: no notification connection, every answer from the database', async () => {
    t = await TestApp.start({ env: { READ_CACHE: 'off' } });
    expect(t.config.readCache).toBe(false);
    expect(t.app.get(DataVersion).current()).toBeNull();
    const { rows } = await t.knex.raw<{ rows: unknown[] }>(`select 1 from pg_stat_activity where application_name = 'sagline-api-listen' and datname = current_database()`);
    expect(rows).toHaveLength(0);
  });
});
