import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestUser } from './support/factories';
import { TestApp } from './support/test-app';

/**
 * Sessions roll: someone who keeps using Sagline stays signed in, because
 * each use pushes the session's expiry in PostgreSQL forward. Writing that
 * expiry on every request would be one UPDATE per GET, so a process writes
 * it at most once a minute per session (api/src/db/session-store.ts).
 */
describe('session expiry', () => {
  let t: TestApp;
  let person: TestUser;

  beforeAll(async () => {
    t = await TestApp.start();
    person = await new Factories(t.knex).user();
  });
  afterAll(() => t.close());

  const sidOf = (c: ApiClient) => decodeURIComponent(c.cookie('sagline_sid')!).replace(/^s:/, '').split('.')[0];
  const expiry = async (sid: string) => ((await t.knex('sessions').where({ sid }).first('expire')) as { expire: Date }).expire.getTime();

  it('moves a used session’s expiry forward, and writes it once a minute, not on every request', async () => {
    const c = await ApiClient.signedIn(t.http, person.email, PASSWORD);
    const sid = sidOf(c);
    // As if the session had been idle for a week: its expiry is a week closer.
    await t.knex('sessions').where({ sid }).update({ expire: t.knex.raw(`expire - interval '7 days'`) });
    const idle = await expiry(sid);

    expect((await c.get('/api/auth/me')).status).toBe(200);
    const used = await expiry(sid);
    expect(used - idle).toBeGreaterThan(6.9 * 86_400_000);

    // Within the minute, more requests leave the stored expiry alone (and the person signed in).
    await t.knex('sessions').where({ sid }).update({ expire: t.knex.raw(`expire - interval '1 day'`) });
    const before = await expiry(sid);
    for (let i = 0; i < 5; i++) expect((await c.get('/api/auth/me')).status).toBe(200);
    expect(await expiry(sid)).toBe(before);
  });

  it('a new process writes the expiry on its first request for the session', async () => {
    const c = await ApiClient.signedIn(t.http, person.email, PASSWORD);
    const sid = sidOf(c);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    await t.knex('sessions').where({ sid }).update({ expire: t.knex.raw(`expire - interval '3 days'`) });
    const before = await expiry(sid);
    await t.restart();
    c.rebind(t.http);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expect((await expiry(sid)) - before).toBeGreaterThan(2.9 * 86_400_000);
  });
});
