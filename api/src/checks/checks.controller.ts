import { Controller, Get } from '@nestjs/common';
import type { ProjectLimitSet } from '@sagline/common/api-types';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { toProjectLimitSetResponse } from './checks.mapper';
import { LimitSetsService } from './limit-sets.service';

@Controller('projects/:projectId/limit-set')
export class ChecksController {
  constructor(private readonly limitSets: LimitSetsService) {}

  /** The project's limit set, read-only (any member of the project). */
  @Get()
  @ProjectRole()
  async get(@CurrentProject() project: ProjectAccess): Promise<ProjectLimitSet> {
    const { row } = await this.limitSets.forProject(project.projectId);
    return toProjectLimitSetResponse(row);
  }
}
