import { IMPORT_LIMITS } from '@sagline/common/api-types';

/**
 * Caps and thresholds of schedule imports (part of AppConfig, `imports`):
 * - IMPORT_MAX_FILE_MB (20): largest upload; larger ones get 413 PAYLOAD_TOO_LARGE
 * - IMPORT_MAX_ROWS (20000): member rows per schedule (the Loads sheet may have 4×)
 * - IMPORT_JOB_THRESHOLD (2000): drafts with more members commit as a background job
 * - IMPORT_MAX_UNZIPPED_MB (200): what an xlsx may expand to (zip-bomb guard)
 * - IMPORT_MAX_ZIP_RATIO (200): largest expansion ratio of an xlsx above 10 MB unzipped
 * - IMPORT_DRAFT_HOURS (24): how long a draft waits for its commit
 * - IMPORT_JOB_EXPIRE_SECONDS (300): a commit job still running after this is taken as
 *   crashed and started again (all or nothing: the crashed attempt wrote nothing)
 * - IMPORT_JOB_RETRIES (3): starts after the first one
 */
export interface ImportConfig {
  maxFileBytes: number;
  maxRows: number;
  jobThresholdMembers: number;
  maxUnzippedBytes: number;
  maxZipRatio: number;
  draftHours: number;
  jobExpireSeconds: number;
  jobRetries: number;
}

/**
 * How this api process takes part in background jobs (AppConfig `jobs`):
 * - JOBS_WORKER (on): `off` makes a process that only queues work (a CLI, or an
 *   api node kept for requests); some process must run with `on`.
 * - JOBS_POLL_SECONDS (2): how often an idle worker looks for work (≥ 0.5).
 * - JOBS_MAINTENANCE_SECONDS (30): how often jobs of a crashed process are
 *   found (once past their expiry) and queued again.
 */
export interface JobConfig {
  worker: boolean;
  pollSeconds: number;
  maintenanceSeconds: number;
}

export const IMPORT_DEFAULTS: Readonly<ImportConfig> = {
  maxFileBytes: IMPORT_LIMITS.maxFileBytes,
  maxRows: IMPORT_LIMITS.maxRows,
  jobThresholdMembers: IMPORT_LIMITS.jobThresholdMembers,
  maxUnzippedBytes: 200 * 1024 * 1024,
  maxZipRatio: 200,
  draftHours: IMPORT_LIMITS.draftHours,
  jobExpireSeconds: 300,
  jobRetries: 3,
};

const MB = 1024 * 1024;
type Env = Record<string, string | undefined>;

/** The IMPORT_* variables; each bad one adds a line to `problems` and keeps its default. */
export function parseImportVariables(env: Env, problems: string[]): ImportConfig {
  const d = IMPORT_DEFAULTS;
  const num = (name: string, min: number, max: number, fallback: number): number => {
    const raw = env[name]?.trim();
    if (raw === undefined || raw === '') return fallback;
    const n = Number(raw);
    if (!/^\d+(\.\d+)?$/.test(raw) || n < min || n > max) {
      problems.push(`${name} "${raw}" is not a number from ${min} to ${max}`);
      return fallback;
    }
    return n;
  };
  return {
    maxFileBytes: Math.round(num('IMPORT_MAX_FILE_MB', 0.001, 1024, d.maxFileBytes / MB) * MB),
    maxRows: Math.round(num('IMPORT_MAX_ROWS', 1, 1_000_000, d.maxRows)),
    jobThresholdMembers: Math.round(num('IMPORT_JOB_THRESHOLD', 0, 1_000_000, d.jobThresholdMembers)),
    maxUnzippedBytes: Math.round(num('IMPORT_MAX_UNZIPPED_MB', 1, 4096, d.maxUnzippedBytes / MB) * MB),
    maxZipRatio: num('IMPORT_MAX_ZIP_RATIO', 2, 10_000, d.maxZipRatio),
    draftHours: num('IMPORT_DRAFT_HOURS', 0.01, 24 * 30, d.draftHours),
    jobExpireSeconds: Math.round(num('IMPORT_JOB_EXPIRE_SECONDS', 1, 86_400, d.jobExpireSeconds)),
    jobRetries: Math.round(num('IMPORT_JOB_RETRIES', 0, 100, d.jobRetries)),
  };
}

/** The JOBS_* variables; each bad one adds a line to `problems` and keeps its default. */
export function parseJobVariables(env: Env, problems: string[]): JobConfig {
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
  return {
    worker: ['on', 'true', '1'].includes(worker),
    pollSeconds: num('JOBS_POLL_SECONDS', 0.5, 2),
    maintenanceSeconds: Math.round(num('JOBS_MAINTENANCE_SECONDS', 1, 30)),
  };
}
