import { Body, Controller, Get, HttpCode, Param, Patch, Post, Query } from '@nestjs/common';
import type { BulkAssignFlagsResponse, BulkRaiseFlagsResponse, Flag, FlagDetail, FlagSummary, Page } from '@sagline/common/api-types';
import { CurrentProject, CurrentUser, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { BulkAssignFlagsDto } from './dto/bulk-assign-flags.dto';
import { BulkRaiseFlagsDto } from './dto/bulk-raise-flags.dto';
import { AnswerFlagDto, CloseFlagDto, CommentFlagDto, ReopenFlagDto, WaiveFlagDto } from './dto/flag-actions.dto';
import { ListFlagsQuery } from './dto/list-flags.dto';
import { RaiseFlagDto } from './dto/raise-flag.dto';
import { UpdateFlagDto } from './dto/update-flag.dto';
import { FlagChangesService } from './flag-changes.service';
import { FlagsService } from './flags.service';

/** Routes and roles as in common/src/api-types/flags.ts. Admins count as managers. */
@Controller('projects/:projectId/flags')
export class FlagsController {
  constructor(
    private readonly flags: FlagsService,
    private readonly changes: FlagChangesService,
  ) {}

  @Get()
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Query() query: ListFlagsQuery): Promise<Page<Flag>> {
    return this.flags.list(project, user, query);
  }

  @Get('summary')
  @ProjectRole()
  summary(@CurrentProject() project: ProjectAccess): Promise<FlagSummary> {
    return this.flags.summary(project);
  }

  @Get(':flagId')
  @ProjectRole()
  detail(@CurrentProject() project: ProjectAccess, @Param('flagId', ParseIdPipe) flagId: number): Promise<FlagDetail> {
    return this.flags.detail(project, flagId);
  }

  @Post()
  @HttpCode(201)
  @ProjectRole('checker')
  raise(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: RaiseFlagDto): Promise<FlagDetail> {
    return this.flags.raise(project, user, dto);
  }

  @Post('bulk')
  @HttpCode(201)
  @ProjectRole('checker')
  bulkRaise(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: BulkRaiseFlagsDto): Promise<BulkRaiseFlagsResponse> {
    return this.flags.bulkRaise(project, user, dto);
  }

  @Post('bulk-assign')
  @HttpCode(200)
  @ProjectRole('checker', 'manager')
  bulkAssign(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: BulkAssignFlagsDto): Promise<BulkAssignFlagsResponse> {
    return this.changes.bulkAssign(project, user, dto);
  }

  @Patch(':flagId')
  @ProjectRole('checker', 'manager')
  update(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: UpdateFlagDto): Promise<FlagDetail> {
    return this.changes.update(project, user, flagId, dto);
  }

  /** The guard lets every writing role through; the service allows only the assignee or an engineer. */
  @Post(':flagId/answer')
  @HttpCode(200)
  @ProjectRole('manager', 'engineer', 'checker')
  answer(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: AnswerFlagDto): Promise<FlagDetail> {
    return this.changes.answer(project, user, flagId, dto);
  }

  @Post(':flagId/close')
  @HttpCode(200)
  @ProjectRole('checker')
  close(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: CloseFlagDto): Promise<FlagDetail> {
    return this.changes.close(project, user, flagId, dto);
  }

  @Post(':flagId/reopen')
  @HttpCode(200)
  @ProjectRole('checker')
  reopen(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: ReopenFlagDto): Promise<FlagDetail> {
    return this.changes.reopen(project, user, flagId, dto);
  }

  @Post(':flagId/waive')
  @HttpCode(200)
  @ProjectRole('checker', 'manager')
  waive(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: WaiveFlagDto): Promise<FlagDetail> {
    return this.changes.waive(project, user, flagId, dto);
  }

  @Post(':flagId/comments')
  @HttpCode(201)
  @ProjectRole('manager', 'engineer', 'checker')
  comment(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('flagId', ParseIdPipe) flagId: number, @Body() dto: CommentFlagDto): Promise<FlagDetail> {
    return this.changes.comment(project, user, flagId, dto);
  }
}
