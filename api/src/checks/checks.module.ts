import { Module } from '@nestjs/common';
import { ChecksController } from './checks.controller';
import { LimitSetsRepository } from './limit-sets.repository';
import { LimitSetsService } from './limit-sets.service';

/** Limit sets and the engine run over members (results are written by the revisions area). */
@Module({
  controllers: [ChecksController],
  providers: [LimitSetsRepository, LimitSetsService],
  exports: [LimitSetsService],
})
export class ChecksModule {}
