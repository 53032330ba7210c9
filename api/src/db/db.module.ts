import { Global, Inject, Injectable, Module, type OnApplicationShutdown } from '@nestjs/common';
import { createKnex, type Knex } from '@sagline/database';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { KNEX } from './db.tokens';
import { SessionStore } from './session-store';
import { TransactionRunner } from './transaction';

@Injectable()
class KnexCloser implements OnApplicationShutdown {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async onApplicationShutdown(): Promise<void> {
    await this.knex.destroy();
  }
}

/** The Knex provider (one pool per api process), the transaction helper and the session store. No queries here. */
@Global()
@Module({
  providers: [
    { provide: KNEX, inject: [APP_CONFIG], useFactory: (config: AppConfig) => createKnex(config.databaseUrl) },
    KnexCloser,
    TransactionRunner,
    SessionStore,
  ],
  exports: [KNEX, TransactionRunner, SessionStore],
})
export class DbModule {}
