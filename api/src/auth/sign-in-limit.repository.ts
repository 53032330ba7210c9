import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';

export interface HitCount {
  hits: number;
  resetAt: Date;
}

/** Counters of the sign-in limiter in `rate_limit_hits`, shared by every api process. */
@Injectable()
export class SignInLimitRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /** Counts one hit in the key's current window (a new window starts once the old one is over). One atomic upsert. */
  async hit(key: string, windowMs: number): Promise<HitCount> {
    const { rows } = await this.knex.raw<{ rows: { hits: number; reset_at: Date }[] }>(
      `insert into rate_limit_hits as h (key, hits, reset_at)
         values (?, 1, now() + ? * interval '1 millisecond')
       on conflict (key) do update set
         hits = case when h.reset_at <= now() then 1 else h.hits + 1 end,
         reset_at = case when h.reset_at <= now() then excluded.reset_at else h.reset_at end
       returning hits, reset_at`,
      [key, windowMs],
    );
    return { hits: rows[0].hits, resetAt: rows[0].reset_at };
  }

  async get(key: string): Promise<HitCount | undefined> {
    const row = await this.knex('rate_limit_hits').where({ key }).where('reset_at', '>', this.knex.fn.now()).first('hits', 'reset_at');
    return row ? { hits: row.hits, resetAt: row.reset_at } : undefined;
  }

  async unhit(key: string): Promise<void> {
    await this.knex('rate_limit_hits').where({ key }).where('hits', '>', 0).decrement('hits', 1);
  }

  async reset(key: string): Promise<void> {
    await this.knex('rate_limit_hits').where({ key }).delete();
  }

  async deleteExpired(): Promise<void> {
    await this.knex('rate_limit_hits').where('reset_at', '<', this.knex.fn.now()).delete();
  }
}
