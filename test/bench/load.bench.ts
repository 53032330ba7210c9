/**
 * Load benchmark (a script, not a test), from the repository root, after `npm run build`:
 *   npx tsx test/bench/load.bench.ts [--connections 50] [--seconds 10] [--workers 1] [--keep]
 *
 * Builds a 10,000-member, 2,000-flag project in a throwaway database, starts
 * the built api (`node api/dist/main.js`, NODE_ENV=production) on its own
 * port, signs in 50 sessions (one per connection, shared round the project's
 * seven people) and runs autocannon against the screens opened most:
 *   - a Members page:   GET /api/projects/:id/members?verdict=fail&sort=-utilization&page=2
 *   - the flags summary: GET /api/projects/:id/flags/summary
 *   - the Overview:      GET /api/projects/:id/overview
 * each with 50 concurrent connections on loopback, after a short warm-up,
 * and prints p50, p95 and p99 latency (from every response's own time),
 * requests per second, and the CPU time a request costs in the api process
 * and in the PostgreSQL backends (from /proc: what a request costs however
 * busy the machine is), with the throughput two idle cores could give at that
 * cost. Target: p95 ≤ 50 ms.
 *
 * The project is made the way people make it: the schedule is uploaded and
 * committed through the api (the import runs as its background job), the
 * 2,000 flags are raised through the api's bulk raise (4 × 500 marks, each
 * batch assigned to another reviewer); only their later statuses (answered,
 * closed, waived, some overdue) are set in SQL, to spare 2,000 requests.
 *
 * PostgreSQL: DATABASE_URL's server when set, else a private cluster in
 * .data/bench-load on port 54369; always a throwaway database, dropped at the
 * end (`--keep` keeps it and prints its URL). The api listens on LOAD_PORT (4196).
 *
 * `--workers n` starts the api with API_WORKERS=n (n processes sharing the port, node:cluster);
 * the api's CPU is then that of all its processes.
 *
 * Each route is measured three times, back to back: on a second api started with READ_CACHE=off
 * (port LOAD_PORT + 1: every session, role and answer read from PostgreSQL), on a third with
 * READ_CACHE=pipeline (LOAD_PORT + 3: sessions, roles and answers kept in memory until the data
 * changes, api/src/db/read-cache.ts, but every request through the whole pipeline: what a first
 * read of a page costs) and on the api as shipped (the same, and a repeated read answered at the
 * door, api/src/db/answer-replay.ts); a last line gives the ratios, which hold better than any
 * one figure on this shared machine. A fourth line measures the shipped api again while the checker
 * comments on a flag every second (a busy project: every write sends every session's next read
 * the whole way). Before them, the same
 * load on the stack's own floor (stack-floor.server.ts: Express, helmet and express-session
 * answering a small JSON object; no Nest, no database): no route of the api can beat it.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';

/* eslint-disable @typescript-eslint/no-require-imports */
const ROOT = path.resolve(__dirname, '..', '..');
const { CSRF_COOKIE, CSRF_HEADER } = require(path.join(ROOT, 'common/src/api-types/auth.ts')) as typeof import('../../common/src/api-types/auth');
const say = (s: string) => process.stdout.write(`${s}\n`);
const LEVELS = ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'];
const PASSWORD = 'load-bench-password-1';
const MEMBERS = 10_000;
const FLAGS = 2_000;

function arg(name: string, fallback: number): number {
  const i = process.argv.indexOf(`--${name}`);
  return i > 0 ? Number(process.argv[i + 1]) : fallback;
}

interface AutocannonResult {
  duration: number;
  requests: { total: number };
  non2xx: number;
  errors: number;
  timeouts: number;
}
type Autocannon = ((opts: Record<string, unknown>) => { on(event: 'response', cb: (client: unknown, status: number, bytes: number, ms: number) => void): void } & PromiseLike<AutocannonResult>);

/** A signed-in client of the api under test: cookies and the CSRF header, as the web client sends them. */
class Session {
  private readonly cookies = new Map<string, string>();
  constructor(private readonly base: string) {}

  get cookieHeader(): string {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  async request(method: string, url: string, body?: unknown): Promise<{ status: number; body: any }> {
    const headers: Record<string, string> = { cookie: this.cookieHeader };
    const csrf = this.cookies.get(CSRF_COOKIE);
    if (method !== 'GET' && csrf) headers[CSRF_HEADER] = csrf;
    let payload: FormData | string | undefined;
    if (body instanceof FormData) payload = body;
    else if (body !== undefined) {
      headers['content-type'] = 'application/json';
      payload = JSON.stringify(body);
    }
    const res = await fetch(this.base + url, { method, headers, body: payload });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq).trim(), pair.slice(eq + 1).trim());
    }
    const text = await res.text();
    let parsed: unknown = text;
    try {
      parsed = text ? JSON.parse(text) : null;
    } catch {
      /* not JSON */
    }
    return { status: res.status, body: parsed };
  }

  async ok(method: string, url: string, body?: unknown): Promise<any> {
    const res = await this.request(method, url, body);
    if (res.status >= 300) throw new Error(`${method} ${url} → ${res.status} ${JSON.stringify(res.body).slice(0, 400)}`);
    return res.body;
  }
}

async function waitFor(url: string, api: ChildProcess, ms: number): Promise<void> {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (api.exitCode !== null) throw new Error(`the api exited (${api.exitCode}) before answering`);
    try {
      const res = await fetch(url);
      if (res.status < 500) return;
    } catch {
      /* not listening yet */
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`the api did not answer ${url} within ${ms / 1000} s`);
}

/** CPU seconds (user + system) a process has used so far, from /proc (Linux, 100 ticks a second); null when unknown. */
function cpuSeconds(pid: number): number | null {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return null;
  }
}

/** CPU seconds of a process and its children (the workers of API_WORKERS). */
function treeCpuSeconds(pid: number): number | null {
  const own = cpuSeconds(pid);
  if (own === null) return null;
  let children: number[] = [];
  try {
    children = fs.readFileSync(`/proc/${pid}/task/${pid}/children`, 'utf8').trim().split(/\s+/).filter(Boolean).map(Number);
  } catch {
    /* no children list */
  }
  return children.reduce((sum, c) => sum + (cpuSeconds(c) ?? 0), own);
}

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}

async function main(): Promise<void> {
  const connections = arg('connections', 50);
  const seconds = arg('seconds', 10);
  const keep = process.argv.includes('--keep');
  const workers = arg('workers', 1);
  const port = Number(process.env.LOAD_PORT ?? 4196);
  const mainJs = path.join(ROOT, 'api', 'dist', 'main.js');
  if (!fs.existsSync(mainJs)) throw new Error('api/dist/main.js is missing: run `npm run build` first');

  const { floorBeams, xlsxOf } = require(path.join(ROOT, 'api/test/fixtures/schedule-files.ts')) as typeof import('../../api/test/fixtures/schedule-files');
  const { createKnex, migrateLatest, hashPassword } = require(path.join(ROOT, 'database/index.ts')) as typeof import('../../database/index');
  const autocannon = require('autocannon') as Autocannon;

  let cluster: { stop(): void } | null = null;
  let server: string;
  if (process.env.DATABASE_URL) {
    server = process.env.DATABASE_URL.replace(/\/[^/]*$/, '');
  } else {
    const importEsm = new Function('s', 'return import(s)') as (s: string) => Promise<{ startCluster(o: { dataDir: string; port: number }): { url: string; stop(): void } }>;
    const mod = await importEsm(pathToFileURL(path.join(ROOT, 'database/scripts/pg-cluster.mjs')).href);
    const started = mod.startCluster({ dataDir: path.join(ROOT, '.data', 'bench-load'), port: 54369 });
    cluster = started;
    server = started.url.replace(/\/[^/]*$/, '');
  }
  const dbName = `sagline_load_${process.pid}`;
  const admin = createKnex(`${server}/postgres`, { min: 0, max: 1 });
  await admin.raw(`drop database if exists "${dbName}" with (force)`);
  await admin.raw(`create database "${dbName}"`);
  const url = `${server}/${dbName}`;
  const knex = createKnex(url, { min: 0, max: 2 });
  let api: ChildProcess | null = null;
  let uncached: ChildProcess | null = null;
  let pipeline: ChildProcess | null = null;
  let floor: ChildProcess | null = null;
  try {
    await migrateLatest(knex);
    // People: the engineer uploads, a checker raises, four more engineers get the flags, the manager watches.
    const hash = await hashPassword(PASSWORD);
    const people = [
      { email: 'load.manager@firm.example', name: 'Load Manager', role: 'manager' },
      { email: 'load.engineer@firm.example', name: 'Load Engineer', role: 'engineer' },
      { email: 'load.checker@firm.example', name: 'Load Checker', role: 'checker' },
      ...[1, 2, 3, 4].map((k) => ({ email: `load.reviewer${k}@firm.example`, name: `Load Reviewer ${k}`, role: 'engineer' })),
    ];
    const ids: Record<string, number> = {};
    for (const p of people) {
      const [u] = await knex('users').insert({ email: p.email, name: p.name, password_hash: hash }).returning('id');
      ids[p.email] = u.id;
    }
    const [project] = await knex('projects').insert({ name: 'Load Bench Tower', number: 'LB-1', unit_system: 'SI' }).returning('id');
    await knex('levels').insert(LEVELS.map((name, position) => ({ project_id: project.id, name, position })));
    await knex('project_roles').insert(people.map((p) => ({ project_id: project.id, user_id: ids[p.email], role: p.role })));
    const reviewers = [1, 2, 3, 4].map((k) => ids[`load.reviewer${k}@firm.example`]);

    say(`api: node api/dist/main.js on 127.0.0.1:${port} (NODE_ENV=production, ${workers === 1 ? 'one process' : `API_WORKERS=${workers}: ${workers} processes`}), database ${dbName}`);
    const sessionSecret = randomBytes(48).toString('base64');
    const startApi = async (apiPort: number, readCache: 'on' | 'pipeline' | 'off'): Promise<ChildProcess> => {
      // As the start command runs it (API_NODE_FLAGS in database/scripts/stack.mjs).
      const child = spawn(process.execPath, ['--max-semi-space-size=64', mainJs], {
        cwd: ROOT,
        env: {
          PATH: process.env.PATH,
          NODE_ENV: 'production',
          DATABASE_URL: url,
          HOST: '127.0.0.1',
          PORT: String(apiPort),
          PUBLIC_URL: `http://127.0.0.1:${apiPort}`,
          // The same secret: a session cookie of one api works on the other.
          SESSION_SECRET: sessionSecret,
          // Mail goes to the outbox; nothing listens here, and the retry timer is off.
          SMTP_URL: 'smtp://127.0.0.1:9',
          MAIL_RETRY_SECONDS: '0',
          SIGN_IN_RATE_LIMIT: '1000/1m',
          JOBS_POLL_SECONDS: '0.5',
          API_WORKERS: String(workers),
          READ_CACHE: readCache,
        },
        stdio: ['ignore', 'pipe', 'pipe'],
      });
      let log = '';
      child.stdout!.on('data', (d: Buffer) => (log += d.toString()));
      child.stderr!.on('data', (d: Buffer) => (log += d.toString()));
      await waitFor(`http://127.0.0.1:${apiPort}/api/health`, child, 60_000).catch((e: Error) => {
        throw new Error(`${e.message}\n${log}`);
      });
      return child;
    };
    api = await startApi(port, 'on');
    const base = `http://127.0.0.1:${port}`;

    const signIn = async (email: string): Promise<Session> => {
      const s = new Session(base);
      await s.request('GET', '/api/auth/me');
      await s.ok('POST', '/api/auth/sign-in', { email, password: PASSWORD });
      return s;
    };

    // 1. The schedule, through the api: upload (preview), commit (a background job above 2,000 members).
    const engineer = await signIn('load.engineer@firm.example');
    const members = floorBeams(MEMBERS, { levels: LEVELS, failEvery: 12 });
    const form = new FormData();
    form.append('file', new Blob([await xlsxOf(members)]), 'load-bench-schedule.xlsx');
    let t = Date.now();
    const preview = await engineer.ok('POST', `/api/projects/${project.id}/imports`, form);
    const commit = await engineer.ok('POST', `/api/projects/${project.id}/imports/${preview.draftId}/commit`, { label: 'load bench' });
    if (commit.jobId) {
      for (;;) {
        const job = await engineer.ok('GET', `/api/projects/${project.id}/imports/jobs/${commit.jobId}`);
        if (job.state === 'completed') break;
        if (job.state === 'failed') throw new Error(`the import job failed: ${JSON.stringify(job.error)}`);
        await new Promise((r) => setTimeout(r, 250));
      }
    }
    say(`project: ${MEMBERS} members imported through the api in ${((Date.now() - t) / 1000).toFixed(1)} s (${preview.summary.fail} failing)`);

    // 2. 2,000 flags, raised through the api in batches of 500 marks, each batch for another reviewer.
    const checker = await signIn('load.checker@firm.example');
    t = Date.now();
    const marks = members.map((m) => m.mark);
    // Every failing member, then passing ones, evenly over the schedule.
    const failing = marks.filter((_, k) => k % 12 === 11);
    const others = marks.filter((_, k) => k % 12 !== 11).filter((_, k) => k % 4 === 0);
    const flagged = [...failing, ...others].slice(0, FLAGS);
    for (let b = 0; b < flagged.length; b += 500) {
      const due = new Date(Date.now() + (b % 1000 === 0 ? -3 : 14) * 86_400_000).toISOString().slice(0, 10);
      await checker.ok('POST', `/api/projects/${project.id}/flags/bulk`, { marks: flagged.slice(b, b + 500), assigneeId: reviewers[(b / 500) % 4], dueDate: due, comment: 'Please check this member.' });
    }
    // Their later life, in SQL: 20 % answered, 25 % closed, 5 % waived, the rest open.
    await knex.raw(`
      with numbered as (select id, row_number() over (order by id) as n from flags where project_id = ?)
      update flags f set
        status = case when n % 20 = 0 then 'waived' when n % 4 = 1 then 'closed' when n % 5 = 2 then 'answered' else 'open' end,
        waive_reason = case when n % 20 = 0 then 'Within the tolerance agreed with the architect.' else null end,
        updated_at = now() - (n % 30) * interval '1 day'
      from numbered where f.id = numbered.id`, [project.id]);
    const counts = await knex('flags').where({ project_id: project.id }).groupBy('status').select('status').count<{ status: string; count: string }[]>('* as count');
    say(`flags: ${flagged.length} raised through the api in ${((Date.now() - t) / 1000).toFixed(1)} s; ${counts.map((c) => `${c.count} ${c.status}`).join(', ')}`);
    // The steady state a project reaches a minute after an import: autovacuum has set the new rows'
    // visibility and hint bits and gathered statistics. Measuring before that measures the first readers
    // doing autovacuum's work.
    await knex.raw('vacuum analyze');

    // 3. The load: 50 connections, each with its own signed-in session (as 50 browsers would be),
    // shared round the project's seven people; each route on its own.
    const manager = await signIn('load.manager@firm.example');
    const sessions: Session[] = [];
    for (let k = 0; k < connections; k++) sessions.push(k === 0 ? manager : await signIn(people[k % people.length].email));
    const routes = [
      // The floor every signed-in request stands on: session, CSRF token, the user.
      { name: 'Signed-in floor (GET /api/auth/me)', path: '/api/auth/me' },
      { name: 'Members page (fail, -utilization, page 2)', path: `/api/projects/${project.id}/members?verdict=fail&sort=-utilization&page=2` },
      { name: 'Flags summary', path: `/api/projects/${project.id}/flags/summary` },
      { name: 'Overview', path: `/api/projects/${project.id}/overview` },
    ];
    const loadavg = () => os.loadavg().map((x) => x.toFixed(1)).join(' ');
    say(`load: ${connections} connections, ${seconds} s per route after a 3 s warm-up, loopback; target p95 ≤ 50 ms`);
    say(`machine: ${os.cpus().length} cores, load average ${loadavg()} before the runs\n`);
    // CPU per request, of the api process and of the PostgreSQL backends serving this database: what a
    // request costs whatever else the machine is doing, and so what two idle cores could serve.
    const backends = async (): Promise<Map<number, number>> => {
      const { rows } = await knex.raw<{ rows: { pid: number }[] }>('select pid from pg_stat_activity where datname = current_database() and pid <> pg_backend_pid()');
      return new Map(rows.flatMap((r) => (cpuSeconds(r.pid) === null ? [] : [[r.pid, cpuSeconds(r.pid)!] as [number, number]])));
    };
    // The same api with READ_CACHE=off and with READ_CACHE=pipeline beside it (same database and
    // session secret), measured right before the shipped one on each route: the ratios come from one
    // run on one machine state.
    uncached = await startApi(port + 1, 'off');
    const uncachedBase = `http://127.0.0.1:${port + 1}`;
    pipeline = await startApi(port + 3, 'pipeline');
    const pipelineBase = `http://127.0.0.1:${port + 3}`;
    say('| route | api | p50 | p95 | p99 | requests/s | non-2xx | CPU per request: api + PostgreSQL | two idle cores could serve |');
    say('|---|---|---|---|---|---|---|---|---|');
    // A busy project: a comment on a flag every second, through the api (each write moves every
    // process's data version, so every session's next read goes the whole way and the next
    // answer is counted again).
    const commentedFlag = (await knex('flags').where({ project_id: project.id }).orderBy('id').first('id')) as { id: number };
    const commentEverySecond = () => {
      let stop = false;
      let written = 0;
      const loop = (async () => {
        while (!stop) {
          await checker.ok('POST', `/api/projects/${project.id}/flags/${commentedFlag.id}/comments`, { body: 'Load bench: still checking this one.' });
          written++;
          await new Promise((r) => setTimeout(r, 1_000));
        }
      })();
      return async () => {
        stop = true;
        await loop;
        return written;
      };
    };
    const measure = async (target: ChildProcess, url0: string) => {
      let next = 0;
      const opts = {
        url: url0,
        connections,
        headers: { accept: 'application/json' },
        // Each connection its own session; a connection that reconnects takes the next one.
        setupClient: (client: { setHeaders(h: Record<string, string>): void }) =>
          client.setHeaders({ cookie: sessions[next++ % sessions.length].cookieHeader, accept: 'application/json' }),
      };
      await autocannon({ ...opts, duration: 3 });
      const latencies: number[] = [];
      const apiBefore = treeCpuSeconds(target.pid!);
      const dbBefore = await backends();
      const run = autocannon({ ...opts, duration: seconds });
      run.on('response', (_c, _status, _bytes, ms) => latencies.push(ms));
      const result = await run;
      const apiAfter = treeCpuSeconds(target.pid!);
      const dbAfter = await backends();
      let dbCpu = 0;
      for (const [pid, after] of dbAfter) dbCpu += after - (dbBefore.get(pid) ?? 0);
      const n = Math.max(1, result.requests.total);
      const apiMs = apiBefore === null || apiAfter === null ? NaN : ((apiAfter - apiBefore) * 1000) / n;
      const dbMs = (dbCpu * 1000) / n;
      latencies.sort((a, b) => a - b);
      return { result, apiMs, dbMs, p50: percentile(latencies, 50), p95: percentile(latencies, 95), p99: percentile(latencies, 99), rps: result.requests.total / result.duration };
    };
    // The stack's own floor (stack-floor.server.ts): Express + helmet + express-session, no Nest, no database.
    const floorPort = port + 2;
    floor = spawn(process.execPath, [path.join(ROOT, 'node_modules', 'tsx', 'dist', 'cli.mjs'), path.join(__dirname, 'stack-floor.server.ts')], {
      cwd: ROOT,
      env: { PATH: process.env.PATH, NODE_ENV: 'production', PORT: String(floorPort) },
      stdio: ['ignore', 'pipe', 'pipe'],
    });
    await waitFor(`http://127.0.0.1:${floorPort}/floor`, floor, 30_000);
    const floorSession = new Session(`http://127.0.0.1:${floorPort}`);
    await floorSession.ok('GET', '/sign-in');
    {
      const opts = { url: `http://127.0.0.1:${floorPort}/floor`, connections, headers: { cookie: floorSession.cookieHeader, accept: 'application/json' } };
      await autocannon({ ...opts, duration: 3 });
      const latencies: number[] = [];
      const before = treeCpuSeconds(floor.pid!);
      const run = autocannon({ ...opts, duration: seconds });
      run.on('response', (_c, _status, _bytes, ms) => latencies.push(ms));
      const result = await run;
      const after = treeCpuSeconds(floor.pid!);
      latencies.sort((a, b) => a - b);
      const cpuMs = before === null || after === null ? NaN : ((after - before) * 1000) / Math.max(1, result.requests.total);
      const f = (ms: number) => `${ms.toFixed(1)} ms`;
      const p95 = percentile(latencies, 95);
      say(
        `| Stack floor: Express + helmet + express-session, small JSON, no Nest, no database | one process | ${f(percentile(latencies, 50))} | ${f(p95)}${p95 <= 50 ? '' : ' (over 50)'} | ${f(percentile(latencies, 99))} | ${(result.requests.total / result.duration).toFixed(0)} | ${result.non2xx + result.errors + result.timeouts} | ${cpuMs.toFixed(2)} ms | ${(1000 / cpuMs).toFixed(0)} requests/s (one process) |`,
      );
    }
    floor.kill('SIGTERM');
    floor = null;
    for (const route of routes) {
      const probe = await manager.request('GET', route.path);
      if (probe.status !== 200) throw new Error(`GET ${route.path} → ${probe.status} ${JSON.stringify(probe.body).slice(0, 300)}`);
      const runs = [
        { label: 'READ_CACHE=off', m: await measure(uncached, uncachedBase + route.path) },
        { label: 'READ_CACHE=pipeline', m: await measure(pipeline, pipelineBase + route.path) },
        { label: 'as shipped (on)', m: await measure(api, base + route.path) },
      ];
      const stopComments = commentEverySecond();
      runs.push({ label: 'as shipped, a flag comment every second', m: await measure(api, base + route.path) });
      await stopComments();
      for (const { label, m } of runs) {
        // Each api process uses one core at most; they and PostgreSQL share two.
        const ceiling = Math.min((Math.min(workers, 2) * 1000) / m.apiMs, 2000 / (m.apiMs + m.dbMs));
        const f = (ms: number) => `${ms.toFixed(1)} ms`;
        say(
          `| ${route.name} | ${label} | ${f(m.p50)} | ${f(m.p95)}${m.p95 <= 50 ? '' : ' (over 50)'} | ${f(m.p99)} | ${m.rps.toFixed(0)} | ${m.result.non2xx + m.result.errors + m.result.timeouts} | ${m.apiMs.toFixed(2)} + ${m.dbMs.toFixed(2)} ms | ${Number.isFinite(ceiling) ? `${ceiling.toFixed(0)} requests/s` : '?'} |`,
        );
      }
      const [off, inside, on] = runs.map((r) => r.m);
      const ratio = (a: typeof on, b: typeof on) => `| ${(a.p95 / b.p95).toFixed(2)}× | | ${(a.rps / b.rps).toFixed(2)}× | | ${((a.apiMs + a.dbMs) / (b.apiMs + b.dbMs)).toFixed(2)}× CPU | |`;
      say(`|   | on ÷ off | ${ratio(on, off)}`);
      say(`|   | on ÷ pipeline | ${ratio(on, inside)}`);
    }
    say(`\nload average after the runs: ${loadavg()}`);
    if (keep) say(`kept: ${url}`);
  } finally {
    api?.kill('SIGTERM');
    uncached?.kill('SIGTERM');
    pipeline?.kill('SIGTERM');
    floor?.kill('SIGTERM');
    await knex.destroy();
    if (!keep) await admin.raw(`drop database if exists "${dbName}" with (force)`);
    await admin.destroy();
    cluster?.stop();
  }
}

main().catch((e: unknown) => {
  process.stderr.write(`load bench failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exit(1);
});
