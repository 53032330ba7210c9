import { Module } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import { ChecksModule } from '../checks/checks.module';
import type { AppConfig } from '../config/app-config';
import { APP_CONFIG } from '../config/config.tokens';
import { FlagsModule } from '../flags/flags.module';
import { JobsModule } from '../jobs/jobs.module';
import { OverviewModule } from '../overview/overview.module';
import { RevisionsModule } from '../revisions/revisions.module';
import { DraftCache } from './draft-cache';
import { ImportCommitService } from './import-commit.service';
import { ImportJobs } from './import-jobs';
import { ImportSettings, importSettingsOf } from './import-settings';
import { ImportsController } from './imports.controller';
import { ImportsRepository } from './imports.repository';
import { ImportsService } from './imports.service';
import { TemplateService } from './template.service';
import { UploadInterceptor } from './upload.interceptor';

/** Schedule imports: template downloads, upload → checked draft → revision (inline or as a background job). */
@Module({
  imports: [ActivityModule, ChecksModule, RevisionsModule, JobsModule, OverviewModule, FlagsModule],
  controllers: [ImportsController],
  providers: [
    { provide: ImportSettings, inject: [APP_CONFIG], useFactory: (config: AppConfig) => importSettingsOf(config) },
    ImportsRepository,
    DraftCache,
    ImportsService,
    ImportCommitService,
    ImportJobs,
    TemplateService,
    UploadInterceptor,
  ],
  exports: [ImportsService, ImportCommitService, ImportSettings],
})
export class ImportsModule {}
