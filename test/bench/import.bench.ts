/**
 * Import benchmark (a script, not a test), from the repository root:
 *   npx tsx test/bench/import.bench.ts [members] [--runs N]   (default 10,000 members, 3 runs)
 * Writes a member schedule workbook, then times
 *   (a) exceljs merely reading it (Workbook.xlsx.load), and
 *   (b) the whole import through the api's import service: upload checks,
 *       parse, engine over every member, preview and draft, then the commit
 *       (revision, members, loads, results in one transaction) into a real
 *       PostgreSQL,
 * and prints both, their ratio (target ≤ 2×) and the peak resident memory of
 * the import (target < 500 MB). Each of (a) and (b) runs in a fresh process
 * of its own, three times, interleaved (a, b, a, b, a, b) so that both sides
 * meet the same load on a shared machine; the fastest run of each counts, and
 * the ratio of each pair is printed too. A fresh process is what an upload
 * meets after a deploy, and its peak memory is then the import's own.
 * `--runs N` changes the number of pairs.
 * PostgreSQL: DATABASE_URL's server when set, else the private cluster in
 * .data/bench on port 54349; always a throwaway database, dropped at the end.
 */
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { performance } from 'node:perf_hooks';

/* eslint-disable @typescript-eslint/no-require-imports */
const ROOT = path.resolve(__dirname, '..', '..');
const say = (s: string) => process.stdout.write(`${s}\n`);
const peakMb = () => Math.round(process.resourceUsage().maxRSS / 1024);
const LEVELS = ['L1', 'L2', 'L3', 'L4', 'L5'];

interface Measure {
  ms: number;
  rssMb: number;
  /** CPU time of this process over the measured span (user + system). */
  cpuMs: number;
  /** CPU time of the PostgreSQL backends serving it over the same span (import only). */
  dbCpuMs?: number;
  previewMs?: number;
  commitMs?: number;
  stored?: { members: number; loads: number; results: number; failing: number };
}

/** CPU seconds (user + system) a process has used so far, from /proc (Linux, 100 ticks a second); 0 when unknown. */
function procCpuSeconds(pid: number): number {
  try {
    const stat = fs.readFileSync(`/proc/${pid}/stat`, 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return (Number(fields[11]) + Number(fields[12])) / 100;
  } catch {
    return 0;
  }
}

const cpuMsSince = (start: NodeJS.CpuUsage) => {
  const d = process.cpuUsage(start);
  return (d.user + d.system) / 1000;
};

/** The api's sources need decorator metadata, which tsx (esbuild) does not emit: load them through swc, as jest does. */
function apiSources(): void {
  require(path.join(ROOT, 'api', 'test', 'fixtures', 'swc-register.js'));
}

// ------------------------------------------------------------------ child: (a)
async function measureRead(file: string): Promise<Measure> {
  const ExcelJS = require('exceljs') as typeof import('exceljs');
  const bytes = fs.readFileSync(file);
  const cpu0 = process.cpuUsage();
  const t0 = performance.now();
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  const ms = performance.now() - t0;
  const cpuMs = cpuMsSince(cpu0);
  if (!wb.getWorksheet('Members')) throw new Error('no Members sheet');
  return { ms, cpuMs, rssMb: peakMb() };
}

// ------------------------------------------------------------------ child: (b)
async function measureImport(file: string, url: string, projectId: number, userId: number): Promise<Measure> {
  apiSources();
  const { Module } = require('@nestjs/common') as typeof import('@nestjs/common');
  const { NestFactory } = require('@nestjs/core') as typeof import('@nestjs/core');
  const { parseConfig } = require(path.join(ROOT, 'api/src/config/app-config.ts')) as typeof import('../../api/src/config/app-config');
  const { ConfigModule } = require(path.join(ROOT, 'api/src/config/config.module.ts')) as typeof import('../../api/src/config/config.module');
  const { DbModule } = require(path.join(ROOT, 'api/src/db/db.module.ts')) as typeof import('../../api/src/db/db.module');
  const { AuthModule } = require(path.join(ROOT, 'api/src/auth/auth.module.ts')) as typeof import('../../api/src/auth/auth.module');
  const { ImportsModule } = require(path.join(ROOT, 'api/src/imports/imports.module.ts')) as typeof import('../../api/src/imports/imports.module');
  const { ImportsService } = require(path.join(ROOT, 'api/src/imports/imports.service.ts')) as typeof import('../../api/src/imports/imports.service');
  const { ImportCommitService } = require(path.join(ROOT, 'api/src/imports/import-commit.service.ts')) as typeof import('../../api/src/imports/import-commit.service');
  const { LimitSetsService } = require(path.join(ROOT, 'api/src/checks/limit-sets.service.ts')) as typeof import('../../api/src/checks/limit-sets.service');
  const { KNEX } = require(path.join(ROOT, 'api/src/db/db.tokens.ts')) as typeof import('../../api/src/db/db.tokens');

  // The modules of the api's command line: configuration, database, guards, imports.
  class BenchModule {}
  Module({ imports: [ConfigModule.forRoot(parseConfig({ DATABASE_URL: url, NODE_ENV: 'test', JOBS_WORKER: 'off' })), DbModule, AuthModule, ImportsModule] })(BenchModule);
  const app = await NestFactory.createApplicationContext(BenchModule, { logger: ['error', 'warn'] });
  try {
    // A project's limit-set copy is made once, on its first use, not per import: not timed.
    await app.get(LimitSetsService).forProject(projectId);
    const bytes = fs.readFileSync(file);
    const knex = app.get<import('knex').Knex>(KNEX);
    // The backends of this database (the pool's, local server): their CPU over the span is PostgreSQL's share.
    const backends = async (): Promise<Map<number, number>> => {
      const { rows } = await knex.raw<{ rows: { pid: number }[] }>('select pid from pg_stat_activity where datname = current_database()');
      return new Map(rows.map((r) => [r.pid, procCpuSeconds(r.pid)]));
    };
    const db0 = await backends();
    const cpu0 = process.cpuUsage();
    const t0 = performance.now();
    const preview = await app.get(ImportsService).preview(projectId, userId, { fileName: path.basename(file), bytes });
    const t1 = performance.now();
    const { revision } = await app.get(ImportCommitService).commit(projectId, preview.draftId, { label: 'bench', actorId: userId });
    const t2 = performance.now();
    const cpuMs = cpuMsSince(cpu0);
    let dbCpuMs = 0;
    for (const [pid, after] of await backends()) dbCpuMs += (after - (db0.get(pid) ?? 0)) * 1000;
    const { rows } = await knex.raw(
      `select (select count(*) from members where revision_id = ?)::int as members,
              (select count(*) from member_loads l join members m on m.id = l.member_id where m.revision_id = ?)::int as loads,
              (select count(*) from results where revision_id = ?)::int as results`,
      [revision.id, revision.id, revision.id],
    );
    return { ms: t2 - t0, previewMs: t1 - t0, commitMs: t2 - t1, cpuMs, dbCpuMs, rssMb: peakMb(), stored: { ...rows[0], failing: revision.failCount } };
  } finally {
    await app.close();
  }
}

/** Runs one measurement in a fresh process (this script again, same loader). */
function inChild(args: string[]): Measure {
  // BENCH_CPU_PROF=<folder>: each child also writes a V8 CPU profile there (open it in Chrome's DevTools).
  const prof = process.env.BENCH_CPU_PROF ? ['--cpu-prof', `--cpu-prof-dir=${path.resolve(process.env.BENCH_CPU_PROF)}`] : [];
  const r = spawnSync(process.execPath, [...prof, ...process.execArgv, __filename, ...args], { cwd: ROOT, encoding: 'utf8', env: process.env, maxBuffer: 16 * 1024 * 1024 });
  const line = r.stdout.trim().split('\n').pop() ?? '';
  if (r.status !== 0 || !line.startsWith('{')) throw new Error(`bench child ${args[0]} failed (exit ${r.status}):\n${r.stdout}\n${r.stderr}`);
  return JSON.parse(line) as Measure;
}

// ------------------------------------------------------------------ parent
async function main(): Promise<void> {
  const n = /^\d+$/.test(process.argv[2] ?? '') ? Number(process.argv[2]) : 10_000;
  const { floorBeams, xlsxOf } = require(path.join(ROOT, 'api/test/fixtures/schedule-files.ts')) as typeof import('../../api/test/fixtures/schedule-files');
  const { createKnex, migrateLatest, hashPassword } = require(path.join(ROOT, 'database/index.ts')) as typeof import('../../database/index');

  const members = floorBeams(n, { levels: LEVELS, failEvery: 12 });
  // Every tenth member also carries a point load of each case at midspan, on the Loads sheet.
  const loads = members
    .filter((_, i) => i % 10 === 0)
    .flatMap((m) => ['D', 'L'].map((c) => ({ mark: m.mark, case: c, kind: 'point', position: (m.spans as number) / 2, value: c === 'D' ? 5 : 2 })));
  const file = path.join(ROOT, '.data', 'bench', `schedule-${n}.xlsx`);
  fs.mkdirSync(path.dirname(file), { recursive: true });
  fs.writeFileSync(file, await xlsxOf(members, { loads }));
  say(`workbook: ${n} members, ${loads.length} Loads rows, ${(fs.statSync(file).size / 1024 / 1024).toFixed(1)} MB (${path.relative(ROOT, file)})`);

  let cluster: { stop(): void } | null = null;
  let server: string;
  if (process.env.DATABASE_URL) {
    server = process.env.DATABASE_URL.replace(/\/[^/]*$/, '');
  } else {
    const importEsm = new Function('s', 'return import(s)') as (s: string) => Promise<{ startCluster(o: { dataDir: string; port: number }): { url: string; stop(): void } }>;
    const mod = await importEsm(pathToFileURL(path.join(ROOT, 'database/scripts/pg-cluster.mjs')).href);
    const started = mod.startCluster({ dataDir: path.join(ROOT, '.data', 'bench'), port: 54349 });
    cluster = started;
    server = started.url.replace(/\/[^/]*$/, '');
  }
  const dbName = `sagline_bench_${process.pid}`;
  const admin = createKnex(`${server}/postgres`, { min: 0, max: 1 });
  await admin.raw(`drop database if exists "${dbName}" with (force)`);
  await admin.raw(`create database "${dbName}"`);
  const url = `${server}/${dbName}`;
  const knex = createKnex(url, { min: 0, max: 2 });
  try {
    await migrateLatest(knex);
    const [user] = await knex('users').insert({ email: 'bench.engineer@firm.example', name: 'Bench Engineer', password_hash: await hashPassword('bench-password-1') }).returning('id');
    // One project per run, so every run is a first revision (no diff against an earlier one).
    const runs = process.argv.includes('--runs') ? Number(process.argv[process.argv.indexOf('--runs') + 1]) : 3;
    const projects: number[] = [];
    for (let run = 0; run < runs; run++) {
      const [p] = await knex('projects').insert({ name: `Bench ${run + 1}`, number: `B-${run + 1}`, unit_system: 'SI' }).returning('id');
      await knex('levels').insert(LEVELS.map((name, position) => ({ project_id: p.id, name, position })));
      await knex('project_roles').insert({ project_id: p.id, user_id: user.id, role: 'engineer' });
      projects.push(p.id);
    }

    const reads: Measure[] = [];
    const imports: Measure[] = [];
    for (const p of projects) {
      reads.push(inChild(['read', file]));
      imports.push(inChild(['import', file, url, String(p), String(user.id)]));
    }
    const a = reads.reduce((x, y) => (y.ms < x.ms ? y : x));
    const b = imports.reduce((x, y) => (y.ms < x.ms ? y : x));
    const s = (ms: number) => `${(ms / 1000).toFixed(2)} s`;
    say(`(a) exceljs read:        ${s(a.ms)}   (runs ${reads.map((r) => s(r.ms)).join(', ')}; peak RSS ${a.rssMb} MB)`);
    say(`(b) upload → committed:  ${s(b.ms)}   (runs ${imports.map((r) => s(r.ms)).join(', ')}; best: upload + preview ${s(b.previewMs!)}, commit ${s(b.commitMs!)})`);
    say(`    stored: ${b.stored!.members} members (${b.stored!.failing} failing), ${b.stored!.loads} loads, ${b.stored!.results} results`);
    const ratio = b.ms / a.ms;
    say(`ratio (b) / (a):         ${ratio.toFixed(2)}×   (target ≤ 2×: ${ratio <= 2 ? 'met' : 'NOT met'}; pair by pair ${imports.map((r, i) => `${(r.ms / reads[i].ms).toFixed(2)}×`).join(', ')})`);
    const aCpu = Math.min(...reads.map((r) => r.cpuMs));
    const bCpu = Math.min(...imports.map((r) => r.cpuMs + r.dbCpuMs!));
    const bBest = imports.reduce((x, y) => (y.cpuMs + y.dbCpuMs! < x.cpuMs + x.dbCpuMs! ? y : x));
    say(`CPU time:                (a) ${s(aCpu)}; (b) ${s(bBest.cpuMs)} node + ${s(bBest.dbCpuMs!)} PostgreSQL = ${s(bCpu)}: ${(bCpu / aCpu).toFixed(2)}× (least of the runs;`);
    say(`                         what the work costs whatever the load; on idle cores (b) can take less than its sum)`);
    say(`machine:                 ${os.cpus().length} cores, load average ${os.loadavg().map((x) => x.toFixed(1)).join(' ')}`);
    const rss = Math.max(...imports.map((r) => r.rssMb));
    say(`peak RSS of the import:  ${rss} MB   (target < 500 MB: ${rss < 500 ? 'met' : 'NOT met'})`);
  } finally {
    await knex.destroy();
    await admin.raw(`drop database if exists "${dbName}" with (force)`);
    await admin.destroy();
    cluster?.stop();
  }
}

async function entry(): Promise<void> {
  const [mode, ...args] = process.argv.slice(2);
  if (mode === 'read') say(JSON.stringify(await measureRead(args[0])));
  else if (mode === 'import') say(JSON.stringify(await measureImport(args[0], args[1], Number(args[2]), Number(args[3]))));
  else await main();
}

entry().catch((e: unknown) => {
  process.stderr.write(`import bench failed: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
  process.exit(1);
});
