import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../../db/db.tokens';
import type { Trx } from '../../db/transaction';

export interface DigestPerson {
  id: number;
  name: string;
  email: string;
  digest: 'off' | 'daily' | 'weekly';
}

/** One flag waiting on one person. */
export interface WaitingFlag {
  user_id: number;
  /**
   * `assigned`: open and theirs to answer; `to_close`: they raised it, it is
   * answered, theirs to close or reopen; `managed`: overdue in a project they
   * manage (theirs to chase).
   */
  why: 'assigned' | 'to_close' | 'managed';
  assignee_name: string | null;
  flag_id: number;
  project_id: number;
  project_name: string;
  mark: string;
  title: string;
  due_date: string | null;
  overdue: boolean;
  answered_by: string | null;
}

@Injectable()
export class DigestRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  /** Everyone who can sign in (invitees have no account to act from yet), by id. */
  people(): Promise<DigestPerson[]> {
    return this.knex('users').whereNotNull('password_hash').orderBy('id').select('id', 'name', 'email', 'digest');
  }

  /**
   * What waits on each person on `day` (UTC), over the projects they are on:
   * open flags assigned to them, and, for checkers, answered flags they
   * raised; for managers, every overdue flag (open or answered) of the
   * projects they manage. Overdue (due before `day`) first, then by due
   * date, project, mark.
   */
  waiting(day: string, userIds: number[]): Promise<WaitingFlag[]> {
    if (userIds.length === 0) return Promise.resolve([]);
    return this.knex('flags as f')
      .join('projects as p', 'p.id', 'f.project_id')
      .join('project_roles as pr', 'pr.project_id', 'f.project_id')
      .whereIn('pr.user_id', userIds)
      .where((w) =>
        w
          .where((a) => a.whereRaw('f.assignee_id = pr.user_id').where('f.status', 'open'))
          .orWhere((c) => c.whereRaw('f.raised_by = pr.user_id').where('f.status', 'answered').where('pr.role', 'checker'))
          .orWhere((m) => m.where('pr.role', 'manager').whereIn('f.status', ['open', 'answered']).whereRaw('f.due_date < ?::date', [day])),
      )
      .leftJoin('users as au', 'au.id', 'f.assignee_id')
      .orderByRaw('pr.user_id, (f.due_date is not null and f.due_date < ?::date) desc, f.due_date nulls last, p.name, f.mark, f.id', [day])
      .select(
        'pr.user_id',
        this.knex.raw(
          `case when f.assignee_id = pr.user_id and f.status = 'open' then 'assigned'
                when f.raised_by = pr.user_id and f.status = 'answered' and pr.role = 'checker' then 'to_close'
                else 'managed' end as why`,
        ),
        'au.name as assignee_name',
        'f.id as flag_id',
        'f.project_id',
        'p.name as project_name',
        'f.mark',
        'f.title',
        this.knex.raw(`to_char(f.due_date, 'YYYY-MM-DD') as due_date`),
        this.knex.raw('(f.due_date is not null and f.due_date < ?::date) as overdue', [day]),
        this.knex.raw(
          `(select u.name from flag_events e join users u on u.id = e.actor_id
             where e.flag_id = f.id and e.kind = 'status' and e.to_status = 'answered' order by e.id desc limit 1) as answered_by`,
        ),
      );
  }

  /**
   * Marks `day` done for the person, in the transaction that queues the
   * digest. False when it was done already (the primary key refuses a
   * second row; a concurrent run waits for the first and then finds it).
   */
  async claimDay(trx: Trx, userId: number, day: string, items: number): Promise<boolean> {
    const rows = await trx('digest_log').insert({ user_id: userId, day, items }).onConflict(['user_id', 'day']).ignore().returning('user_id');
    return rows.length === 1;
  }

  async setMail(trx: Trx, userId: number, day: string, mailId: number): Promise<void> {
    await trx('digest_log').where({ user_id: userId, day }).update({ mail_id: mailId });
  }

  async sentOn(day: string): Promise<Set<number>> {
    const rows: { user_id: number }[] = await this.knex('digest_log').where({ day }).select('user_id');
    return new Set(rows.map((r) => r.user_id));
  }
}
