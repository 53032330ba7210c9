import { Global, Inject, Injectable, Module, type OnApplicationShutdown } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { createKnex, type Knex } from '@sagline/database';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';
import { AnswerReplay } from './answer-replay';
import { DataVersion } from './data-version';
import { KNEX } from './db.tokens';
import { ReadCache } from './read-cache';
import { ReadCacheInterceptor } from './read-cache.interceptor';
import { SessionStore } from './session-store';
import { TransactionRunner } from './transaction';

@Injectable()
class KnexCloser implements OnApplicationShutdown {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async onApplicationShutdown(): Promise<void> {
    await this.knex.destroy();
  }
}

/**
 * The Knex provider (one pool per api process), the transaction helper, the session store, and the
 * read cache with the data version it follows (data-version.ts) and the door that replays its
 * answers (answer-replay.ts). No queries here.
 */
@Global()
@Module({
  providers: [
    { provide: KNEX, inject: [APP_CONFIG], useFactory: (config: AppConfig) => createKnex(config.databaseUrl) },
    KnexCloser,
    TransactionRunner,
    DataVersion,
    ReadCache,
    SessionStore,
    AnswerReplay,
    { provide: APP_INTERCEPTOR, useClass: ReadCacheInterceptor },
  ],
  exports: [KNEX, TransactionRunner, SessionStore, DataVersion, ReadCache, AnswerReplay],
})
export class DbModule {}
