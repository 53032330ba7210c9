import { Inject, Injectable, Logger, type OnModuleInit } from '@nestjs/common';
import type { DigestRunReport } from '@sagline/common/api-types';
import { APP_CONFIG } from '../../config/config.tokens';
import type { AppConfig } from '../../config/app-config';
import { TransactionRunner } from '../../db/transaction';
import { JobQueue } from '../../jobs/job-queue';
import { OutboxService } from '../outbox.service';
import { digestMail } from './digest-mail';
import { DigestRepository, type WaitingFlag } from './digest.repository';
import type { DigestSettings } from './digest-settings';
import { DIGEST_QUEUE, DIGEST_SETTINGS } from './digest.tokens';

/** Today as a UTC calendar day. */
export function utcDay(at: Date = new Date()): string {
  return at.toISOString().slice(0, 10);
}

/**
 * The daily digest. For each person who can sign in: nothing when nothing
 * waits on them or their digest is off (weekly: Mondays only); otherwise one
 * e-mail, queued in the outbox in the same transaction that records the day
 * in digest_log, so a second run (another process, a retried job, the CLI
 * after the schedule) queues nothing for a person already done that day. The
 * outbox then sends and retries as for every e-mail.
 */
@Injectable()
export class DigestService implements OnModuleInit {
  private readonly logger = new Logger('digest');

  constructor(
    private readonly digests: DigestRepository,
    private readonly outbox: OutboxService,
    private readonly tx: TransactionRunner,
    private readonly queue: JobQueue,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(DIGEST_SETTINGS) private readonly settings: DigestSettings,
  ) {}

  onModuleInit(): void {
    this.queue.register(DIGEST_QUEUE, async () => {
      const report = await this.run();
      this.logger.log(`digest of ${report.date}: ${report.queued} queued, ${report.nothingWaiting} with nothing waiting, ${report.off} off, ${report.alreadySent} done before`);
    });
    this.queue.schedule(DIGEST_QUEUE, this.settings.cron);
  }

  /** Writes the digests of `day` (default today, UTC) and starts sending them. */
  async run(day: string = utcDay()): Promise<DigestRunReport> {
    const report: DigestRunReport = { date: day, queued: 0, nothingWaiting: 0, off: 0, alreadySent: 0 };
    const monday = new Date(`${day}T00:00:00Z`).getUTCDay() === 1;
    const people = await this.digests.people();
    const done = await this.digests.sentOn(day);
    const wanted = people.filter((p) => {
      if (p.digest === 'off' || (p.digest === 'weekly' && !monday)) {
        report.off++;
        return false;
      }
      if (done.has(p.id)) {
        report.alreadySent++;
        return false;
      }
      return true;
    });
    const byPerson = new Map<number, WaitingFlag[]>();
    for (const w of await this.digests.waiting(day, wanted.map((p) => p.id))) {
      const list = byPerson.get(w.user_id);
      if (list) list.push(w);
      else byPerson.set(w.user_id, [w]);
    }
    const mailIds: number[] = [];
    for (const person of wanted) {
      const items = byPerson.get(person.id) ?? [];
      if (items.length === 0) {
        report.nothingWaiting++;
        continue;
      }
      const id = await this.tx.run(async (trx) => {
        if (!(await this.digests.claimDay(trx, person.id, day, items.length))) return null;
        const mailId = await this.outbox.enqueue(trx, digestMail({ to: person.email, name: person.name, day, publicUrl: this.config.publicUrl, items }));
        await this.digests.setMail(trx, person.id, day, mailId);
        return mailId;
      });
      if (id === null) report.alreadySent++;
      else {
        report.queued++;
        mailIds.push(id);
      }
    }
    this.outbox.deliverSoon(mailIds);
    return report;
  }
}
