import { dropRunDatabases } from './pg-admin';

/** Drops the template and any database a spec file left behind; stops the cluster if setup started it. */
export default async function globalTeardown(): Promise<void> {
  const server = process.env.SAGLINE_TEST_SERVER;
  const runId = process.env.SAGLINE_TEST_RUN;
  if (server && runId) await dropRunDatabases(server, runId);
  const stop = (globalThis as { __saglineStopCluster?: (() => void) | null }).__saglineStopCluster;
  stop?.();
}
