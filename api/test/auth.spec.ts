import { CSRF_COOKIE, SESSION_COOKIE } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestUser } from './support/factories';
import { TestApp } from './support/test-app';

const BAD_CREDENTIALS = 'That e-mail and password do not match an account; check both and try again.';

describe('signing in and out', () => {
  let t: TestApp;
  let make: Factories;
  let person: TestUser;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    person = await make.user({ name: 'Ines Okafor', email: 'Ines.Okafor@Firm.example' });
  });
  afterAll(() => t.close());

  it('signs in with the right password (e-mail in any case) and says who is signed in', async () => {
    const c = await ApiClient.anonymous(t.http);
    const res = await c.post('/api/auth/sign-in', { email: '  INES.okafor@firm.example ', password: PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ user: { id: person.id, email: 'ines.okafor@firm.example', name: 'Ines Okafor', isAdmin: false } });
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body).toEqual(res.body);
  });

  it('gives a wrong password, an unknown e-mail and a not-yet-accepted invitee the same 401', async () => {
    const invitee = await make.user({ invited: true });
    const c = await ApiClient.anonymous(t.http);
    const wrong = await c.post('/api/auth/sign-in', { email: person.email, password: 'not the password' });
    const unknown = await c.post('/api/auth/sign-in', { email: 'nobody@firm.example', password: PASSWORD });
    const invited = await c.post('/api/auth/sign-in', { email: invitee.email, password: PASSWORD });
    for (const res of [wrong, unknown, invited]) expectError(res, 401, 'BAD_CREDENTIALS', BAD_CREDENTIALS);
    expectError(await c.get('/api/auth/me'), 401, 'UNAUTHENTICATED');
  });

  it('refuses a sign-in with missing fields with 400 naming them', async () => {
    const c = await ApiClient.anonymous(t.http);
    const body = expectError(await c.post('/api/auth/sign-in', { email: person.email }), 400, 'VALIDATION_FAILED');
    expect(body.details).toEqual([{ path: 'body.password', message: 'is required' }]);
  });

  it('renews the session id at sign-in (no session fixation) and rotates the CSRF token', async () => {
    const c = await ApiClient.anonymous(t.http);
    const before = { sid: c.cookie(SESSION_COOKIE), csrf: c.cookie(CSRF_COOKIE) };
    expect(before.sid).toBeDefined();
    expect(before.csrf).toMatch(/^[A-Za-z0-9_-]{43}$/);
    await c.post('/api/auth/sign-in', { email: person.email, password: PASSWORD });
    expect(c.cookie(SESSION_COOKIE)).not.toBe(before.sid);
    expect(c.cookie(CSRF_COOKIE)).not.toBe(before.csrf);
  });

  it('sets the session cookie httpOnly and SameSite=Lax, the CSRF cookie readable', async () => {
    const res = await new ApiClient(t.http).get('/api/auth/me');
    const cookies = res.headers['set-cookie'] as unknown as string[];
    const sid = cookies.find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
    const csrf = cookies.find((c) => c.startsWith(`${CSRF_COOKIE}=`))!;
    expect(sid).toMatch(/; HttpOnly/);
    expect(sid).toMatch(/; SameSite=Lax/);
    expect(sid).not.toMatch(/; Secure/); // PUBLIC_URL is http in tests
    expect(csrf).not.toMatch(/HttpOnly/);
    expect(csrf).toMatch(/; SameSite=Lax/);
  });

  it('signs out: the session no longer works', async () => {
    const c = await ApiClient.signedIn(t.http, person.email, PASSWORD);
    const res = await c.post('/api/auth/sign-out');
    expect(res.status).toBe(204);
    expect(res.text).toBe('');
    expectError(await c.get('/api/auth/me'), 401, 'UNAUTHENTICATED');
    // Signing out twice is harmless.
    expect((await c.post('/api/auth/sign-out')).status).toBe(204);
  });

  it('reads the signed-in person afresh on every request: a rename or admin change shows at once, a deactivated account is signed out', async () => {
    const other = await make.user({ name: 'Tomas Reyes' });
    const c = await ApiClient.signedIn(t.http, other.email, PASSWORD);
    // Several requests at once on one session: each sees the person (the session's read is shared by none).
    const all = await Promise.all([1, 2, 3, 4, 5, 6].map(() => c.get('/api/auth/me')));
    expect(all.map((r) => [r.status, r.body.user.name])).toEqual(Array(6).fill([200, 'Tomas Reyes']));
    await t.knex('users').where({ id: other.id }).update({ name: 'Tomás Reyes', is_admin: true });
    expect((await c.get('/api/auth/me')).body.user).toMatchObject({ name: 'Tomás Reyes', isAdmin: true });
    await t.knex('users').where({ id: other.id }).update({ password_hash: null });
    expectError(await c.get('/api/auth/me'), 401, 'UNAUTHENTICATED');
  });

  it('keeps the session across an api restart (sessions live in PostgreSQL)', async () => {
    const c = await ApiClient.signedIn(t.http, person.email, PASSWORD);
    await t.restart();
    c.rebind(t.http);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe(person.email);
    // The CSRF token from before the restart still works too.
    expect((await c.post('/api/auth/sign-out')).status).toBe(204);
  });
});

describe('changing the password', () => {
  let t: TestApp;
  let make: Factories;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
  });
  afterAll(() => t.close());

  it('needs the current password and a long enough new one, and then only the new one works', async () => {
    const user = await make.user({ name: 'Tomas Brandvik' });
    const c = await ApiClient.signedIn(t.http, user.email, PASSWORD);
    const elsewhere = await ApiClient.signedIn(t.http, user.email, PASSWORD);

    const wrong = expectError(await c.post('/api/auth/password', { currentPassword: 'guess guess guess', newPassword: 'a brand new secret' }), 400, 'VALIDATION_FAILED');
    expect(wrong.details).toEqual([{ path: 'body.currentPassword', message: 'is not your current password; type it again' }]);
    const short = expectError(await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'short' }), 400, 'VALIDATION_FAILED');
    expect(short.details).toEqual([{ path: 'body.newPassword', message: 'must be at least 10 characters' }]);

    const ok = await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'a brand new secret' });
    expect(ok.status).toBe(204);
    // This session stays; the other one was signed out.
    expect((await c.get('/api/auth/me')).status).toBe(200);
    expectError(await elsewhere.get('/api/auth/me'), 401, 'UNAUTHENTICATED');

    const fresh = await ApiClient.anonymous(t.http);
    expectError(await fresh.post('/api/auth/sign-in', { email: user.email, password: PASSWORD }), 401, 'BAD_CREDENTIALS');
    expect((await fresh.post('/api/auth/sign-in', { email: user.email, password: 'a brand new secret' })).status).toBe(200);

    const logged = await t.knex('activity').where({ actor_id: user.id, action: 'account.password_changed' }).select('project_id', 'summary');
    expect(logged).toEqual([{ project_id: null, summary: 'Tomas Brandvik changed their password' }]);
  });

  it('is for signed-in people only', async () => {
    const c = await ApiClient.anonymous(t.http);
    expectError(await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'a brand new secret' }), 401, 'UNAUTHENTICATED');
  });
});

describe('CSRF protection', () => {
  let t: TestApp;
  let user: TestUser;

  beforeAll(async () => {
    t = await TestApp.start();
    user = await new Factories(t.knex).user();
  });
  afterAll(() => t.close());

  it('sets the CSRF cookie on any first GET, even a 401', async () => {
    const c = new ApiClient(t.http);
    expect(c.csrfToken).toBeUndefined();
    expectError(await c.get('/api/auth/me'), 401, 'UNAUTHENTICATED');
    expect(c.csrfToken).toMatch(/^[A-Za-z0-9_-]{43}$/);
  });

  it('protects the sign-in itself: no token or a wrong token is 403 CSRF_INVALID', async () => {
    const c = await ApiClient.anonymous(t.http);
    expectError(await c.post('/api/auth/sign-in', { email: user.email, password: PASSWORD }, { csrf: false }), 403, 'CSRF_INVALID');
    expectError(await c.post('/api/auth/sign-in', { email: user.email, password: PASSWORD }, { csrfToken: 'x'.repeat(43) }), 403, 'CSRF_INVALID');
    // A client that never made a GET has no session token at all.
    const cold = new ApiClient(t.http);
    expectError(await cold.post('/api/auth/sign-in', { email: user.email, password: PASSWORD }, { csrfToken: c.csrfToken }), 403, 'CSRF_INVALID');
    expectError(await c.get('/api/auth/me'), 401, 'UNAUTHENTICATED');
  });

  it('protects every state-changing request of a signed-in person, and changes nothing', async () => {
    const c = await ApiClient.signedIn(t.http, user.email, PASSWORD);
    const before = await t.counts();
    expectError(await c.post('/api/auth/password', { currentPassword: PASSWORD, newPassword: 'changed by a forged page' }, { csrf: false }), 403, 'CSRF_INVALID');
    expectError(await c.post('/api/auth/sign-out', undefined, { csrfToken: 'forged' }), 403, 'CSRF_INVALID');
    expectError(await c.patch('/api/projects/1', { name: 'x' }, { csrf: false }), 403, 'CSRF_INVALID');
    expectError(await c.delete('/api/projects/1/team/1', { csrf: false }), 403, 'CSRF_INVALID');
    expect(await t.counts()).toEqual(before);
    expect((await c.get('/api/auth/me')).status).toBe(200);
  });
});

describe('sign-in rate limit', () => {
  let t: TestApp;
  let user: TestUser;

  beforeAll(async () => {
    t = await TestApp.start({ env: { SIGN_IN_RATE_LIMIT: '3/1m' } });
    user = await new Factories(t.knex).user();
  });
  afterAll(() => t.close());

  it('answers 429 after too many failed sign-ins for one e-mail, even with the right password', async () => {
    const c = await ApiClient.anonymous(t.http);
    for (let i = 0; i < 3; i++) {
      expectError(await c.post('/api/auth/sign-in', { email: user.email, password: `wrong ${i} password` }), 401, 'BAD_CREDENTIALS');
    }
    const limited = await c.post('/api/auth/sign-in', { email: user.email, password: PASSWORD });
    expectError(limited, 429, 'RATE_LIMITED', /Wait about 1 minute and try again/);
    expect(Number(limited.headers['retry-after'])).toBeGreaterThan(0);

    // Another e-mail from the same address is counted apart.
    const other = await new Factories(t.knex).user();
    expect((await c.post('/api/auth/sign-in', { email: other.email, password: PASSWORD })).status).toBe(200);
  });

  it('counts in PostgreSQL, so a restarted (or second) api process still refuses', async () => {
    const victim = await new Factories(t.knex).user();
    const c = await ApiClient.anonymous(t.http);
    for (let i = 0; i < 3; i++) await c.post('/api/auth/sign-in', { email: victim.email, password: 'wrong password!' });
    await t.restart();
    c.rebind(t.http);
    expectError(await c.post('/api/auth/sign-in', { email: victim.email, password: PASSWORD }), 429, 'RATE_LIMITED');
    const rows = await t.knex('rate_limit_hits').where('key', 'like', `%${victim.email}`).select('hits');
    expect(rows).toEqual([{ hits: 4 }]);
  });
});
