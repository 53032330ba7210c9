import { Injectable } from '@nestjs/common';
import type { ActivityEntry, Page } from '@sagline/common/api-types';
import type { Trx } from '../db/transaction';
import { toActivityEntry } from './activity.mapper';
import { ActivityRepository, type NewActivity } from './activity.repository';

@Injectable()
export class ActivityService {
  constructor(private readonly activity: ActivityRepository) {}

  /** Records an entry inside the caller's transaction, so it exists exactly when the change does. */
  record(trx: Trx, entry: NewActivity): Promise<void> {
    return this.activity.insert(trx, entry);
  }

  async list(projectId: number, page: number, pageSize: number): Promise<Page<ActivityEntry>> {
    const [rows, total] = await Promise.all([
      this.activity.listByProject(projectId, (page - 1) * pageSize, pageSize),
      this.activity.countByProject(projectId),
    ]);
    return { items: rows.map(toActivityEntry), total, page, pageSize };
  }
}
