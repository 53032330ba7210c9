import { Controller, Get, Query } from '@nestjs/common';
import type { ActivityEntry, ActivityPerson, Page } from '@sagline/common/api-types';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { ActivityService } from './activity.service';
import { ListActivityQuery } from './dto/list-activity.dto';

/** The project's feed: any member of the project reads it. */
@Controller('projects/:projectId/activity')
export class ActivityController {
  constructor(private readonly activity: ActivityService) {}

  @Get()
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess, @Query() query: ListActivityQuery): Promise<Page<ActivityEntry>> {
    return this.activity.list(project.projectId, query);
  }

  @Get('people')
  @ProjectRole()
  people(@CurrentProject() project: ProjectAccess): Promise<ActivityPerson[]> {
    return this.activity.people(project.projectId);
  }
}
