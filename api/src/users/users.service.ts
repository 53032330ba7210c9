import { Injectable } from '@nestjs/common';
import type { Me, Preferences, UpdatePreferencesRequest } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';
import { toMe } from './users.mapper';
import { UsersRepository } from './users.repository';

@Injectable()
export class UsersService {
  constructor(private readonly users: UsersRepository) {}

  async listAll(): Promise<Me[]> {
    return (await this.users.listAll()).map(toMe);
  }

  /** The digest is on unless the person turned it off (a weekly digest counts as on). */
  async preferences(userId: number): Promise<Preferences> {
    const row = await this.users.findById(userId);
    if (!row) throw new ApiError('UNAUTHENTICATED', 'Your account no longer exists; sign in again.');
    return { digest: row.digest !== 'off' };
  }

  /** Turning the digest on makes it daily, unless it is on already (a weekly one stays weekly). */
  async updatePreferences(userId: number, change: UpdatePreferencesRequest): Promise<Preferences> {
    await this.users.setDigest(userId, change.digest ? 'daily' : 'off');
    return this.preferences(userId);
  }
}
