import { Module } from '@nestjs/common';
import { JobQueue } from './job-queue';
import type { AppConfig } from '../config/app-config';
import { APP_CONFIG } from '../config/config.tokens';
import { JobsRepository } from './jobs.repository';
import { JOB_SETTINGS } from './jobs.tokens';

/** The background job queue (pg-boss on the api's PostgreSQL) and the job rows clients poll. */
@Module({
  providers: [{ provide: JOB_SETTINGS, inject: [APP_CONFIG], useFactory: (config: AppConfig) => config.jobs }, JobQueue, JobsRepository],
  exports: [JobQueue, JobsRepository],
})
export class JobsModule {}
