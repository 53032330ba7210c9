import cluster from 'node:cluster';
import { Logger } from '@nestjs/common';
import { createApp } from './app.factory';
import { ConfigError, parseConfig } from './config/app-config';

/** `node api/dist/main.js`: parse the environment, build the app, listen. Migrations run separately (database CLI). */
async function main(): Promise<void> {
  let config;
  try {
    config = parseConfig(process.env);
  } catch (e) {
    if (e instanceof ConfigError) {
      process.stderr.write(`${e.message}\n`);
      process.exit(1);
    }
    throw e;
  }
  const app = await createApp(config);
  app.enableShutdownHooks();
  await app.listen(config.port, config.host);
  new Logger('sagline').log(`api listening on http://${config.host}:${config.port} (public URL ${config.publicUrl}, ${config.nodeEnv})`);
}

/**
 * API_WORKERS=n (default 1): n api processes sharing the port (node:cluster), for a machine with more
 * cores than one process uses. The api keeps nothing in memory that matters (sessions and jobs are in
 * PostgreSQL), so the workers need no coordination; a worker that dies is replaced, and SIGTERM or
 * SIGINT stops them all.
 */
function workerCount(raw: string | undefined): number {
  if (raw === undefined || raw === '') return 1;
  if (!/^[1-9]\d?$/.test(raw)) {
    process.stderr.write(`API_WORKERS must be a whole number from 1 to 99 (got "${raw}"); leave it out for one process.\n`);
    process.exit(1);
  }
  return Number(raw);
}

function start(): void {
  main().catch((e: unknown) => {
    process.stderr.write(`The api failed to start: ${e instanceof Error ? (e.stack ?? e.message) : String(e)}\n`);
    process.exit(1);
  });
}

const workers = workerCount(process.env.API_WORKERS);
if (workers > 1 && cluster.isPrimary) {
  let stopping = false;
  const fork = () => cluster.fork();
  for (let i = 0; i < workers; i++) fork();
  cluster.on('exit', (worker, code, signal) => {
    if (stopping) {
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
      return;
    }
    // A worker that cannot start (bad configuration) exits at once with 1: stop rather than loop.
    if (code === 1 && process.uptime() < 30) {
      process.stderr.write('An api worker failed to start; stopping.\n');
      process.exit(1);
    }
    new Logger('sagline').warn(`api worker ${worker.process.pid} stopped (${signal ?? code}); starting another`);
    fork();
  });
  for (const sig of ['SIGTERM', 'SIGINT'] as const) {
    process.on(sig, () => {
      stopping = true;
      for (const w of Object.values(cluster.workers ?? {})) w?.process.kill(sig);
      if (Object.keys(cluster.workers ?? {}).length === 0) process.exit(0);
    });
  }
} else {
  start();
}
