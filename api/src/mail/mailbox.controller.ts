import { Controller, Get, Inject } from '@nestjs/common';
import type { MailboxMessage } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';

/**
 * The Mailbox screen's data in development: what the local fake SMTP server
 * caught. Open to anyone (an invitee reads their link here before having an
 * account); in production the route does not exist (404).
 */
@Controller('dev/mailbox')
export class MailboxController {
  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  @Get()
  async list(): Promise<MailboxMessage[]> {
    const base = this.config.mailboxUrl;
    if (!base) throw new ApiError('NOT_FOUND', 'There is no API route GET /api/dev/mailbox; the mailbox exists in development only.');
    try {
      const res = await fetch(`${base}/messages`, { signal: AbortSignal.timeout(3_000) });
      if (!res.ok) throw new Error(`HTTP ${res.status}`);
      return (await res.json()) as MailboxMessage[];
    } catch (e) {
      const inner = (e as { cause?: { code?: string; message?: string } }).cause;
      const cause = inner?.code ?? inner?.message ?? (e instanceof Error ? e.message : String(e));
      throw new ApiError(
        'INTERNAL',
        `The local mailbox at ${base} is not answering (${cause}); \`npm start\` runs it, or start it with \`node api/dist/mail/fake-smtp.js\`.`,
        undefined,
        502,
      );
    }
  }
}
