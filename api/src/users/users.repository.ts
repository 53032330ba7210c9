import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import type { UserRow } from './users.types';

@Injectable()
export class UsersRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  findByEmail(email: string, trx?: Trx): Promise<UserRow | undefined> {
    return (trx ?? this.knex)<UserRow>('users').where({ email }).first();
  }

  findById(id: number, trx?: Trx): Promise<UserRow | undefined> {
    return (trx ?? this.knex)<UserRow>('users').where({ id }).first();
  }

  /** A signed-in session's user: only accounts that have a password (invitees cannot hold a session). */
  findActiveById(id: number): Promise<UserRow | undefined> {
    return this.knex<UserRow>('users').where({ id }).whereNotNull('password_hash').first();
  }

  listAll(): Promise<UserRow[]> {
    return this.knex<UserRow>('users').orderBy([{ column: 'name' }, { column: 'id' }]);
  }

  /** An account created by an invitation: no password until the invitation is accepted. */
  async insertInvited(trx: Trx, user: { email: string; name: string }): Promise<UserRow> {
    const [row] = await trx<UserRow>('users').insert({ email: user.email, name: user.name, password_hash: null }).returning('*');
    return row;
  }

  /** `daily` keeps a weekly digest weekly: only off → on picks daily. */
  async setDigest(id: number, digest: 'off' | 'daily'): Promise<void> {
    const q = this.knex('users').where({ id });
    if (digest === 'daily') q.where('digest', 'off');
    await q.update({ digest, updated_at: this.knex.fn.now() });
  }

  async setPassword(trx: Trx, id: number, passwordHash: string, name?: string): Promise<void> {
    await trx('users')
      .where({ id })
      .update({ password_hash: passwordHash, ...(name !== undefined ? { name } : {}), updated_at: trx.fn.now() });
  }
}
