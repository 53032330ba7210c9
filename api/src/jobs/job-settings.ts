/**
 * How this api process takes part in background jobs, read once at start
 * (to move into config/app-config.ts with the other settings):
 * - JOBS_WORKER (on): `off` makes a process that only queues work (a CLI, or an
 *   api node kept for requests); some process must run with `on`.
 * - JOBS_POLL_SECONDS (2): how often an idle worker looks for work (≥ 0.5).
 * - JOBS_MAINTENANCE_SECONDS (30): how often jobs of a crashed process are
 *   found (once past their expiry) and queued again.
 */
export interface JobSettings {
  worker: boolean;
  pollSeconds: number;
  maintenanceSeconds: number;
}

export function parseJobSettings(env: Record<string, string | undefined>): JobSettings {
  const problems: string[] = [];
  const worker = (env.JOBS_WORKER ?? 'on').trim().toLowerCase();
  if (!['on', 'off', 'true', 'false', '1', '0'].includes(worker)) problems.push(`JOBS_WORKER "${env.JOBS_WORKER}" is not on or off`);
  const num = (name: string, min: number, fallback: number): number => {
    const raw = env[name]?.trim();
    if (!raw) return fallback;
    const n = Number(raw);
    if (!Number.isFinite(n) || n < min || n > 3600) {
      problems.push(`${name} "${raw}" is not a number of seconds from ${min} to 3600`);
      return fallback;
    }
    return n;
  };
  const settings = {
    worker: ['on', 'true', '1'].includes(worker),
    pollSeconds: num('JOBS_POLL_SECONDS', 0.5, 2),
    maintenanceSeconds: Math.round(num('JOBS_MAINTENANCE_SECONDS', 1, 30)),
  };
  if (problems.length) throw new Error(`The api cannot start; fix these environment variables:\n  - ${problems.join('\n  - ')}`);
  return settings;
}
