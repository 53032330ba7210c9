import { Module } from '@nestjs/common';
import { ActivityModule } from '../activity/activity.module';
import { MailModule } from '../mail/mail.module';
import { MembersDataModule } from '../members/members-data.module';
import { FlagChangesService } from './flag-changes.service';
import { FlagsController } from './flags.controller';
import { FlagsRepository } from './flags.repository';
import { FlagsService } from './flags.service';

/**
 * Flags on members: raise, answer, close, reopen, waive, comment, assign.
 * Exports FlagsService for the Members screen (a member's flags) and for the
 * import commit (FlagsService.onRevisionCommitted).
 */
@Module({
  imports: [ActivityModule, MailModule, MembersDataModule],
  controllers: [FlagsController],
  providers: [FlagsRepository, FlagsService, FlagChangesService],
  exports: [FlagsService],
})
export class FlagsModule {}
