import type { Logger } from '@nestjs/common';
import type { ApiErrorDetail } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';

/** Minimum time between two progress writes of one job (the client polls about once a second). */
const PROGRESS_EVERY_MS = 200;

/** What a job's row says of a failure: the error the request path would have answered with. */
export interface JobFailure {
  statusCode: number;
  code: string;
  message: string;
  details?: ApiErrorDetail[];
}

/** A job table's writes that a tracked job makes (import_jobs, recompute_jobs). */
export interface JobRowWriter {
  started(id: string): Promise<void>;
  progress(id: string, fraction: number, step: string): Promise<void>;
  failed(id: string, error: JobFailure, final: boolean): Promise<void>;
}

export interface TrackedJob {
  id: string;
  /** What the log calls it ("import job"). */
  kind: string;
  /** pg-boss's attempt count so far, and how many retries the job gets. */
  retryCount: number;
  retries: number;
  /** The user-facing sentence for a failure on our side ("The commit failed on our side"). */
  failedOnOurSide: string;
  rows: JobRowWriter;
  logger: Logger;
  /** The work, the same as the request path's, reporting its progress. */
  work(onProgress: (fraction: number, step: string) => void): Promise<void>;
}

/**
 * Runs a background job the user watches: marks its row started, writes
 * progress as it goes (a new step always, within a step at most every
 * 200 ms, never awaited: a slow progress write must not hold the work's
 * transaction), and on failure records what the user should read. The
 * user's mistakes (an ApiError below 500: a stale edit, a draft gone) end
 * the job as failed with the error the request would have given; anything
 * else is logged and rethrown for pg-boss to retry, until the last attempt.
 */
export async function runTrackedJob(job: TrackedJob): Promise<void> {
  await job.rows.started(job.id);
  let last = 0;
  let lastStep = '';
  const onProgress = (fraction: number, step: string) => {
    const now = Date.now();
    if (step === lastStep && now - last < PROGRESS_EVERY_MS && fraction < 1) return;
    last = now;
    lastStep = step;
    job.rows.progress(job.id, fraction, step).catch((e: unknown) => job.logger.warn(`progress of job ${job.id}: ${String(e)}`));
  };
  try {
    await job.work(onProgress);
  } catch (e) {
    if (e instanceof ApiError && e.status < 500) {
      await job.rows.failed(job.id, { statusCode: e.status, code: e.code, message: e.message, ...(e.details ? { details: e.details } : {}) }, true);
      return;
    }
    const final = job.retryCount >= job.retries;
    job.logger.error(`${job.kind} ${job.id} failed (attempt ${job.retryCount + 1}${final ? ', giving up' : ', will retry'}): ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
    await job.rows.failed(job.id, { statusCode: 500, code: 'INTERNAL', message: `${job.failedOnOurSide}${final ? '' : ' and will be tried again'}; nothing of it was stored.` }, final);
    throw e;
  }
}
