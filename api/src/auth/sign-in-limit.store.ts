import type { ClientRateLimitInfo, IncrementResponse, Options, Store } from 'express-rate-limit';
import type { SignInLimitRepository } from './sign-in-limit.repository';

/** An express-rate-limit store over PostgreSQL, so every api process counts the same attempts. */
export class PgRateLimitStore implements Store {
  readonly localKeys = false;
  readonly prefix = 'sign-in:';
  private windowMs = 60_000;
  private calls = 0;

  constructor(private readonly repo: SignInLimitRepository) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const row = await this.repo.get(this.prefix + key);
    return row ? { totalHits: row.hits, resetTime: row.resetAt } : undefined;
  }

  async increment(key: string): Promise<IncrementResponse> {
    // Housekeeping now and then, so old windows do not pile up.
    if (++this.calls % 200 === 0) await this.repo.deleteExpired();
    const row = await this.repo.hit(this.prefix + key, this.windowMs);
    return { totalHits: row.hits, resetTime: row.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.repo.unhit(this.prefix + key);
  }

  async resetKey(key: string): Promise<void> {
    await this.repo.reset(this.prefix + key);
  }
}
