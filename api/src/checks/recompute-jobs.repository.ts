import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { LimitSetJobState } from '@sagline/common/api-types';
import { KNEX } from '../db/db.tokens';
import type { Trx } from '../db/transaction';
import type { JobFailure } from '../jobs/tracked-job';

export interface RecomputeJobRow {
  id: string;
  project_id: number;
  limit_set_id: number | null;
  kind: 'use' | 'edit';
  requested_by: number | null;
  request: Record<string, unknown>;
  state: LimitSetJobState;
  progress: number;
  step: string | null;
  attempts: number;
  result: unknown;
  error: JobFailure | null;
  created_at: Date;
  updated_at: Date;
}

/**
 * The `recompute_jobs` rows clients poll. Written on the api's own pool,
 * never inside the job's transaction, so progress shows while the work runs.
 */
@Injectable()
export class RecomputeJobsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async insert(row: { id: string; projectId: number; limitSetId: number; kind: 'use' | 'edit'; requestedBy: number; request: Record<string, unknown> }): Promise<void> {
    await this.knex('recompute_jobs').insert({
      id: row.id,
      project_id: row.projectId,
      limit_set_id: row.limitSetId,
      kind: row.kind,
      requested_by: row.requestedBy,
      request: JSON.stringify(row.request),
    });
  }

  find(projectId: number, id: string): Promise<RecomputeJobRow | undefined> {
    return this.knex('recompute_jobs').where({ project_id: projectId, id }).first();
  }

  findById(id: string): Promise<RecomputeJobRow | undefined> {
    return this.knex('recompute_jobs').where({ id }).first();
  }

  /** The project's queued or running job, if any (one change of the active set at a time). */
  findOpen(projectId: number): Promise<RecomputeJobRow | undefined> {
    return this.knex('recompute_jobs').where({ project_id: projectId }).whereIn('state', ['queued', 'running']).orderBy('created_at', 'desc').first();
  }

  async started(id: string): Promise<void> {
    await this.knex('recompute_jobs')
      .where({ id })
      .update({ state: 'running', progress: 0, step: 'Starting', error: null, attempts: this.knex.raw('attempts + 1'), updated_at: this.knex.fn.now() });
  }

  async progress(id: string, progress: number, step: string): Promise<void> {
    await this.knex('recompute_jobs')
      .where({ id, state: 'running' })
      .update({ progress: Math.min(1, Math.max(0, progress)), step, updated_at: this.knex.fn.now() });
  }

  /**
   * Marks the job done INSIDE the work's transaction, so the change and the
   * job's completion are stored together: a retry after a crash between the
   * commit and a separate write would otherwise apply the change twice.
   */
  async completedIn(trx: Trx, id: string, result: unknown): Promise<void> {
    await trx('recompute_jobs').where({ id }).update({ state: 'completed', progress: 1, step: 'Done', result: JSON.stringify(result), error: null, updated_at: trx.fn.now() });
  }

  async completed(id: string, result: unknown): Promise<void> {
    await this.knex('recompute_jobs').where({ id }).update({ state: 'completed', progress: 1, step: 'Done', result: JSON.stringify(result), error: null, updated_at: this.knex.fn.now() });
  }

  /** `final` false: pg-boss starts it again (state back to queued, the error kept). */
  async failed(id: string, error: NonNullable<RecomputeJobRow['error']>, final: boolean): Promise<void> {
    await this.knex('recompute_jobs')
      .where({ id })
      .update({ state: final ? 'failed' : 'queued', step: final ? 'Failed' : 'Waiting to try again', error: JSON.stringify(error), updated_at: this.knex.fn.now() });
  }
}
