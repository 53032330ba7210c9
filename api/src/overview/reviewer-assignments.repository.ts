import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';

export interface PersonRow {
  id: number;
  name: string;
  email: string;
}

export interface LevelAssignmentRow {
  level_id: number;
  level_name: string;
  reviewer_id: number | null;
  reviewer_name: string | null;
}

export interface MarkAssignmentRow {
  mark: string;
  reviewer_id: number;
  reviewer_name: string;
}

/** Which members of a revision to bring up to date. */
export type RefreshScope = { levelId: number } | { marks: string[] } | 'assigned';

/**
 * Reviewer assignments and the effective reviewer they give members.
 * `members.reviewer_id` holds the EFFECTIVE reviewer (what the Members list,
 * its facets, flags and the overview read): the mark's assignment, else the
 * level's, else the schedule's Reviewer column matched against the team by
 * e-mail (as the import matches it; `members.reviewer_email` keeps what the
 * schedule said). Only the latest revision follows assignments; older
 * revisions keep the reviewers they had.
 */
@Injectable()
export class ReviewerAssignmentsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  levelAssignments(projectId: number): Promise<LevelAssignmentRow[]> {
    return this.knex('levels as l')
      .leftJoin('reviewer_assignments as ra', (j) => j.on('ra.level_id', 'l.id').andOn('ra.project_id', 'l.project_id'))
      .leftJoin('users as u', 'u.id', 'ra.reviewer_id')
      .where('l.project_id', projectId)
      .orderBy('l.position')
      .select('l.id as level_id', 'l.name as level_name', 'ra.reviewer_id', 'u.name as reviewer_name');
  }

  markAssignments(projectId: number): Promise<MarkAssignmentRow[]> {
    return this.knex('reviewer_assignments as ra')
      .join('users as u', 'u.id', 'ra.reviewer_id')
      .where('ra.project_id', projectId)
      .whereNotNull('ra.mark')
      .orderByRaw('ra.mark collate mark_natural')
      .select('ra.mark', 'ra.reviewer_id', 'u.name as reviewer_name');
  }

  /** The project's checkers, by name: who may be assigned as a reviewer. */
  checkers(projectId: number, trx?: Trx): Promise<PersonRow[]> {
    return (trx ?? this.knex)('project_roles as r')
      .join('users as u', 'u.id', 'r.user_id')
      .where({ 'r.project_id': projectId, 'r.role': 'checker' })
      .orderBy('u.name')
      .select('u.id', 'u.name', 'u.email');
  }

  level(trx: Trx, projectId: number, levelId: number): Promise<{ id: number; name: string } | undefined> {
    return trx('levels').where({ project_id: projectId, id: levelId }).first('id', 'name');
  }

  async setLevel(trx: Trx, projectId: number, levelId: number, reviewerId: number | null, by: number): Promise<void> {
    await trx('reviewer_assignments').where({ project_id: projectId, level_id: levelId }).delete();
    if (reviewerId !== null) {
      await trx('reviewer_assignments').insert({ project_id: projectId, level_id: levelId, reviewer_id: reviewerId, assigned_by: by });
    }
  }

  /** Marks (as the latest revision spells them) get this reviewer, or lose their own assignment (null). */
  async setMarks(trx: Trx, projectId: number, marks: string[], reviewerId: number | null, by: number): Promise<void> {
    await trx('reviewer_assignments')
      .where({ project_id: projectId })
      .whereNotNull('mark')
      .whereRaw('lower(mark) = any(?)', [marks.map((m) => m.toLowerCase())])
      .delete();
    if (reviewerId !== null && marks.length) {
      await trx('reviewer_assignments').insert(marks.map((mark) => ({ project_id: projectId, mark, reviewer_id: reviewerId, assigned_by: by })));
    }
  }

  async hasAny(trx: Trx, projectId: number): Promise<boolean> {
    return (await trx('reviewer_assignments').where({ project_id: projectId }).first('id')) !== undefined;
  }

  /**
   * Writes the effective reviewer into the revision's members in scope (only
   * rows whose reviewer changes are written). Returns how many changed.
   */
  async refresh(trx: Trx, projectId: number, revisionId: number, scope: RefreshScope): Promise<number> {
    const bindings: Knex.RawBinding[] = [projectId, projectId, projectId, revisionId];
    let where = '';
    if (scope === 'assigned') {
      where = `and (m.level_id in (select level_id from reviewer_assignments where project_id = ? and level_id is not null)
                or lower(m.mark) in (select lower(mark) from reviewer_assignments where project_id = ? and mark is not null))`;
      bindings.push(projectId, projectId);
    } else if ('levelId' in scope) {
      where = 'and m.level_id = ?';
      bindings.push(scope.levelId);
    } else {
      where = 'and lower(m.mark) = any(?)';
      bindings.push(scope.marks.map((m) => m.toLowerCase()));
    }
    const result = await trx.raw(
      `with eff as (
         select m.id,
                coalesce(
                  (select ra.reviewer_id from reviewer_assignments ra where ra.project_id = ? and ra.mark is not null and lower(ra.mark) = lower(m.mark)),
                  (select ra.reviewer_id from reviewer_assignments ra where ra.project_id = ? and ra.level_id = m.level_id),
                  (select pr.user_id from project_roles pr join users u on u.id = pr.user_id
                    where pr.project_id = ? and lower(u.email) = lower(m.reviewer_email) limit 1)
                ) as reviewer_id
           from members m
          where m.revision_id = ? ${where}
       )
       update members m set reviewer_id = eff.reviewer_id
         from eff
        where m.id = eff.id and m.reviewer_id is distinct from eff.reviewer_id`,
      bindings,
    );
    return result.rowCount ?? 0;
  }

  /** Marks of the revision among these (ignoring case), as the revision spells them. */
  async marksIn(trx: Trx, revisionId: number, marks: string[]): Promise<string[]> {
    const rows: { mark: string }[] = await trx('members')
      .where({ revision_id: revisionId })
      .whereRaw('lower(mark) = any(?)', [marks.map((m) => m.trim().toLowerCase())])
      .orderByRaw('mark collate mark_natural')
      .select('mark');
    return rows.map((r) => r.mark);
  }

  /**
   * Waits for commits of the project (they hold its row for their whole run),
   * so an assignment lands either before a new revision's members are written
   * (the commit then applies it) or after (it applies to them itself).
   */
  async lockProject(trx: Trx, projectId: number): Promise<boolean> {
    return (await trx('projects').where({ id: projectId }).forUpdate().first('id')) !== undefined;
  }

  latestRevision(trx: Trx, projectId: number): Promise<{ id: number; number: number } | undefined> {
    return trx('revisions').where({ project_id: projectId }).orderBy('number', 'desc').first('id', 'number');
  }
}
