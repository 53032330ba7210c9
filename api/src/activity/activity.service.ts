import { Injectable } from '@nestjs/common';
import { ACTIVITY_KIND_PREFIXES, type ActivityEntry, type ActivityPerson, type Page } from '@sagline/common/api-types';
import { invalidField } from '../common/api-error';
import type { Trx } from '../db/transaction';
import { toActivityEntry } from './activity.mapper';
import { ActivityRepository, type NewActivity } from './activity.repository';
import type { ListActivityQuery } from './dto/list-activity.dto';

@Injectable()
export class ActivityService {
  constructor(private readonly activity: ActivityRepository) {}

  /** Records an entry inside the caller's transaction, so it exists exactly when the change does. */
  record(trx: Trx, entry: NewActivity): Promise<void> {
    return this.activity.insert(trx, entry);
  }

  /** A page of the feed, newest first, filtered by kind, person, days and words. */
  async list(projectId: number, query: ListActivityQuery): Promise<Page<ActivityEntry>> {
    const { page, pageSize } = query;
    if (query.from && query.to && query.from > query.to) {
      throw invalidField('query.to', `is ${query.to}, before the start day ${query.from}; give an end day on or after the start`);
    }
    const filter = {
      prefixes: query.kind?.map((k) => ACTIVITY_KIND_PREFIXES[k]),
      actorId: query.actorId,
      from: query.from,
      to: query.to,
      q: query.q || undefined,
    };
    const [rows, total] = await Promise.all([
      this.activity.list(projectId, filter, (page - 1) * pageSize, pageSize),
      this.activity.count(projectId, filter),
    ]);
    return { items: rows.map(toActivityEntry), total, page, pageSize };
  }

  people(projectId: number): Promise<ActivityPerson[]> {
    return this.activity.people(projectId);
  }
}
