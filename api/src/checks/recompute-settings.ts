import type { AppConfig } from '../config/app-config';
import { parseImportSettings } from '../imports/import-settings';

/**
 * When a change of the project's limit set runs as a background job: the
 * same threshold, retries and expiry as a background import commit
 * (IMPORT_JOB_THRESHOLD, IMPORT_JOB_RETRIES, IMPORT_JOB_EXPIRE_SECONDS), so a
 * project recomputes in the request exactly when its import would commit in
 * the request.
 */
export class RecomputeSettings {
  jobThresholdMembers = 2000;
  jobRetries = 3;
  jobExpireSeconds = 300;
}

type ImportJobNumbers = Pick<RecomputeSettings, 'jobThresholdMembers' | 'jobRetries' | 'jobExpireSeconds'>;

/** From the api's configuration when it carries the import settings, else from the IMPORT_* variables. */
export function recomputeSettingsFrom(config: AppConfig, env: Record<string, string | undefined>): RecomputeSettings {
  const s: ImportJobNumbers = (config as AppConfig & { imports?: ImportJobNumbers }).imports ?? parseImportSettings(env);
  const out = new RecomputeSettings();
  out.jobThresholdMembers = s.jobThresholdMembers;
  out.jobRetries = s.jobRetries;
  out.jobExpireSeconds = s.jobExpireSeconds;
  return out;
}
