import { Module } from '@nestjs/common';
import { RevisionsController } from './revisions.controller';
import { RevisionsRepository } from './revisions.repository';
import { RevisionsService } from './revisions.service';

/** Committed revisions: the list, one revision's report, its original file; the repository also writes them (for imports). */
@Module({
  controllers: [RevisionsController],
  providers: [RevisionsRepository, RevisionsService],
  exports: [RevisionsRepository],
})
export class RevisionsModule {}
