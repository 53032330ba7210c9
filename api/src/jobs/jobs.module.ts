import { Module } from '@nestjs/common';
import { JobQueue } from './job-queue';
import { parseJobSettings } from './job-settings';
import { JobsRepository } from './jobs.repository';
import { JOB_SETTINGS } from './jobs.tokens';

/** The background job queue (pg-boss on the api's PostgreSQL) and the job rows clients poll. */
@Module({
  providers: [{ provide: JOB_SETTINGS, useFactory: () => parseJobSettings(process.env) }, JobQueue, JobsRepository],
  exports: [JobQueue, JobsRepository],
})
export class JobsModule {}
