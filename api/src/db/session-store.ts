import { Inject, Injectable, type OnApplicationShutdown } from '@nestjs/common';
import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import { Pool } from 'pg';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';

const PgStore = connectPgSimple(session);

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
    this.store = new PgStore({ pool: this.pool, tableName: 'sessions', createTableIfMissing: false, pruneSessionInterval: 15 * 60 });
  }

  async onApplicationShutdown(): Promise<void> {
    await (this.store as unknown as { close(): Promise<void> }).close();
    await this.pool.end();
  }
}
