import { Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import { ApiError } from '../common/api-error';
import { JobQueue, type JobContext } from '../jobs/job-queue';
import { JobsRepository } from '../jobs/jobs.repository';
import { ImportCommitService } from './import-commit.service';
import { ImportSettings } from './import-settings';
import { COMMIT_QUEUE, type CommitJobData } from './imports.service';

/** Minimum time between two progress writes of one job (the client polls about once a second). */
const PROGRESS_EVERY_MS = 200;

/**
 * The background commit: the same ImportCommitService.commit as the
 * synchronous route, with progress written to `import_jobs` as it goes. The
 * user's mistakes (draft gone, limit set changed) end the job as failed with
 * the error the route would have given; anything else is retried by pg-boss,
 * and so is a job whose process died (after its expiry). The commit is one
 * transaction, so every attempt starts from the database as it was.
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
    await this.jobs.started(row.id);
    let last = 0;
    let lastStep = '';
    const onProgress = (fraction: number, step: string) => {
      const now = Date.now();
      // A new step is always shown; within a step, at most one write per PROGRESS_EVERY_MS.
      if (step === lastStep && now - last < PROGRESS_EVERY_MS && fraction < 1) return;
      last = now;
      lastStep = step;
      // Never awaited inside the commit: a slow progress write must not hold the transaction.
      this.jobs.progress(row.id, fraction, step).catch((e: unknown) => this.logger.warn(`progress of job ${row.id}: ${String(e)}`));
    };
    try {
      const label = typeof row.request.label === 'string' ? row.request.label : null;
      const result = await this.committer.commit(row.project_id, row.draft_id, { label, actorId: row.requested_by, onProgress, idempotent: true });
      await this.jobs.completed(row.id, result);
    } catch (e) {
      if (e instanceof ApiError && e.status < 500) {
        await this.jobs.failed(row.id, { statusCode: e.status, code: e.code, message: e.message }, true);
        return;
      }
      const final = job.retryCount >= this.settings.jobRetries;
      this.logger.error(`import job ${row.id} failed (attempt ${job.retryCount + 1}${final ? ', giving up' : ', will retry'}): ${e instanceof Error ? (e.stack ?? e.message) : String(e)}`);
      await this.jobs.failed(row.id, { statusCode: 500, code: 'INTERNAL', message: `The commit failed on our side${final ? '' : ' and will be tried again'}; nothing of it was stored.` }, final);
      throw e;
    }
  }
}
