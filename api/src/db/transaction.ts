import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from './db.tokens';

/**
 * An open transaction, handed from a service to repository methods. Services
 * pass it along and never query through it (Knex stays in repositories).
 */
export type Trx = Knex.Transaction;

/** Runs a unit of work in one transaction: all of it is written, or none. */
@Injectable()
export class TransactionRunner {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  run<T>(work: (trx: Trx) => Promise<T>): Promise<T> {
    return this.knex.transaction(work);
  }
}
