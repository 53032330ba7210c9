import { Module } from '@nestjs/common';
import { MembersRepository } from './members.repository';

/**
 * The members queries alone, for areas that look members up (flags check a
 * mark against the latest revision) while the Members module itself shows
 * flags: both import this, so neither imports the other.
 */
@Module({
  providers: [MembersRepository],
  exports: [MembersRepository],
})
export class MembersDataModule {}
