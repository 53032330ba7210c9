import { Module, type DynamicModule } from '@nestjs/common';
import { ActivityModule } from './activity/activity.module';
import { AuthModule } from './auth/auth.module';
import type { AppConfig } from './config/app-config';
import { ConfigModule } from './config/config.module';
import { DbModule } from './db/db.module';
import { ExportsModule } from './exports/exports.module';
import { FlagsModule } from './flags/flags.module';
import { HealthModule } from './health/health.module';
import { ImportsModule } from './imports/imports.module';
import { InvitationsModule } from './invitations/invitations.module';
import { DigestModule } from './mail/digest/digest.module';
import { MailModule } from './mail/mail.module';
import { MembersModule } from './members/members.module';
import { OverviewModule } from './overview/overview.module';
import { ProjectsModule } from './projects/projects.module';
import { TeamModule } from './team/team.module';
import { UsersModule } from './users/users.module';

/** Imports the feature modules, nothing else. */
@Module({})
export class AppModule {
  static forRoot(config: AppConfig): DynamicModule {
    return {
      module: AppModule,
      imports: [
        ConfigModule.forRoot(config),
        DbModule,
        AuthModule,
        UsersModule,
        ProjectsModule,
        TeamModule,
        InvitationsModule,
        ActivityModule,
        MailModule,
        DigestModule,
        HealthModule,
        ImportsModule, ExportsModule,
        FlagsModule, MembersModule,
        OverviewModule,
      ],
    };
  }
}
