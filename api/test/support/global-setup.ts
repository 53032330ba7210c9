/**
 * Once per test run: a PostgreSQL server (TEST_DATABASE_URL's, or the private
 * cluster in <repo>/.data/test on port 54339 / TEST_PG_PORT), and a migrated
 * template database that every spec file copies (CREATE DATABASE ... TEMPLATE),
 * so files running in parallel never see each other's rows.
 */
import net from 'node:net';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { createKnex, migrateLatest } from '../../../database/index';
import { adminUrl, dropDatabase, dropStaleRunDatabases, serverUrl } from './pg-admin';

interface Cluster {
  url: string;
  createDatabase(name: string): string;
  stop(): void;
}

/**
 * A native `import()`: the cluster script is an ES module, and the jest transform
 * would turn a written `import()` into `require()`.
 */
// eslint-disable-next-line @typescript-eslint/no-implied-eval
const importEsm = new Function('specifier', 'return import(specifier)') as (specifier: string) => Promise<unknown>;

export const REPO_ROOT = path.resolve(__dirname, '..', '..', '..');

function portInUse(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const sock = net.connect(port, '127.0.0.1');
    sock.once('connect', () => {
      sock.destroy();
      resolve(true);
    });
    sock.once('error', () => resolve(false));
  });
}

export default async function globalSetup(): Promise<void> {
  const runId = `sagline_api_${process.pid}`;
  let server: string;
  let stopCluster: (() => void) | null = null;

  if (process.env.TEST_DATABASE_URL) {
    server = serverUrl(process.env.TEST_DATABASE_URL);
  } else {
    const port = Number(process.env.TEST_PG_PORT ?? 54339);
    const runningBefore = await portInUse(port);
    const mod = (await importEsm(pathToFileURL(path.join(REPO_ROOT, 'database', 'scripts', 'pg-cluster.mjs')).href)) as {
      startCluster(o: { dataDir: string; port: number; database?: string }): Cluster;
    };
    const cluster = mod.startCluster({ dataDir: path.join(REPO_ROOT, '.data', 'test'), port, database: 'sagline_test' });
    server = serverUrl(cluster.url);
    // Leave a cluster that `npm test` (or someone) started running for them.
    if (!runningBefore) stopCluster = () => cluster.stop();
  }

  const template = `${runId}_template`;
  await dropStaleRunDatabases(server);
  await dropDatabase(server, template);
  const admin = createKnex(adminUrl(server), { min: 0, max: 1 });
  try {
    await admin.raw(`create database "${template}"`);
  } finally {
    await admin.destroy();
  }
  const knex = createKnex(`${server}/${template}`, { min: 0, max: 1 });
  try {
    await migrateLatest(knex);
  } finally {
    await knex.destroy();
  }

  process.env.SAGLINE_TEST_SERVER = server;
  process.env.SAGLINE_TEST_TEMPLATE = template;
  process.env.SAGLINE_TEST_RUN = runId;
  (globalThis as { __saglineStopCluster?: (() => void) | null }).__saglineStopCluster = stopCluster;
}
