import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';

@Injectable()
export class HealthRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async ping(): Promise<void> {
    await this.knex.raw('select 1');
  }
}
