import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { JobQueue, type JobContext } from '../jobs/job-queue';
import { runTrackedJob } from '../jobs/tracked-job';
import { LimitSetChangesService, RECOMPUTE_QUEUE, type RecomputeJobData } from './limit-set-changes.service';
import { RecomputeJobsRepository } from './recompute-jobs.repository';
import { RecomputeSettings } from './recompute-settings';

/**
 * The background change of a large project's limit set: the same
 * LimitSetChangesService.applyChange as the request path (one transaction),
 * with progress written to `recompute_jobs` (runTrackedJob). The user's
 * mistakes (a stale edit, members the set cannot check) end the job as
 * failed with the error the request would have given; anything else is
 * retried by pg-boss.
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
    await runTrackedJob({
      id: row.id,
      kind: 'limit-set job',
      retryCount: job.retryCount,
      retries: this.settings.jobRetries,
      failedOnOurSide: 'The change failed on our side',
      rows: this.jobs,
      logger: this.logger,
      // applyJob marks the job completed in its own transaction.
      work: async (onProgress) => {
        await this.changes.applyJob(row, onProgress);
      },
    });
  }
}
