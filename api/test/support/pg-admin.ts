import { createKnex } from '../../../database/index';

/** `postgres://user@host:port` of a database URL (no database, no query). */
export function serverUrl(databaseUrl: string): string {
  const u = new URL(databaseUrl);
  return `${u.protocol}//${u.username ? `${u.username}${u.password ? `:${u.password}` : ''}@` : ''}${u.host}`;
}

/** The maintenance database of the server, for CREATE / DROP DATABASE. */
export function adminUrl(server: string): string {
  return `${server}/postgres`;
}

export async function dropDatabase(server: string, name: string): Promise<void> {
  const admin = createKnex(adminUrl(server), { min: 0, max: 1 });
  try {
    await admin.raw(`drop database if exists "${name}" with (force)`);
  } finally {
    await admin.destroy();
  }
}

/** Drops every database of one test run (names start with the run id). */
export async function dropRunDatabases(server: string, runId: string): Promise<void> {
  const admin = createKnex(adminUrl(server), { min: 0, max: 1 });
  try {
    const { rows } = await admin.raw<{ rows: { datname: string }[] }>(`select datname from pg_database where datname like ?`, [`${runId}%`]);
    for (const { datname } of rows) await admin.raw(`drop database if exists "${datname}" with (force)`);
  } finally {
    await admin.destroy();
  }
}

/** A fresh database for one spec file: a copy of the migrated template, or empty. */
export async function createTestDatabase(options: { empty?: boolean } = {}): Promise<{ url: string; drop(): Promise<void> }> {
  const server = process.env.SAGLINE_TEST_SERVER;
  const template = process.env.SAGLINE_TEST_TEMPLATE;
  const runId = process.env.SAGLINE_TEST_RUN;
  if (!server || !template || !runId) throw new Error('The api test global setup did not run: use `npx jest -c api/jest.config.js`.');
  const name = `${runId}_${process.pid}_${Math.random().toString(36).slice(2, 8)}`;
  const admin = createKnex(adminUrl(server), { min: 0, max: 1 });
  try {
    for (let attempt = 0; ; attempt++) {
      try {
        await admin.raw(options.empty ? `create database "${name}"` : `create database "${name}" template "${template}"`);
        break;
      } catch (e) {
        // 55006: the template is being copied by another worker at this very moment.
        if ((e as { code?: string }).code !== '55006' || attempt > 20) throw e;
        await new Promise((r) => setTimeout(r, 100));
      }
    }
  } finally {
    await admin.destroy();
  }
  return { url: `${server}/${name}`, drop: () => dropDatabase(server, name) };
}

/** Drops databases left by earlier test runs whose process is gone (a crash, a Ctrl-C). */
export async function dropStaleRunDatabases(server: string): Promise<void> {
  const admin = createKnex(adminUrl(server), { min: 0, max: 1 });
  try {
    const { rows } = await admin.raw<{ rows: { datname: string }[] }>(`select datname from pg_database where datname like 'sagline_api_%'`);
    for (const { datname } of rows) {
      const pid = Number(/^sagline_api_(\d+)_/.exec(datname)?.[1]);
      if (pid && !alive(pid)) await admin.raw(`drop database if exists "${datname}" with (force)`);
    }
  } finally {
    await admin.destroy();
  }
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}
