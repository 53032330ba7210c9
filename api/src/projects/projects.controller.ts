import { Body, Controller, Get, HttpCode, Patch, Post } from '@nestjs/common';
import type { Project, ProjectSummary } from '@sagline/common/api-types';
import { AdminOnly, CurrentProject, CurrentUser, ProjectRole, SignedIn } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { CreateProjectDto } from './dto/create-project.dto';
import { UpdateProjectDto } from './dto/update-project.dto';
import { ProjectsService } from './projects.service';

@Controller('projects')
export class ProjectsController {
  constructor(private readonly projects: ProjectsService) {}

  @Get()
  @SignedIn()
  list(@CurrentUser() user: SessionUser): Promise<ProjectSummary[]> {
    return this.projects.list(user);
  }

  @Post()
  @HttpCode(201)
  @AdminOnly()
  create(@CurrentUser() user: SessionUser, @Body() dto: CreateProjectDto): Promise<Project> {
    return this.projects.create(user, dto);
  }

  @Get(':projectId')
  @ProjectRole()
  get(@CurrentProject() project: ProjectAccess): Promise<Project> {
    return this.projects.get(project);
  }

  @Patch(':projectId')
  @ProjectRole('manager')
  update(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: UpdateProjectDto): Promise<Project> {
    return this.projects.update(project, user, dto);
  }
}
