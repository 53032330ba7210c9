import type { AppConfig } from '../config/app-config';
import { IMPORT_DEFAULTS, parseImportVariables, type ImportConfig } from '../config/import-job-config';

/**
 * Caps and thresholds of schedule imports, as the api's validated
 * configuration read them at start (AppConfig.imports; the IMPORT_*
 * variables are listed in config/import-job-config.ts). A class so Nest can
 * inject it.
 */
export class ImportSettings implements ImportConfig {
  maxFileBytes = IMPORT_DEFAULTS.maxFileBytes;
  maxRows = IMPORT_DEFAULTS.maxRows;
  jobThresholdMembers = IMPORT_DEFAULTS.jobThresholdMembers;
  maxUnzippedBytes = IMPORT_DEFAULTS.maxUnzippedBytes;
  maxZipRatio = IMPORT_DEFAULTS.maxZipRatio;
  draftHours = IMPORT_DEFAULTS.draftHours;
  jobExpireSeconds = IMPORT_DEFAULTS.jobExpireSeconds;
  jobRetries = IMPORT_DEFAULTS.jobRetries;
}

export class ImportSettingsError extends Error {
  constructor(readonly problems: string[]) {
    super(`The api cannot start; fix these environment variables:\n  - ${problems.join('\n  - ')}`);
    this.name = 'ImportSettingsError';
  }
}

/** The import settings of the api's configuration. */
export function importSettingsOf(config: Pick<AppConfig, 'imports'>): ImportSettings {
  return Object.assign(new ImportSettings(), config.imports);
}

/** Parses the IMPORT_* variables alone, listing every bad one in one error (parseConfig reads them with the rest). */
export function parseImportSettings(env: Record<string, string | undefined>): ImportSettings {
  const problems: string[] = [];
  const imports = parseImportVariables(env, problems);
  if (problems.length) throw new ImportSettingsError(problems);
  return importSettingsOf({ imports });
}
