// `npm start`: everything Sagline needs on one machine, in one command.
// Installs what is missing, starts a private PostgreSQL cluster (unless
// DATABASE_URL is set), migrates, seeds the demo when empty, builds, starts
// the local fake SMTP server (unless SMTP_URL is set) and the API, which
// serves the built web app. Ctrl-C stops all it started.
import path from 'node:path';
import { startCluster } from './pg-cluster.mjs';
import { API_NODE_FLAGS, ROOT, build, ensureDependencies, log, portFree, run, startChild, waitForPort } from './stack.mjs';

const PORT = Number(process.env.PORT ?? 4100);
const HOST = process.env.HOST ?? '127.0.0.1';
const PG_PORT = Number(process.env.PG_PORT ?? 54329);
const SMTP_PORT = Number(process.env.SMTP_PORT ?? 2525);
const MAILBOX_PORT = Number(process.env.MAILBOX_PORT ?? 2526);

const stoppers = [];
let stopping = false;
async function stopAll(code = 0) {
  if (stopping) return;
  stopping = true;
  log('stopping…');
  for (const stop of stoppers.reverse()) {
    try { await stop(); } catch (e) { log(String(e)); }
  }
  process.exit(code);
}
process.on('SIGINT', () => stopAll(0));
process.on('SIGTERM', () => stopAll(0));

async function main() {
  ensureDependencies();
  if (!(await portFree(PORT, HOST))) {
    throw new Error(`port ${PORT} on ${HOST} is taken (another Sagline?). Stop it or set PORT=… .`);
  }

  let databaseUrl = process.env.DATABASE_URL;
  if (!databaseUrl) {
    const cluster = startCluster({ dataDir: path.join(ROOT, '.data', 'dev'), port: PG_PORT });
    stoppers.push(() => cluster.stop());
    databaseUrl = cluster.url;
  } else {
    log('using DATABASE_URL');
  }

  build();
  const env = {
    DATABASE_URL: databaseUrl,
    HOST,
    PORT: String(PORT),
    PUBLIC_URL: process.env.PUBLIC_URL ?? `http://${HOST}:${PORT}`,
    NODE_ENV: process.env.NODE_ENV ?? 'development',
  };
  run('node', ['database/dist/src/cli.js', 'migrate'], { env: { ...process.env, ...env } });
  run('node', ['database/dist/src/cli.js', 'seed'], { env: { ...process.env, ...env } });
  // The demo members go in through the same import code as an upload.
  run('node', ['api/dist/cli.js', 'seed-demo'], { env: { ...process.env, ...env } });

  if (!process.env.SMTP_URL) {
    const smtp = startChild('mail', 'node', ['api/dist/mail/fake-smtp.js'], {
      SMTP_PORT: String(SMTP_PORT),
      MAILBOX_PORT: String(MAILBOX_PORT),
    });
    stoppers.push(() => smtp.stop());
    await waitForPort(SMTP_PORT);
    env.SMTP_URL = `smtp://127.0.0.1:${SMTP_PORT}`;
    env.MAILBOX_URL = `http://127.0.0.1:${MAILBOX_PORT}`;
  }

  const api = startChild('api', 'node', [...API_NODE_FLAGS, 'api/dist/main.js'], env);
  stoppers.push(() => api.stop());
  api.on('exit', () => { if (!stopping) stopAll(1); });
  await waitForPort(PORT, HOST);

  const { DEMO_PEOPLE, DEMO_PASSWORD } = await import(path.join(ROOT, 'database/dist/seeds/demo-people.js'));
  const people = DEMO_PEOPLE.map((p) => `    ${p.role.padEnd(9)} ${p.email}`).join('\n');
  process.stdout.write(
    `\n  Sagline is running at ${env.PUBLIC_URL}\n` +
      (env.MAILBOX_URL ? `  Mailbox (what the app sent): ${env.PUBLIC_URL}/dev/mailbox\n` : '') +
      `\n  Demo sign-ins (password for all: ${DEMO_PASSWORD}):\n${people}\n\n  Ctrl-C stops everything.\n\n`,
  );
}

main().catch((e) => {
  log(e.message ?? String(e));
  stopAll(1);
});
