import { Body, Controller, Delete, Get, HttpCode, Param, Post, Put, Res } from '@nestjs/common';
import type { Response } from 'express';
import type { LimitSetChangeResponse, LimitSetJobAccepted, LimitSetJobStatus, LimitSetsOverview, ProjectLimitSetView } from '@sagline/common/api-types';
import { CurrentProject, CurrentUser, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { CopyLimitSetDto, UpdateLimitSetDto, UseLimitSetDto } from './dto/limit-set.dto';
import { LimitSetChangesService, type ChangeOutcome } from './limit-set-changes.service';

/**
 * The Limit sets screen: everyone on the project reads; managers and admins
 * copy, edit, choose and delete (viewers and the other roles get 403; outsiders 404).
 */
@Controller('projects/:projectId/limit-sets')
export class LimitSetsController {
  constructor(private readonly changes: LimitSetChangesService) {}

  @Get()
  @ProjectRole()
  overview(@CurrentProject() project: ProjectAccess): Promise<LimitSetsOverview> {
    return this.changes.overview(project);
  }

  @Get('jobs/:jobId')
  @ProjectRole()
  job(@CurrentProject() project: ProjectAccess, @Param('jobId') jobId: string): Promise<LimitSetJobStatus> {
    return this.changes.jobStatus(project.projectId, jobId);
  }

  /** 201: the copy, not in use yet. */
  @Post()
  @HttpCode(201)
  @ProjectRole('manager')
  copy(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: CopyLimitSetDto): Promise<ProjectLimitSetView> {
    return this.changes.copy(project.projectId, user.id, dto);
  }

  /** 200 { set, recompute }, or 202 { jobId } when the active set of a large project changes. */
  @Put(':setId')
  @ProjectRole('manager')
  async update(
    @CurrentProject() project: ProjectAccess,
    @CurrentUser() user: SessionUser,
    @Param('setId', ParseIdPipe) setId: number,
    @Body() dto: UpdateLimitSetDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<LimitSetChangeResponse | LimitSetJobAccepted> {
    return answer(res, await this.changes.update(project.projectId, setId, user.id, dto));
  }

  /** Makes the set the project's; 200 { set, recompute }, or 202 { jobId } on a large project. */
  @Post(':setId/use')
  @ProjectRole('manager')
  async use(
    @CurrentProject() project: ProjectAccess,
    @CurrentUser() user: SessionUser,
    @Param('setId', ParseIdPipe) setId: number,
    @Body() dto: UseLimitSetDto,
    @Res({ passthrough: true }) res: Response,
  ): Promise<LimitSetChangeResponse | LimitSetJobAccepted> {
    return answer(res, await this.changes.use(project.projectId, setId, user.id, dto.version));
  }

  /** 204: a set the project does not use is gone (409 for the set in use). */
  @Delete(':setId')
  @HttpCode(204)
  @ProjectRole('manager')
  async remove(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('setId', ParseIdPipe) setId: number): Promise<void> {
    await this.changes.remove(project.projectId, setId, user.id);
  }
}

function answer(res: Response, outcome: ChangeOutcome): LimitSetChangeResponse | LimitSetJobAccepted {
  if (outcome.kind === 'queued') {
    res.status(202);
    return { jobId: outcome.jobId };
  }
  res.status(200);
  return outcome.response;
}
