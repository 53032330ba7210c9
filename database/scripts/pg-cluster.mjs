// The private PostgreSQL cluster: installed from Debian's packages when missing,
// data in a git-ignored folder, listening on 127.0.0.1 and a port of its own.
// Plain Node (no dependencies) because it runs before `npm install`.
import { execFileSync, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

const log = (msg) => process.stderr.write(`[postgres] ${msg}\n`);

/** Folder of the newest installed PostgreSQL server binaries, or null. */
export function findPgBin() {
  const root = '/usr/lib/postgresql';
  if (!fs.existsSync(root)) return null;
  const versions = fs
    .readdirSync(root)
    .filter((v) => fs.existsSync(path.join(root, v, 'bin', 'pg_ctl')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(root, versions[0], 'bin') : null;
}

/** Installs Debian's PostgreSQL server when its binaries are missing. */
export function ensurePostgresInstalled() {
  let bin = findPgBin();
  if (bin) return bin;
  if (process.getuid?.() !== 0) {
    throw new Error(
      'PostgreSQL server binaries are missing and this is not root. Install them with ' +
        '`sudo apt-get install -y postgresql`, or set DATABASE_URL to an existing server.',
    );
  }
  log('PostgreSQL is not installed: installing Debian\'s package (apt-get install postgresql)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  run('apt-get', ['update', '-qq'], { env });
  run('apt-get', ['install', '-y', '-qq', 'postgresql'], { env });
  bin = findPgBin();
  if (!bin) throw new Error('apt-get install postgresql finished but no pg_ctl was found under /usr/lib/postgresql.');
  return bin;
}

function run(cmd, args, opts = {}) {
  const r = spawnSync(cmd, args, { stdio: ['ignore', 'pipe', 'pipe'], encoding: 'utf8', ...opts });
  if (r.status !== 0) {
    throw new Error(`${cmd} ${args.join(' ')} failed (exit ${r.status}):\n${r.stdout ?? ''}${r.stderr ?? ''}`);
  }
  return r.stdout;
}

/** True when every parent folder of `dir` can be entered by `user` (initdb needs it). */
function traversableBy(user, dir) {
  const r = spawnSync('runuser', ['-u', user, '--', 'test', '-x', dir]);
  return r.status === 0;
}

/**
 * Starts (initialising when new) a cluster whose data lives in `dataDir`.
 * As root the server runs as the `postgres` user (it refuses to run as root).
 * Returns { url, port, stop() }. A second call on the same folder reuses the data.
 */
export function startCluster({ dataDir, port, database = 'sagline' }) {
  const bin = ensurePostgresInstalled();
  const asRoot = process.getuid?.() === 0;
  let pgData = path.resolve(dataDir, 'pg');
  let socketDir = path.resolve(dataDir, 'pg-socket');
  fs.mkdirSync(dataDir, { recursive: true });
  if (asRoot && !traversableBy('postgres', path.resolve(dataDir))) {
    // A clone under a home folder closed to others: the postgres user cannot reach it.
    const fallback = path.join(os.tmpdir(), `sagline-pg-${Buffer.from(path.resolve(dataDir)).toString('hex').slice(-16)}`);
    log(`${dataDir} is not reachable by the postgres user; keeping the cluster in ${fallback} instead.`);
    pgData = path.join(fallback, 'pg');
    socketDir = path.join(fallback, 'pg-socket');
    fs.mkdirSync(fallback, { recursive: true, mode: 0o755 });
  }
  fs.mkdirSync(pgData, { recursive: true });
  fs.mkdirSync(socketDir, { recursive: true });
  const asPg = (cmd, args) => (asRoot ? run('runuser', ['-u', 'postgres', '--', path.join(bin, cmd), ...args]) : run(path.join(bin, cmd), args));
  if (asRoot) {
    execFileSync('chown', ['-R', 'postgres:postgres', pgData, socketDir]);
  }
  fs.chmodSync(pgData, 0o700);
  if (!fs.existsSync(path.join(pgData, 'PG_VERSION'))) {
    log(`initialising a new cluster in ${pgData}`);
    asPg('initdb', ['-D', pgData, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8']);
  }
  const logFile = path.join(socketDir, 'server.log');
  const status = spawnSync(asRoot ? 'runuser' : path.join(bin, 'pg_ctl'),
    asRoot ? ['-u', 'postgres', '--', path.join(bin, 'pg_ctl'), '-D', pgData, 'status'] : ['-D', pgData, 'status']);
  if (status.status !== 0) {
    asPg('pg_ctl', ['-D', pgData, '-l', logFile, '-w', '-t', '60', 'start', '-o',
      `-p ${port} -k ${socketDir} -c listen_addresses=127.0.0.1 -c max_connections=200 -c fsync=off -c synchronous_commit=off`]);
    log(`started on 127.0.0.1:${port} (data ${pgData})`);
  } else {
    log(`already running (data ${pgData})`);
  }
  const psql = (sql, db = 'postgres') =>
    run(path.join(bin, 'psql'), ['-h', '127.0.0.1', '-p', String(port), '-U', 'postgres', '-d', db, '-tAc', sql]);
  if (!psql(`SELECT 1 FROM pg_database WHERE datname = '${database}'`).trim()) {
    psql(`CREATE DATABASE "${database}"`);
  }
  let stopped = false;
  return {
    url: `postgres://postgres@127.0.0.1:${port}/${database}`,
    port,
    /** Creates another database in the same cluster (tests use throwaway ones). */
    createDatabase(name) {
      psql(`DROP DATABASE IF EXISTS "${name}" WITH (FORCE)`);
      psql(`CREATE DATABASE "${name}"`);
      return `postgres://postgres@127.0.0.1:${port}/${name}`;
    },
    stop() {
      if (stopped) return;
      stopped = true;
      try {
        asPg('pg_ctl', ['-D', pgData, '-m', 'fast', '-w', 'stop']);
        log('stopped');
      } catch (e) {
        log(`stop failed: ${e.message}`);
      }
    },
  };
}

/** Stops a cluster started earlier from `dataDir`, if it runs. */
export function stopCluster({ dataDir }) {
  const bin = findPgBin();
  const pgData = path.resolve(dataDir, 'pg');
  if (!bin || !fs.existsSync(path.join(pgData, 'PG_VERSION'))) return;
  const args = [path.join(bin, 'pg_ctl'), '-D', pgData, '-m', 'fast', '-w', 'stop'];
  const r = process.getuid?.() === 0 ? spawnSync('runuser', ['-u', 'postgres', '--', ...args]) : spawnSync(args[0], args.slice(1));
  log(r.status === 0 ? 'stopped' : 'was not running');
}

// CLI: node database/scripts/pg-cluster.mjs start|stop [dataDir] [port]
if (import.meta.url === `file://${process.argv[1]}`) {
  const [cmd = 'start', dataDir = '.data/dev', port = '54329'] = process.argv.slice(2);
  if (cmd === 'start') console.log(startCluster({ dataDir, port: Number(port) }).url);
  else if (cmd === 'stop') stopCluster({ dataDir });
  else throw new Error(`unknown command ${cmd}: use start or stop`);
}
