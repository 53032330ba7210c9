import type { JobConfig } from '../config/import-job-config';

/**
 * How this api process takes part in background jobs, as the api's validated
 * configuration read it at start (AppConfig.jobs; the JOBS_* variables are
 * listed in config/import-job-config.ts).
 */
export type JobSettings = JobConfig;
