import { Module } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import { InvitationsModule } from '../invitations/invitations.module';
import { MailModule } from '../mail/mail.module';
import { UsersModule } from '../users/users.module';
import { TeamController } from './team.controller';
import { TeamRepository } from './team.repository';
import { TeamService } from './team.service';

@Module({
  imports: [UsersModule, InvitationsModule, ActivityModule, MailModule],
  controllers: [TeamController],
  providers: [TeamRepository, TeamService],
})
export class TeamModule {}
