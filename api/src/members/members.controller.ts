import { Controller, Get, Param, Query } from '@nestjs/common';
import type { MemberDetail, MemberFacets, MembersPage } from '@sagline/common/api-types';
import { CurrentProject, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import { ListMembersQuery, RevisionQuery } from './dto/list-members.dto';
import { MembersService } from './members.service';

/** Read-only, for every member of the project (viewers included). Routes as in common/src/api-types/members.ts. */
@Controller('projects/:projectId/members')
export class MembersController {
  constructor(private readonly members: MembersService) {}

  @Get()
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess, @Query() query: ListMembersQuery): Promise<MembersPage> {
    return this.members.list(project, query);
  }

  // Declared before ':mark', so "facets" is this route (no schedule mark is spelt so in practice).
  @Get('facets')
  @ProjectRole()
  facets(@CurrentProject() project: ProjectAccess, @Query() query: RevisionQuery): Promise<MemberFacets> {
    return this.members.facets(project, query.revision);
  }

  @Get(':mark')
  @ProjectRole()
  detail(@CurrentProject() project: ProjectAccess, @Param('mark') mark: string, @Query() query: RevisionQuery): Promise<MemberDetail> {
    return this.members.detail(project, mark, query.revision);
  }
}
