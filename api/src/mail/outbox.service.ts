import { Inject, Injectable, Logger, type BeforeApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { TransactionRunner, type Trx } from '../db/transaction';
import { MailTransport, type OutgoingMail } from './mail.transport';
import { OutboxRepository } from './outbox.repository';

/** After this many failed attempts a message is marked `failed` and no longer retried. */
export const MAX_ATTEMPTS = 12;
const FIRST_RETRY_MS = 30_000;
const LONGEST_RETRY_MS = 3_600_000;

export type DeliveryResult = 'sent' | 'queued' | 'failed' | 'skipped';

export interface FlushReport {
  sent: number;
  queued: number;
  failed: number;
}

/**
 * Mail goes to the outbox table first, inside the transaction of the change
 * it reports (so no e-mail announces something that was rolled back, and none
 * is lost when SMTP is down), and is sent after the commit. A failed send stays
 * queued, retried with growing pauses (30 s, 1 min, 2 min ... at most 1 h).
 */
@Injectable()
export class OutboxService implements OnModuleInit, BeforeApplicationShutdown {
  private readonly logger = new Logger('outbox');
  private readonly inFlight = new Set<Promise<unknown>>();
  private timer: NodeJS.Timeout | null = null;

  constructor(
    private readonly outbox: OutboxRepository,
    private readonly transport: MailTransport,
    private readonly tx: TransactionRunner,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
  ) {}

  /** Queues a message in the caller's transaction; returns its id for `deliverSoon`. */
  enqueue(trx: Trx, mail: OutgoingMail): Promise<number> {
    return this.outbox.insert(trx, mail);
  }

  /** Sends queued messages in the background, after the caller's commit. Failures stay queued. */
  deliverSoon(ids: number[]): void {
    for (const id of ids) {
      const p = this.deliver(id).catch((e: unknown) => this.logger.error(`delivery of message ${id} failed: ${String(e)}`));
      this.inFlight.add(p);
      void p.finally(() => this.inFlight.delete(p));
    }
  }

  /** Resolves when every background delivery started so far has finished (tests, shutdown). */
  async settle(): Promise<void> {
    while (this.inFlight.size) await Promise.allSettled([...this.inFlight]);
  }

  /** One attempt at one message, holding its row lock so no other process sends it too. */
  deliver(id: number): Promise<DeliveryResult> {
    return this.tx.run(async (trx) => {
      const row = await this.outbox.claim(trx, id);
      if (!row) return 'skipped';
      try {
        await this.transport.send(row);
        await this.outbox.markSent(trx, id);
        return 'sent';
      } catch (e) {
        const attempts = row.attempts + 1;
        const error = e instanceof Error ? e.message : String(e);
        if (attempts >= MAX_ATTEMPTS) {
          await this.outbox.markAttemptFailed(trx, id, error, { giveUp: true });
          this.logger.error(`message ${id} to ${row.to} failed ${attempts} times, giving up: ${error}`);
          return 'failed';
        }
        const delay = Math.min(FIRST_RETRY_MS * 2 ** (attempts - 1), LONGEST_RETRY_MS);
        await this.outbox.markAttemptFailed(trx, id, error, { retryAt: new Date(Date.now() + delay) });
        this.logger.warn(`message ${id} to ${row.to} not sent (attempt ${attempts}), retrying in ${delay / 1000} s: ${error}`);
        return 'queued';
      }
    });
  }

  /** Retries every queued message due by `asOf` (default now), one at a time. */
  async flushOutbox(asOf: Date = new Date()): Promise<FlushReport> {
    const report: FlushReport = { sent: 0, queued: 0, failed: 0 };
    for (const id of await this.outbox.dueIds(asOf, 100)) {
      const result = await this.deliver(id);
      if (result !== 'skipped') report[result] += 1;
    }
    return report;
  }

  onModuleInit(): void {
    if (this.config.mailRetryMs <= 0) return;
    this.timer = setInterval(() => {
      this.flushOutbox().catch((e: unknown) => this.logger.error(`outbox sweep failed: ${String(e)}`));
    }, this.config.mailRetryMs);
    this.timer.unref();
  }

  /** Before any shutdown hook closes the database: let deliveries under way finish. */
  async beforeApplicationShutdown(): Promise<void> {
    if (this.timer) clearInterval(this.timer);
    await this.settle();
  }
}
