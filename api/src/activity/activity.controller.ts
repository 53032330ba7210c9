import { Controller, Get, Query } from '@nestjs/common';
import type { ActivityEntry, Page } from '@sagline/common/api-types';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { ActivityService } from './activity.service';
import { ListActivityQuery } from './dto/list-activity.dto';

@Controller('projects/:projectId/activity')
export class ActivityController {
  constructor(private readonly activity: ActivityService) {}

  @Get()
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess, @Query() query: ListActivityQuery): Promise<Page<ActivityEntry>> {
    return this.activity.list(project.projectId, query.page, query.pageSize);
  }
}
