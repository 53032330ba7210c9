import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';
import type { ImportJobStatus } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { TestApp } from './support/test-app';
import { importCounts, uploadFile } from './fixtures/import-client';
import { csvOf, floorBeams } from './fixtures/schedule-files';

/**
 * Large schedules commit as a background job (pg-boss on PostgreSQL) with
 * progress to poll, and stay all or nothing when the process doing the work
 * is killed in the middle: the retried job starts again from scratch and
 * writes the revision exactly once.
 */
const ENV: Record<string, string> = {
  IMPORT_JOB_THRESHOLD: '20',
  IMPORT_JOB_EXPIRE_SECONDS: '8',
  JOBS_POLL_SECONDS: '0.5',
  JOBS_MAINTENANCE_SECONDS: '1',
  JOBS_WORKER: 'on',
};

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('imports: background commits', () => {
  let t: TestApp;
  let project: TestProject;
  let eng: ApiClient;
  const saved: Record<string, string | undefined> = {};
  const setEnv = (vars: Record<string, string>) => {
    for (const [k, v] of Object.entries(vars)) {
      if (!(k in saved)) saved[k] = process.env[k];
      process.env[k] = v;
    }
  };

  beforeAll(async () => {
    setEnv(ENV);
    t = await TestApp.start();
    const f = new Factories(t.knex);
    const engineer = await f.user();
    project = await f.project({ levels: ['L1', 'L2'], team: [[engineer, 'engineer']] });
    eng = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
  });
  afterAll(async () => {
    await t.close();
    for (const [k, v] of Object.entries(saved)) {
      if (v === undefined) delete process.env[k];
      else process.env[k] = v;
    }
  });

  async function draftOf(n: number, name: string): Promise<string> {
    const up = await uploadFile(t, eng, project.id, Buffer.from(csvOf(floorBeams(n, { failEvery: 10 }))), name);
    expect(up.status).toBe(201);
    return up.body.draftId as string;
  }

  async function waitFor(jobId: string, until: (s: ImportJobStatus) => boolean, seconds: number, seen: ImportJobStatus[] = []): Promise<ImportJobStatus> {
    const end = Date.now() + seconds * 1000;
    for (;;) {
      const res = await eng.get(`/api/projects/${project.id}/imports/jobs/${jobId}`);
      expect(res.status).toBe(200);
      seen.push(res.body);
      if (until(res.body)) return res.body;
      if (Date.now() > end) throw new Error(`job ${jobId} did not get there in ${seconds} s: ${JSON.stringify(res.body)}`);
      await sleep(100);
    }
  }

  it('answers 202 with a job id above the threshold, and the job reports progress up to the committed revision', async () => {
    const draftId = await draftOf(30, 'big.csv');
    const res = await eng.post(`/api/projects/${project.id}/imports/${draftId}/commit`, { label: 'Rev B' });
    expect(res.status).toBe(202);
    expect(res.body).toEqual({ jobId: expect.stringMatching(/^[0-9a-f-]{36}$/) });
    // Asking again while it runs joins the same job.
    const again = await eng.post(`/api/projects/${project.id}/imports/${draftId}/commit`, {});
    if (again.status === 202) expect(again.body).toEqual(res.body);

    const seen: ImportJobStatus[] = [];
    const done = await waitFor(res.body.jobId, (s) => s.state === 'completed' || s.state === 'failed', 30, seen);
    expect(done).toEqual({
      jobId: res.body.jobId,
      kind: 'commit',
      state: 'completed',
      progress: 1,
      step: 'Done',
      attempts: 1,
      result: { revision: expect.objectContaining({ number: 1, label: 'Rev B', memberCount: 30, failCount: 3 }) },
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
    const progress = seen.map((s) => s.progress);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
    expect(await importCounts(t)).toMatchObject({ revisions: 1, members: 30, import_drafts: 0 });

    expectError(await eng.get(`/api/projects/${project.id}/imports/jobs/00000000-0000-4000-8000-000000000000`), 404, 'NOT_FOUND');
    expectError(await eng.get(`/api/projects/${project.id}/imports/jobs/not-a-uuid`), 404, 'NOT_FOUND');
  });

  it('survives the worker process being killed mid-commit: nothing half-written, then the retry commits it once', async () => {
    // From here this api only queues; a separate api process does the work, and is killed.
    setEnv({ JOBS_WORKER: 'off' });
    await t.restart();
    eng.rebind(t.http);
    const draftId = await draftOf(5000, 'huge.csv');
    const res = await eng.post(`/api/projects/${project.id}/imports/${draftId}/commit`, {});
    expect(res.status).toBe(202);
    const jobId: string = res.body.jobId;
    // Only queued so far (no worker runs here).
    const before = await importCounts(t);

    const root = path.resolve(__dirname, '..', '..');
    const child: ChildProcess = spawn(process.execPath, ['-r', path.join(__dirname, 'fixtures', 'swc-register.js'), path.join(__dirname, 'fixtures', 'api-process.ts')], {
      cwd: root,
      env: { ...process.env, DATABASE_URL: t.config.databaseUrl, JOBS_WORKER: 'on', PGAPPNAME: 'sagline-doomed-worker' },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    let output = '';
    child.stdout!.on('data', (d) => (output += d));
    child.stderr!.on('data', (d) => (output += d));
    const exited = new Promise<NodeJS.Signals | null>((resolve) => child.on('exit', (_code, signal) => resolve(signal)));

    // Kill it while its commit transaction is open and has written (the revision row, then members…).
    const end = Date.now() + 90_000;
    for (;;) {
      const job = await t.knex('import_jobs').where({ id: jobId }).first('step', 'state');
      const open = await t.knex.raw(
        `select count(*)::int as n from pg_stat_activity where application_name = 'sagline-doomed-worker' and backend_xid is not null and state in ('active', 'idle in transaction')`,
      );
      if (job.step === 'Writing members and results' && open.rows[0].n > 0) break;
      if (job.state === 'completed') throw new Error('the worker finished before it could be killed; make the schedule larger');
      if (Date.now() > end || child.exitCode !== null) throw new Error(`the worker never got to writing: ${JSON.stringify(job)}\n${output}`);
      await sleep(15);
    }
    child.kill('SIGKILL');
    expect(await exited).toBe('SIGKILL');

    // PostgreSQL rolled the open transaction back: no revision, no member, no result; the draft is still there.
    await sleep(200);
    expect(await importCounts(t)).toEqual(before);
    expect(await t.knex('import_jobs').where({ id: jobId }).first('state', 'attempts')).toEqual({ state: 'running', attempts: 1 });

    // An api process with a worker takes the job up again once it has expired, and commits it from scratch.
    setEnv({ JOBS_WORKER: 'on' });
    await t.restart();
    eng.rebind(t.http);
    const done = await waitFor(jobId, (s) => s.state === 'completed' || s.state === 'failed', 90);
    expect(done).toMatchObject({ state: 'completed', progress: 1, result: { revision: { number: 2, memberCount: 5000, failCount: 500 } } });
    // At least the killed start and the one that finished (on a slow machine a start that outlives the
    // short test expiry is started once more; it then finds the revision already written and keeps it).
    expect(done.attempts).toBeGreaterThanOrEqual(2);
    expect(await importCounts(t)).toEqual({
      ...before,
      revisions: before.revisions + 1,
      members: before.members + 5000,
      member_loads: before.member_loads + 10000,
      results: before.results + 10000,
      import_drafts: before.import_drafts - 1,
      activity: before.activity + 1,
    });
  }, 180_000);
});
