import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import type { OutgoingMail } from './mail.transport';

export interface OutboxRow {
  id: string;
  to: string;
  subject: string;
  text: string;
  html: string | null;
  status: 'queued' | 'sent' | 'failed';
  attempts: number;
}

@Injectable()
export class OutboxRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async insert(trx: Trx, mail: OutgoingMail): Promise<number> {
    const [row] = await trx('outbound_mail').insert({ to: mail.to, subject: mail.subject, text: mail.text, html: mail.html }).returning('id');
    return Number(row.id);
  }

  /**
   * Locks one queued message for sending, or returns undefined when it is sent
   * already or another process holds it (SKIP LOCKED: each message is sent once).
   */
  claim(trx: Trx, id: number): Promise<OutboxRow | undefined> {
    return trx('outbound_mail').where({ id, status: 'queued' }).forUpdate().skipLocked().first<OutboxRow | undefined>();
  }

  /** Ids of queued messages due by `asOf`, oldest first. */
  async dueIds(asOf: Date, limit: number): Promise<number[]> {
    const rows = await this.knex('outbound_mail')
      .where({ status: 'queued' })
      .where('next_attempt_at', '<=', asOf)
      .orderBy('id')
      .limit(limit)
      .select('id');
    return rows.map((r: { id: string }) => Number(r.id));
  }

  async markSent(trx: Trx, id: number): Promise<void> {
    await trx('outbound_mail')
      .where({ id })
      .update({ status: 'sent', sent_at: trx.fn.now(), last_error: null, attempts: trx.raw('attempts + 1'), updated_at: trx.fn.now() });
  }

  async markAttemptFailed(trx: Trx, id: number, error: string, next: { retryAt: Date } | { giveUp: true }): Promise<void> {
    await trx('outbound_mail')
      .where({ id })
      .update({
        status: 'giveUp' in next ? 'failed' : 'queued',
        ...('retryAt' in next ? { next_attempt_at: next.retryAt } : {}),
        last_error: error.slice(0, 2000),
        attempts: trx.raw('attempts + 1'),
        updated_at: trx.fn.now(),
      });
  }
}
