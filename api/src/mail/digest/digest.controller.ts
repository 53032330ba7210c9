import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import type { DigestRunReport } from '@sagline/common/api-types';
import { AdminOnly } from '../../auth/auth.decorators';
import { DigestService } from './digest.service';
import { SendDigestDto } from './dto/send-digest.dto';

/** The daily digest on demand (admins; development and tests). The scheduled job does the same. */
@Controller('digests')
export class DigestController {
  constructor(private readonly digest: DigestService) {}

  @Post('send')
  @HttpCode(200)
  @AdminOnly()
  send(@Body() dto: SendDigestDto): Promise<DigestRunReport> {
    return this.digest.run(dto.date);
  }
}
