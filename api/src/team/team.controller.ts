import { Body, Controller, Delete, Get, HttpCode, Param, Patch, Post } from '@nestjs/common';
import type { TeamMember } from '@sagline/common/api-types';
import { CurrentProject, CurrentUser, ProjectRole } from '../auth/auth.decorators';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { ParseIdPipe } from '../common/parse-id.pipe';
import { ChangeRoleDto } from './dto/change-role.dto';
import { InviteDto } from './dto/invite.dto';
import { TeamService } from './team.service';

@Controller('projects/:projectId')
export class TeamController {
  constructor(private readonly team: TeamService) {}

  @Get('team')
  @ProjectRole()
  list(@CurrentProject() project: ProjectAccess): Promise<TeamMember[]> {
    return this.team.list(project);
  }

  @Post('invitations')
  @HttpCode(201)
  @ProjectRole('manager')
  invite(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Body() dto: InviteDto): Promise<TeamMember> {
    return this.team.invite(project, user, dto);
  }

  @Patch('team/:userId')
  @ProjectRole('manager')
  changeRole(
    @CurrentProject() project: ProjectAccess,
    @CurrentUser() user: SessionUser,
    @Param('userId', ParseIdPipe) userId: number,
    @Body() dto: ChangeRoleDto,
  ): Promise<TeamMember> {
    return this.team.changeRole(project, user, userId, dto);
  }

  @Delete('team/:userId')
  @HttpCode(204)
  @ProjectRole('manager')
  async remove(@CurrentProject() project: ProjectAccess, @CurrentUser() user: SessionUser, @Param('userId', ParseIdPipe) userId: number): Promise<void> {
    await this.team.remove(project, user, userId);
  }
}
