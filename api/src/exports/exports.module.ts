import { Module } from '@nestjs/common';
import { ExportsController, FlagsExportController } from './exports.controller';
import { ExportsRepository } from './exports.repository';
import { ExportsService } from './exports.service';

/** Results and flags as xlsx workbooks. */
@Module({
  controllers: [ExportsController, FlagsExportController],
  providers: [ExportsRepository, ExportsService],
})
export class ExportsModule {}
