import { Module } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import type { AppConfig } from '../config/app-config';
import { APP_CONFIG } from '../config/config.tokens';
import { FlagsModule } from '../flags/flags.module';
import { JobsModule } from '../jobs/jobs.module';
import { OverviewModule } from '../overview/overview.module';
import { RevisionsModule } from '../revisions/revisions.module';
import { ChecksController } from './checks.controller';
import { LimitSetChangesService } from './limit-set-changes.service';
import { LimitSetsController } from './limit-sets.controller';
import { LimitSetsRepository } from './limit-sets.repository';
import { LimitSetsService } from './limit-sets.service';
import { RecomputeJobs } from './recompute-jobs';
import { RecomputeJobsRepository } from './recompute-jobs.repository';
import { RecomputeSettings, recomputeSettingsFrom } from './recompute-settings';

/**
 * Limit sets and the engine run over members: the project's set (read by
 * imports), the Limit sets screen (copy, edit, choose) and the recompute of
 * the latest revision when the active set changes (inline or as a job),
 * with its effects on flags (FlagsService) and sign-offs (OverviewRevisionHook).
 */
@Module({
  imports: [ActivityModule, RevisionsModule, JobsModule, OverviewModule, FlagsModule],
  controllers: [ChecksController, LimitSetsController],
  providers: [
    { provide: RecomputeSettings, inject: [APP_CONFIG], useFactory: (config: AppConfig) => recomputeSettingsFrom(config, process.env) },
    LimitSetsRepository,
    LimitSetsService,
    LimitSetChangesService,
    RecomputeJobsRepository,
    RecomputeJobs,
  ],
  exports: [LimitSetsService],
})
export class ChecksModule {}
