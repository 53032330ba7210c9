import { Inject, Injectable, Logger, type OnApplicationBootstrap, type OnApplicationShutdown } from '@nestjs/common';
import PgBoss from 'pg-boss';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { JOB_SETTINGS } from './jobs.tokens';
import type { JobSettings } from './job-settings';

/** What a handler gets: the job's id and data, and how many times it has been started before. */
export interface JobContext<T> {
  id: string;
  data: T;
  retryCount: number;
}

export interface SendOptions {
  /** The job id (a UUID), so the caller can record it before the job runs. */
  id: string;
  /** Starts after the first one when a run fails or its process dies. */
  retryLimit: number;
  /** Seconds between a failure and the next start. */
  retryDelay?: number;
  /** A run still active after this is taken as dead (its process crashed) and started again. */
  expireInSeconds: number;
}

type Handler = (job: JobContext<unknown>) => Promise<void>;

/**
 * The PostgreSQL-backed job queue (pg-boss, which creates and migrates its
 * own `pgboss` schema on start). Jobs live in the database, so any api
 * process with JOBS_WORKER=on picks up what any process queued, and a job
 * whose process died is started again after its expiry. Handlers register in
 * `onModuleInit` of their module; the worker starts when the app has booted.
 */
@Injectable()
export class JobQueue implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger('jobs');
  private readonly handlers = new Map<string, Handler>();
  /** Queue name → cron expression (UTC) of jobs pg-boss sends on a timetable; null: no longer scheduled. */
  private readonly schedules = new Map<string, string | null>();
  private boss: PgBoss | null = null;
  private starting: Promise<PgBoss> | null = null;
  private closed = false;
  /** The next attempt to start the worker after a failed one (database not reachable yet). */
  private retryTimer: NodeJS.Timeout | null = null;

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(JOB_SETTINGS) private readonly settings: JobSettings,
  ) {}

  /** Registers the handler of a queue. A handler that throws is retried (SendOptions.retryLimit). */
  register<T>(name: string, handler: (job: JobContext<T>) => Promise<void>): void {
    this.handlers.set(name, handler as Handler);
  }

  /**
   * Sends a job to `name` on a timetable (cron, UTC), from whichever worker
   * process holds pg-boss's clock; the schedule lives in the database, so
   * several processes send it once. Register the handler too. `null`
   * removes a schedule an earlier start left in the database.
   */
  schedule(name: string, cron: string | null): void {
    this.schedules.set(name, cron);
  }

  async onApplicationBootstrap(): Promise<void> {
    if (!this.settings.worker) return;
    // The API must come up even when the database is not reachable yet (health
    // then answers 503); the worker keeps trying in the background.
    this.startWorker().catch((e: Error) => this.retryWorker(e));
  }

  private retryWorker(e: Error): void {
    this.starting = null;
    // Stopped meanwhile (the app is shutting down): nothing to retry, and nothing to report.
    if (this.closed) return;
    this.logger.error(`job queue could not start (${e.message}); retrying in 10 s`);
    this.retryTimer = setTimeout(() => {
      this.retryTimer = null;
      if (this.closed) return;
      this.startWorker().catch((err: Error) => this.retryWorker(err));
    }, 10_000);
    this.retryTimer.unref();
  }

  private async startWorker(): Promise<void> {
    const boss = await this.started();
    if (this.closed) return;
    for (const [name, handler] of this.handlers) {
      await boss.work<unknown>(name, { pollingIntervalSeconds: this.settings.pollSeconds, includeMetadata: true }, async (jobs) => {
        for (const job of jobs) await handler({ id: job.id, data: job.data, retryCount: job.retryCount });
      });
    }
    for (const [name, cron] of this.schedules) {
      if (cron) await boss.schedule(name, cron, {}, { tz: 'UTC' });
      else await boss.unschedule(name);
    }
  }

  /** Queues a job; returns its id. */
  async send(name: string, data: object, options: SendOptions): Promise<string> {
    const boss = await this.started();
    const id = await boss.send(name, data, {
      id: options.id,
      retryLimit: options.retryLimit,
      retryDelay: options.retryDelay ?? 1,
      expireInSeconds: options.expireInSeconds,
    });
    return id ?? options.id;
  }

  async onApplicationShutdown(): Promise<void> {
    this.closed = true;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    this.retryTimer = null;
    const boss = this.boss ?? (this.starting ? await this.starting.catch(() => null) : null);
    if (!boss) return;
    // Let a running job finish (its transaction commits or rolls back), then close pg-boss's pool.
    await boss.stop({ graceful: true, wait: true, timeout: 30_000 });
  }

  private started(): Promise<PgBoss> {
    this.starting ??= (async () => {
      const boss = new PgBoss({
        connectionString: this.config.databaseUrl,
        max: 3,
        application_name: 'sagline-jobs',
        supervise: this.settings.worker,
        maintenanceIntervalSeconds: this.settings.maintenanceSeconds,
        // The clock that sends scheduled jobs runs only in worker processes that have schedules.
        schedule: this.settings.worker && [...this.schedules.values()].some((c) => c !== null),
      });
      boss.on('error', (e: Error) => this.logger.error(`job queue: ${e.message}`));
      try {
        await boss.start();
        for (const name of this.handlers.keys()) await boss.createQueue(name);
      } catch (e) {
        // A failed start (database unreachable) must not leave its pool behind; the next attempt makes a new one.
        await boss.stop({ graceful: false, wait: false }).catch(() => undefined);
        this.starting = null;
        throw e;
      }
      this.boss = boss;
      return boss;
    })();
    return this.starting;
  }
}
