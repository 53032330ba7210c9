import { Module } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import { OverviewRevisionHook } from './overview-revision-hook';
import { OverviewController } from './overview.controller';
import { OverviewRepository } from './overview.repository';
import { OverviewService } from './overview.service';
import { ReviewerAssignmentsRepository } from './reviewer-assignments.repository';
import { ReviewerAssignmentsService } from './reviewer-assignments.service';
import { SignOffsRepository } from './sign-offs.repository';
import { SignOffsService } from './sign-offs.service';

/**
 * The Overview (per level, per reviewer, flags over time), reviewer
 * assignment and level sign-offs. Exports OverviewRevisionHook for the import
 * commit (assignments applied to new members, sign-offs voided).
 */
@Module({
  imports: [ActivityModule],
  controllers: [OverviewController],
  providers: [OverviewRepository, OverviewService, ReviewerAssignmentsRepository, ReviewerAssignmentsService, SignOffsRepository, SignOffsService, OverviewRevisionHook],
  exports: [OverviewRevisionHook],
})
export class OverviewModule {}
