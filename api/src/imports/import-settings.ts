import { IMPORT_LIMITS } from '@sagline/common/api-types';

/**
 * Caps and thresholds of schedule imports, read once when the api starts.
 * (They belong with the api's other settings in config/app-config.ts; they
 * live here until that file takes them over.)
 *
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
export class ImportSettings {
  maxFileBytes: number = IMPORT_LIMITS.maxFileBytes;
  maxRows: number = IMPORT_LIMITS.maxRows;
  jobThresholdMembers: number = IMPORT_LIMITS.jobThresholdMembers;
  maxUnzippedBytes = 200 * 1024 * 1024;
  maxZipRatio = 200;
  draftHours: number = IMPORT_LIMITS.draftHours;
  jobExpireSeconds = 300;
  jobRetries = 3;
}

export class ImportSettingsError extends Error {
  constructor(readonly problems: string[]) {
    super(`The api cannot start; fix these environment variables:\n  - ${problems.join('\n  - ')}`);
    this.name = 'ImportSettingsError';
  }
}

const MB = 1024 * 1024;

/** Parses the IMPORT_* variables, listing every bad one in one error. */
export function parseImportSettings(env: Record<string, string | undefined>): ImportSettings {
  const s = new ImportSettings();
  const problems: string[] = [];
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
  s.maxFileBytes = Math.round(num('IMPORT_MAX_FILE_MB', 0.001, 1024, s.maxFileBytes / MB) * MB);
  s.maxRows = Math.round(num('IMPORT_MAX_ROWS', 1, 1_000_000, s.maxRows));
  s.jobThresholdMembers = Math.round(num('IMPORT_JOB_THRESHOLD', 0, 1_000_000, s.jobThresholdMembers));
  s.maxUnzippedBytes = Math.round(num('IMPORT_MAX_UNZIPPED_MB', 1, 4096, s.maxUnzippedBytes / MB) * MB);
  s.maxZipRatio = num('IMPORT_MAX_ZIP_RATIO', 2, 10_000, s.maxZipRatio);
  s.draftHours = num('IMPORT_DRAFT_HOURS', 0.01, 24 * 30, s.draftHours);
  s.jobExpireSeconds = Math.round(num('IMPORT_JOB_EXPIRE_SECONDS', 1, 86_400, s.jobExpireSeconds));
  s.jobRetries = Math.round(num('IMPORT_JOB_RETRIES', 0, 100, s.jobRetries));
  if (problems.length) throw new ImportSettingsError(problems);
  return s;
}
