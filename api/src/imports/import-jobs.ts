import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { JobQueue, type JobContext } from '../jobs/job-queue';
import { JobsRepository } from '../jobs/jobs.repository';
import { runTrackedJob } from '../jobs/tracked-job';
import { ImportCommitService } from './import-commit.service';
import { ImportSettings } from './import-settings';
import { COMMIT_QUEUE, type CommitJobData } from './imports.service';

/**
 * The background commit: the same ImportCommitService.commit as the
 * synchronous route, with progress written to `import_jobs` as it goes
 * (runTrackedJob). The user's mistakes (draft gone, limit set changed) end
 * the job as failed with the error the route would have given; anything
 * else is retried by pg-boss, and so is a job whose process died (after its
 * expiry). The commit is one transaction, so every attempt starts from the
 * database as it was.
 */
@Injectable()
export class ImportJobs implements OnModuleInit {
  private readonly logger = new Logger('imports');

  constructor(
    private readonly queue: JobQueue,
    private readonly jobs: JobsRepository,
    private readonly committer: ImportCommitService,
    private readonly settings: ImportSettings,
  ) {}

  onModuleInit(): void {
    this.queue.register<CommitJobData>(COMMIT_QUEUE, (job) => this.run(job));
  }

  async run(job: JobContext<CommitJobData>): Promise<void> {
    const row = await this.jobs.findById(job.data.jobId);
    if (!row || row.state === 'completed' || row.state === 'failed' || !row.draft_id) return;
    const draftId = row.draft_id;
    await runTrackedJob({
      id: row.id,
      kind: 'import job',
      retryCount: job.retryCount,
      retries: this.settings.jobRetries,
      failedOnOurSide: 'The commit failed on our side',
      rows: this.jobs,
      logger: this.logger,
      work: async (onProgress) => {
        const label = typeof row.request.label === 'string' ? row.request.label : null;
        const result = await this.committer.commit(row.project_id, draftId, { label, actorId: row.requested_by, onProgress, idempotent: true });
        await this.jobs.completed(row.id, result);
      },
    });
  }
}
