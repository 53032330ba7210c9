import { Body, Controller, Get, HttpCode, Param, Post, Put, Query } from '@nestjs/common';
import type { AssignMemberReviewersResponse, FlagsOverTime, LevelSignOff, ProjectOverview, ReviewerAssignments } from '@sagline/common/api-types';
import { CurrentProject, CurrentUser, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { AssignLevelReviewerDto, AssignMemberReviewersDto } from './dto/assign-reviewer.dto';
import { FlagsOverTimeQuery } from './dto/flags-over-time.dto';
import { SignOffLevelDto, WithdrawSignOffDto } from './dto/sign-off.dto';
import { OverviewService } from './overview.service';
import { ReviewerAssignmentsService } from './reviewer-assignments.service';
import { SignOffsService } from './sign-offs.service';

/** Routes and roles as in common/src/api-types/overview.ts. Admins count as managers. */
@Controller('projects/:projectId')
export class OverviewController {
  constructor(
    private readonly overview: OverviewService,
    private readonly assignments: ReviewerAssignmentsService,
    private readonly signOffs: SignOffsService,
  ) {}

  @Get('overview')
  @ProjectRole()
  get(@CurrentProject() project: ProjectAccess): Promise<ProjectOverview> {
    return this.overview.overview(project);
  }

  @Get('overview/flags-over-time')
  @ProjectRole()
  flagsOverTime(@CurrentProject() project: ProjectAccess, @Query() query: FlagsOverTimeQuery): Promise<FlagsOverTime> {
    return this.overview.flagsOverTime(project, query.days);
  }

  @Get('reviewer-assignments')
  @ProjectRole()
  listAssignments(@CurrentProject() project: ProjectAccess): Promise<ReviewerAssignments> {
    return this.assignments.list(project);
  }

  @Put('reviewer-assignments/levels/:levelId')
  @ProjectRole('manager')
  assignLevel(
    @CurrentProject() project: ProjectAccess,
    @CurrentUser() user: SessionUser,
    @Param('levelId', ParseIdPipe) levelId: number,
    @Body() dto: AssignLevelReviewerDto,
  ): Promise<ReviewerAssignments> {
    return this.assignments.assignLevel(project, user, levelId, dto);
  }

  @Put('reviewer-assignments/members')
  @ProjectRole('manager')
  assignMembers(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: AssignMemberReviewersDto): Promise<AssignMemberReviewersResponse> {
    return this.assignments.assignMembers(project, user, dto);
  }

  @Post('levels/:levelId/sign-off')
  @HttpCode(201)
  @ProjectRole('checker')
  signOff(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('levelId', ParseIdPipe) levelId: number, @Body() dto: SignOffLevelDto): Promise<LevelSignOff> {
    return this.signOffs.signOff(project, user, levelId, dto);
  }

  @Post('levels/:levelId/sign-off/withdraw')
  @HttpCode(200)
  @ProjectRole('checker')
  withdraw(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('levelId', ParseIdPipe) levelId: number, @Body() dto: WithdrawSignOffDto): Promise<LevelSignOff> {
    return this.signOffs.withdraw(project, user, levelId, dto);
  }
}
