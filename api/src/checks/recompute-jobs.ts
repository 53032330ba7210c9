import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { ApiError } from '../common/api-error';
import { JobQueue, type JobContext } from '../jobs/job-queue';
import { LimitSetChangesService, RECOMPUTE_QUEUE, type RecomputeJobData } from './limit-set-changes.service';
import { RecomputeJobsRepository } from './recompute-jobs.repository';
import { RecomputeSettings } from './recompute-settings';

/** Minimum time between two progress writes of one job (the client polls about once a second). */
const PROGRESS_EVERY_MS = 200;

/**
 * The background change of a large project's limit set: the same
 * LimitSetChangesService.applyChange as the request path (one transaction),
 * with progress written to `recompute_jobs`. The user's mistakes (a stale
 * edit, members the set cannot check) end the job as failed with the error
 * the request would have given; anything else is retried by pg-boss.
 */
@Injectable()
export class RecomputeJobs implements OnModuleInit {
  private readonly logger = new Logger('limit-sets');

  constructor(
    private readonly queue: JobQueue,
    private readonly jobs: RecomputeJobsRepository,
    private readonly changes: LimitSetChangesService,
    private readonly settings: RecomputeSettings,
  ) {}

  onModuleInit(): void {
    this.queue.register<RecomputeJobData>(RECOMPUTE_QUEUE, (job) => this.run(job));
  }

  async run(job: JobContext<RecomputeJobData>): Promise<void> {
    const row = await this.jobs.findById(job.data.jobId);
    if (!row || row.state === 'completed' || row.state === 'failed') return;
    await this.jobs.started(row.id);
    let last = 0;
    let lastStep = '';
    const onProgress = (fraction: number, step: string) => {
      const now = Date.now();
      if (step === lastStep && now - last < PROGRESS_EVERY_MS && fraction < 1) return;
      last = now;
      lastStep = step;
      // Never awaited inside the transaction: a slow progress write must not hold it.
      this.jobs.progress(row.id, fraction, step).catch((e: unknown) => this.logger.warn(`progress of job ${row.id}: ${String(e)}`));
    };
    try {
      // applyJob marks the job completed in its own transaction.
      await this.changes.applyJob(row, onProgress);
    } catch (e) {
      if (e instanceof ApiError && e.status < 500) {
        await this.jobs.failed(row.id, { statusCode: e.status, code: e.code, message: e.message, ...(e.details ? { details: e.details } : {}) }, true);
        return;
      }
      const final = job.retryCount >= this.settings.jobRetries;
      this.logger.error(`limit-set job ${row.id} failed (attempt ${job.retryCount + 1}${final ? ', giving up' : ', will retry'}): ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      await this.jobs.failed(row.id, { statusCode: 500, code: 'INTERNAL', message: `The change failed on our side${final ? '' : ' and will be tried again'}; nothing of it was stored.` }, final);
      throw e;
    }
  }
}
