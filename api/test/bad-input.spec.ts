import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { TestApp } from './support/test-app';

/**
 * Bad requests get a 4xx in the one error shape, say what to fix, and write
 * nothing: every case compares the row counts of every table before and after.
 */
describe('bad input', () => {
  let t: TestApp;
  let admin: ApiClient;
  let project: TestProject;

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const user = await make.user({ isAdmin: true });
    project = await make.project();
    admin = await ApiClient.signedIn(t.http, user.email, PASSWORD);
  });
  afterAll(() => t.close());

  async function unchanged(run: () => Promise<void>): Promise<void> {
    const before = await t.counts();
    await run();
    expect(await t.counts()).toEqual(before);
  }

  it('malformed JSON → 400 MALFORMED_JSON', () =>
    unchanged(async () => {
      expectError(await admin.raw('post', '/api/projects', '{"name": "Tower", "levels": [', 'application/json'), 400, 'MALFORMED_JSON',
        'The request body is not valid JSON: check quotes, commas and brackets.');
    }));

  it('unknown fields → 400 naming each one', () =>
    unchanged(async () => {
      const body = expectError(await admin.post('/api/projects', { name: 'Tower', number: 'T-1', unitSystem: 'SI', levels: ['L1'], owner: 'me', isAdmin: true }), 400, 'VALIDATION_FAILED');
      expect(body.details).toEqual([
        { path: 'body.owner', message: 'is not a field of this request; remove it' },
        { path: 'body.isAdmin', message: 'is not a field of this request; remove it' },
      ]);
    }));

  it('missing and wrong fields → 400 with one detail per field', () =>
    unchanged(async () => {
      const body = expectError(await admin.post('/api/projects', { name: '   ', unitSystem: 'metric', levels: [] }), 400, 'VALIDATION_FAILED');
      expect(body.details).toEqual([
        { path: 'body.name', message: 'is required, e.g. "Halvercote Yard"' },
        { path: 'body.number', message: 'is required' },
        { path: 'body.unitSystem', message: 'must be one of SI, US' },
        { path: 'body.levels', message: 'must name at least one level' },
      ]);
      expect(body.message).toBe('Some fields need fixing: body.name: is required, e.g. "Halvercote Yard"; body.number: is required; body.unitSystem: must be one of SI, US; body.levels: must name at least one level');
    }));

  it('too long values → 400 with the limit', () =>
    unchanged(async () => {
      const body = expectError(await admin.patch(`/api/projects/${project.id}`, { name: 'x'.repeat(161), levels: ['L'.repeat(41)] }), 400, 'VALIDATION_FAILED');
      expect(body.details).toEqual([
        { path: 'body.name', message: 'must be at most 160 characters' },
        { path: 'body.levels', message: 'each level name must be at most 40 characters' },
      ]);
    }));

  it('an oversized body → 413 PAYLOAD_TOO_LARGE', () =>
    unchanged(async () => {
      const huge = { name: 'Tower', number: 'T-1', unitSystem: 'SI', levels: ['L1'], notes: 'x'.repeat(1_100_000) };
      expectError(await admin.post('/api/projects', huge), 413, 'PAYLOAD_TOO_LARGE', 'The request body is larger than the 1024 KiB limit; send less data.');
    }));

  it('a body that is not a JSON object, or not JSON at all → 400', () =>
    unchanged(async () => {
      expectError(await admin.post('/api/projects', ['L1', 'L2']), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body: must be a JSON object');
      expectError(await admin.raw('post', '/api/projects', 'name=Tower', 'text/plain'), 400, 'VALIDATION_FAILED',
        'Some fields need fixing: body: is missing: send a JSON object with the header Content-Type: application/json');
    }));

  it('an unknown API route → 404 in the same shape', async () => {
    expectError(await admin.get('/api/nothing-here'), 404, 'NOT_FOUND', 'There is no API route GET /api/nothing-here; check the address.');
    expectError(await admin.post('/api/projects/1/nothing', {}), 404, 'NOT_FOUND');
    expectError(await admin.get('/not-the-api'), 404, 'NOT_FOUND', 'There is nothing at GET /not-the-api; check the address.');
  });

  it('answers health checks without creating a session', async () => {
    const before = await t.counts(['sessions']);
    const res = await new ApiClient(t.http).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'ok' });
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(await t.counts(['sessions'])).toEqual(before);
  });

  it('sends helmet security headers and a request id', async () => {
    const res = await admin.get('/api/auth/me');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toContain("default-src 'self'");
    expect(res.headers['content-security-policy']).not.toContain('upgrade-insecure-requests');
    expect(res.headers['x-powered-by']).toBeUndefined();
    expect(res.headers['x-request-id']).toMatch(/^[0-9a-f-]{36}$/);
  });
});

describe('serving the built web app', () => {
  let t: TestApp;
  let dir: string;

  beforeAll(async () => {
    dir = fs.mkdtempSync(path.join(os.tmpdir(), 'sagline-web-'));
    fs.mkdirSync(path.join(dir, 'assets'));
    fs.writeFileSync(path.join(dir, 'index.html'), '<!doctype html><title>Sagline</title><div id="root"></div>');
    fs.writeFileSync(path.join(dir, 'assets', 'app-1a2b3c.js'), 'console.log("app")');
    t = await TestApp.start({ env: { WEB_DIST: dir } });
  });
  afterAll(async () => {
    await t.close();
    fs.rmSync(dir, { recursive: true, force: true });
  });

  it('serves files, deep links get index.html, /api stays the API', async () => {
    const c = new ApiClient(t.http);
    const asset = await c.get('/assets/app-1a2b3c.js');
    expect(asset.status).toBe(200);
    expect(asset.headers['cache-control']).toBe('public, max-age=31536000, immutable');
    for (const deep of ['/', '/projects/3/members', '/invitations/abc']) {
      const page = await c.get(deep);
      expect(page.status).toBe(200);
      expect(page.headers['content-type']).toMatch(/text\/html/);
      expect(page.text).toContain('<div id="root">');
      expect(page.headers['cache-control']).toBe('no-cache');
    }
    expectError(await c.get('/assets/missing.js'), 404, 'NOT_FOUND');
    expectError(await c.get('/api/unknown'), 404, 'NOT_FOUND');
  });
});

describe('our own failures', () => {
  it('answer 500 INTERNAL with a request id to quote, never a stack or SQL', async () => {
    const t = await TestApp.start({ quiet: true });
    try {
      const make = new Factories(t.knex);
      const user = await make.user();
      const project = await make.project({ team: [[user, 'viewer']] });
      const c = await ApiClient.signedIn(t.http, user.email, PASSWORD);
      // Break the schema under the running api.
      await t.knex.raw('alter table activity rename to activity_gone');
      const res = await c.get(`/api/projects/${project.id}/activity`);
      const body = expectError(res, 500, 'INTERNAL', /^Something went wrong on our side\. It was logged with request id [0-9a-f-]{36}; please try again\.$/);
      expect(body.message).toContain(res.headers['x-request-id']);
      expect(JSON.stringify(body)).not.toMatch(/activity|relation|select/i);
    } finally {
      await t.close();
    }
  });

  it('health answers 503 when the database is unreachable', async () => {
    const t = await TestApp.start();
    try {
      const { createApp } = await import('../src/app.factory');
      const broken = await createApp({ ...t.config, databaseUrl: `${process.env.SAGLINE_TEST_SERVER}/no_such_database` }, { logger: false });
      try {
        expectError(await new ApiClient(broken.getHttpServer()).get('/api/health'), 503, 'INTERNAL', 'The database is not answering.');
      } finally {
        await broken.close();
      }
    } finally {
      await t.close();
    }
  });
});
