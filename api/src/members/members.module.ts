import { Module } from '@nestjs/common';
import { FlagsModule } from '../flags/flags.module';
import { MembersController } from './members.controller';
import { MembersDataModule } from './members-data.module';
import { MembersService } from './members.service';

/** The Members screen's data: the filtered list, facets, and one member explained. */
@Module({
  imports: [MembersDataModule, FlagsModule],
  controllers: [MembersController],
  providers: [MembersService],
})
export class MembersModule {}
