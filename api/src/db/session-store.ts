import { Inject, Injectable, type OnApplicationShutdown } from '@nestjs/common';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import { Pool } from 'pg';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';

const PgStore = connectPgSimple(session);

/** How often one process writes a session's new expiry; sessions last 14 days, so a minute's lag is nothing. */
const TOUCH_EVERY_MS = 60_000;
const TOUCHED_MAX = 10_000;

/**
 * The rolling cookie makes express-session "touch" the session on every
 * request, and connect-pg-simple turns each touch into an UPDATE (a WAL
 * write on every GET). This store writes a session's expiry at most once a
 * minute per process; it only remembers when it last did (nothing that
 * matters: a restart or another process just touches once more).
 */
class ThrottledPgStore extends PgStore {
  private readonly touched = new Map<string, number>();

  override touch(sid: string, sess: session.SessionData, fn?: (err?: unknown) => void): void {
    const now = Date.now();
    const last = this.touched.get(sid);
    if (last !== undefined && now - last < TOUCH_EVERY_MS) {
      fn?.();
      return;
    }
    if (this.touched.size >= TOUCHED_MAX) {
      for (const [key, at] of this.touched) if (now - at >= TOUCH_EVERY_MS) this.touched.delete(key);
      if (this.touched.size >= TOUCHED_MAX) this.touched.clear();
    }
    this.touched.set(sid, now);
    super.touch(sid, sess, fn);
  }

  override destroy(sid: string, fn?: (err?: unknown) => void): void {
    this.touched.delete(sid);
    super.destroy(sid, fn);
  }
}

/**
 * Sessions in PostgreSQL (table `sessions`, made by a migration, not by the
 * store), so a restart or a second api process keeps everyone signed in.
 * A small pool of its own: express-session talks to pg directly.
 */
@Injectable()
export class SessionStore implements OnApplicationShutdown {
  readonly store: session.Store;
  private readonly pool: Pool;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.pool = new Pool({ connectionString: config.databaseUrl, max: 5 });
    this.store = new ThrottledPgStore({ pool: this.pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
  }

  async onApplicationShutdown(): Promise<void> {
    await (this.store as unknown as { close(): Promise<void> }).close();
    await this.pool.end();
  }
}
