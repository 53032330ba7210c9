import { Inject, Injectable, Logger, type OnApplicationShutdown, type OnModuleInit } from '@nestjs/common';
import { Client } from 'pg';
import { DATA_CHANGED_CHANNEL } from '@sagline/database';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';

/** How long to wait before listening again after the connection was lost, doubling up to the maximum. */
const RECONNECT_FIRST_MS = 250;
const RECONNECT_MAX_MS = 10_000;

/**
 * A number that moves whenever data the api answers with may have changed,
 * so a process can keep answers in memory and know when they went stale.
 *
 * It moves:
 * - on every NOTIFY of DATA_CHANGED_CHANNEL, which triggers send for each
 *   committed write to a watched table and each change of a session's
 *   contents, whoever wrote it (another api process, a job, the command line);
 * - at once, in this process, after each of its own writing requests
 *   (ReadCacheInterceptor) and session writes (SessionStore), so a person
 *   who just changed something never reads an older answer, even before the
 *   notification arrives;
 * - when the listening connection is lost or comes back.
 *
 * While it is not listening (not yet connected, connection lost, or
 * READ_CACHE=off) `current()` is null and every cache is bypassed: answers
 * then come from the database, as without caches.
 *
 * Correct use: read `current()` BEFORE reading the database, and keep what
 * was read under that number. A change committed in between moves the number,
 * so the entry is never served.
 */
@Injectable()
export class DataVersion implements OnModuleInit, OnApplicationShutdown {
  private readonly log = new Logger('DataVersion');
  private version = 0;
  private listening = false;
  private client: Client | null = null;
  private stopped = false;
  private retryMs = RECONNECT_FIRST_MS;
  private retryTimer: NodeJS.Timeout | null = null;
  private syncs = 0;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {}

  /** The current number, or null when caches must not be used. */
  current(): number | null {
    return this.listening ? this.version : null;
  }

  /** Marks everything read so far as possibly stale (after this process wrote). */
  bump(): void {
    this.version++;
  }

  /**
   * Resolves once every change committed before the call has moved the version: it sends a
   * notification of its own and waits for it (PostgreSQL delivers notifications in commit order).
   * For a caller that wrote through another connection and must read its own write next (tests).
   */
  async caughtUp(timeoutMs = 5_000): Promise<void> {
    const client = this.client;
    if (!client || !this.listening) return;
    const token = `sync:${process.pid}:${++this.syncs}`;
    const heard = new Promise<void>((resolve, reject) => {
      const timer = setTimeout(() => {
        client.off('notification', onNote);
        reject(new Error(`no notification came back within ${timeoutMs} ms`));
      }, timeoutMs);
      const onNote = (n: { channel: string; payload?: string }) => {
        if (n.payload !== token) return;
        clearTimeout(timer);
        client.off('notification', onNote);
        resolve();
      };
      client.on('notification', onNote);
    });
    await client.query('select pg_notify($1, $2)', [DATA_CHANGED_CHANNEL, token]);
    await heard;
  }

  async onModuleInit(): Promise<void> {
    if (!this.config.readCache) return;
    await this.listen();
  }

  async onApplicationShutdown(): Promise<void> {
    this.stopped = true;
    this.listening = false;
    if (this.retryTimer) clearTimeout(this.retryTimer);
    const client = this.client;
    this.client = null;
    await client?.end().catch(() => undefined);
  }

  /** Connects and LISTENs; a failure is logged and retried (the api works meanwhile, uncached). */
  private async listen(): Promise<void> {
    if (this.stopped) return;
    const client = new Client({ connectionString: this.config.databaseUrl, application_name: 'sagline-api-listen' });
    this.client = client;
    const lost = (why: string) => {
      if (this.client !== client) return;
      this.client = null;
      this.listening = false;
      this.version++;
      client.end().catch(() => undefined);
      if (this.stopped) return;
      this.log.warn(`Stopped hearing about data changes (${why}); answering from the database until listening again.`);
      this.retryTimer = setTimeout(() => void this.listen(), this.retryMs);
      this.retryMs = Math.min(this.retryMs * 2, RECONNECT_MAX_MS);
    };
    client.on('error', (e: Error) => lost(e.message));
    client.on('end', () => lost('connection closed'));
    client.on('notification', (n) => {
      if (n.channel === DATA_CHANGED_CHANNEL) this.version++;
    });
    try {
      await client.connect();
      await client.query(`LISTEN ${DATA_CHANGED_CHANNEL}`);
      if (this.client !== client) return;
      // Anything cached before (a previous connection) may have missed changes.
      this.version++;
      this.listening = true;
      this.retryMs = RECONNECT_FIRST_MS;
    } catch (e) {
      lost(e instanceof Error ? e.message : String(e));
    }
  }
}
