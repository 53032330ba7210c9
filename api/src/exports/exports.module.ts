import { Module } from '@nestjs/common';
import { ExportsController } from './exports.controller';
import { ExportsRepository } from './exports.repository';
import { ExportsService } from './exports.service';

/** Results (and later flags) as xlsx workbooks. */
@Module({
  controllers: [ExportsController],
  providers: [ExportsRepository, ExportsService],
})
export class ExportsModule {}
