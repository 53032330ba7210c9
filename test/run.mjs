// `npm test`: the same bootstrapping as `npm start` with throwaway databases,
// then every tier: unit, API integration, web components, end-to-end in
// Debian's chromium. Prints one line per tier and a closing summary line;
// exits non-zero on any failure. `npm test -- unit web` runs chosen tiers.
import fs from 'node:fs';
import path from 'node:path';
import { startCluster } from '../database/scripts/pg-cluster.mjs';
import {
  API_NODE_FLAGS, ROOT, build, ensureDebianPackage, ensureDependencies, log, run, startChild, waitForPort,
} from '../database/scripts/stack.mjs';

const TIERS = ['build', 'unit', 'api', 'web', 'e2e'];
const chosen = process.argv.slice(2).filter((a) => TIERS.includes(a));
const tiers = chosen.length ? chosen : TIERS;
const RESULTS = path.join(ROOT, '.data', 'results');
const ARTIFACTS = path.join(ROOT, 'test', 'artifacts');
const TEST_PG_PORT = Number(process.env.TEST_PG_PORT ?? 54339);

const stoppers = [];
async function stopAll() {
  for (const stop of stoppers.reverse()) {
    try { await stop(); } catch (e) { log(String(e)); }
  }
  stoppers.length = 0;
}
process.on('SIGINT', async () => { await stopAll(); process.exit(130); });

/** Runs a jest project and reads its JSON result: { passed, failed, skipped }. */
function jestTier(name, config, env = {}) {
  const out = path.join(RESULTS, `${name}.json`);
  fs.rmSync(out, { force: true });
  try {
    run('npx', ['jest', '-c', config, '--json', `--outputFile=${out}`], { env: { ...process.env, ...env } });
  } catch {
    /* counted below */
  }
  if (!fs.existsSync(out)) return { passed: 0, failed: 1, skipped: 0, note: 'jest did not report' };
  const r = JSON.parse(fs.readFileSync(out, 'utf8'));
  const suiteErrors = r.testResults.filter((t) => t.status === 'failed' && t.assertionResults.length === 0).length;
  return {
    passed: r.numPassedTests,
    failed: r.numFailedTests + suiteErrors,
    skipped: r.numPendingTests + r.numTodoTests,
  };
}

async function e2eTier(cluster) {
  ensureDebianPackage('/usr/bin/chromium', 'chromium');
  const databaseUrl = cluster.createDatabase('sagline_e2e');
  // Ports may be moved so that two runs on one machine do not collide.
  const port = Number(process.env.E2E_PORT ?? 4190);
  const smtpPort = Number(process.env.E2E_SMTP_PORT ?? 2595);
  const mailboxPort = Number(process.env.E2E_MAILBOX_PORT ?? 2596);
  const env = {
    DATABASE_URL: databaseUrl,
    HOST: '127.0.0.1',
    PORT: String(port),
    PUBLIC_URL: `http://127.0.0.1:${port}`,
    NODE_ENV: 'development',
    SMTP_URL: `smtp://127.0.0.1:${smtpPort}`,
    MAILBOX_URL: `http://127.0.0.1:${mailboxPort}`,
  };
  run('node', ['database/dist/src/cli.js', 'migrate'], { env: { ...process.env, ...env } });
  run('node', ['database/dist/src/cli.js', 'seed'], { env: { ...process.env, ...env } });
  run('node', ['api/dist/cli.js', 'seed-demo'], { env: { ...process.env, ...env } });
  const smtp = startChild('mail', 'node', ['api/dist/mail/fake-smtp.js'], {
    SMTP_PORT: String(smtpPort), MAILBOX_PORT: String(mailboxPort),
  });
  stoppers.push(() => smtp.stop());
  await waitForPort(smtpPort);
  const api = startChild('api', 'node', [...API_NODE_FLAGS, 'api/dist/main.js'], env);
  stoppers.push(() => api.stop());
  await waitForPort(port);

  const out = path.join(RESULTS, 'e2e.json');
  fs.rmSync(out, { force: true });
  fs.mkdirSync(ARTIFACTS, { recursive: true });
  try {
    // E2E_FILES: only these spec files (a space-separated list), for a quick run.
    const only = (process.env.E2E_FILES ?? '').split(' ').filter(Boolean);
    run('npx', ['playwright', 'test', '-c', 'test/e2e/playwright.config.ts', '--reporter=list,json', ...only], {
      env: { ...process.env, BASE_URL: env.PUBLIC_URL, DATABASE_URL: databaseUrl, PLAYWRIGHT_JSON_OUTPUT_NAME: out },
    });
  } catch {
    /* counted below */
  }
  await stopAll();
  if (!fs.existsSync(out)) return { passed: 0, failed: 1, skipped: 0, note: 'playwright did not report' };
  const s = JSON.parse(fs.readFileSync(out, 'utf8')).stats;
  return { passed: s.expected + (s.flaky ?? 0), failed: s.unexpected, skipped: s.skipped };
}

async function main() {
  const started = Date.now();
  ensureDependencies();
  fs.mkdirSync(RESULTS, { recursive: true });
  const results = [];
  const cluster = startCluster({ dataDir: path.join(ROOT, process.env.TEST_PG_DIR ?? path.join('.data', 'test')), port: TEST_PG_PORT, database: 'sagline_test' });
  const stopCluster = () => cluster.stop();
  try {
    for (const tier of tiers) {
      log(`── tier: ${tier} ──`);
      let r;
      try {
        if (tier === 'build') {
          build();
          run('npx', ['tsc', '--noEmit', '-p', 'api/test/tsconfig.json']);
          run('npx', ['tsc', '--noEmit', '-p', 'common/bin']);
          run('npm', ['run', '-s', 'typecheck', '-w', '@sagline/web']);
          r = { passed: 1, failed: 0, skipped: 0 };
        } else if (tier === 'unit') r = jestTier('unit', 'common/jest.config.js');
        else if (tier === 'api') {
          // The import test of a workbook written by another program converts a CSV with LibreOffice.
          ensureDebianPackage('/usr/bin/soffice', 'libreoffice-calc-nogui');
          r = jestTier('api', 'api/jest.config.js', { TEST_PG_PORT: String(TEST_PG_PORT) });
        }
        else if (tier === 'web') r = jestTier('web', 'web/jest.config.cjs');
        else if (tier === 'e2e') r = await e2eTier(cluster);
      } catch (e) {
        log(`${tier}: ${e.message}`);
        r = { passed: 0, failed: 1, skipped: 0, note: e.message };
        await stopAll();
      }
      results.push({ tier, ...r });
    }
  } finally {
    await stopAll();
    stopCluster();
  }
  const total = results.reduce((a, r) => ({ passed: a.passed + r.passed, failed: a.failed + r.failed, skipped: a.skipped + r.skipped }), { passed: 0, failed: 0, skipped: 0 });
  process.stdout.write('\nSummary by tier:\n');
  for (const r of results) {
    process.stdout.write(`  ${r.tier.padEnd(6)} ${String(r.passed).padStart(5)} passed, ${r.failed} failed${r.skipped ? `, ${r.skipped} skipped` : ''}${r.note ? `  (${r.note})` : ''}\n`);
  }
  process.stdout.write(`  time ${Math.round((Date.now() - started) / 1000)} s\n\n`);
  process.stdout.write(`${total.passed} passed, ${total.failed} failed${total.skipped ? `, ${total.skipped} skipped` : ''}\n`);
  process.exit(total.failed > 0 ? 1 : 0);
}

main().catch(async (e) => {
  log(e.stack ?? String(e));
  await stopAll();
  process.exit(1);
});
