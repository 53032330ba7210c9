import { Module } from '@nestjs/common';
import { MailTransport } from './mail.transport';
import { MailboxController } from './mailbox.controller';
import { OutboxRepository } from './outbox.repository';
import { OutboxService } from './outbox.service';

@Module({
  controllers: [MailboxController],
  providers: [MailTransport, OutboxRepository, OutboxService],
  exports: [OutboxService],
})
export class MailModule {}
