import { Module } from '@nestjs/common';
import { JobsModule } from '../../jobs/jobs.module';
import { MailModule } from '../mail.module';
import { DigestController } from './digest.controller';
import { DigestRepository } from './digest.repository';
import { DigestService } from './digest.service';
import { parseDigestSettings } from './digest-settings';
import { DIGEST_SETTINGS } from './digest.tokens';

/** The daily e-mail digest: a scheduled pg-boss job, an admin route, and `cli.js send-digest`. */
@Module({
  imports: [MailModule, JobsModule],
  controllers: [DigestController],
  providers: [{ provide: DIGEST_SETTINGS, useFactory: () => parseDigestSettings(process.env) }, DigestRepository, DigestService],
  exports: [DigestService],
})
export class DigestModule {}
