import { Inject, Injectable } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import type { ImportJobState } from '@sagline/common/api-types';
import { KNEX } from '../db/db.tokens';
import type { JobFailure } from './tracked-job';

export interface ImportJobRow {
  id: string;
  project_id: number;
  kind: 'commit';
  draft_id: string | null;
  requested_by: number | null;
  request: Record<string, unknown>;
  state: ImportJobState;
  progress: number;
  step: string | null;
  attempts: number;
  result: unknown;
  error: JobFailure | null;
  created_at: Date;
  updated_at: Date;
}

/**
 * The `import_jobs` rows clients poll. Written on the api's own pool, never
 * inside a job's transaction, so progress is visible while the work runs.
 */
@Injectable()
export class JobsRepository {
  constructor(@Inject(KNEX) private readonly knex: Knex) {}

  async insert(row: { id: string; projectId: number; kind: 'commit'; draftId: string; requestedBy: number; request: Record<string, unknown> }): Promise<void> {
    await this.knex('import_jobs').insert({
      id: row.id,
      project_id: row.projectId,
      kind: row.kind,
      draft_id: row.draftId,
      requested_by: row.requestedBy,
      request: JSON.stringify(row.request),
    });
  }

  find(projectId: number, id: string): Promise<ImportJobRow | undefined> {
    return this.knex('import_jobs').where({ project_id: projectId, id }).first();
  }

  findById(id: string): Promise<ImportJobRow | undefined> {
    return this.knex('import_jobs').where({ id }).first();
  }

  /** A queued or running job for a draft, so a second commit click joins it instead of queuing another. */
  findOpenForDraft(draftId: string): Promise<ImportJobRow | undefined> {
    return this.knex('import_jobs').where({ draft_id: draftId }).whereIn('state', ['queued', 'running']).first();
  }

  async started(id: string): Promise<void> {
    await this.knex('import_jobs')
      .where({ id })
      .update({ state: 'running', progress: 0, step: 'Starting', error: null, attempts: this.knex.raw('attempts + 1'), updated_at: this.knex.fn.now() });
  }

  async progress(id: string, progress: number, step: string): Promise<void> {
    await this.knex('import_jobs')
      .where({ id, state: 'running' })
      .update({ progress: Math.min(1, Math.max(0, progress)), step, updated_at: this.knex.fn.now() });
  }

  async completed(id: string, result: unknown): Promise<void> {
    await this.knex('import_jobs').where({ id }).update({ state: 'completed', progress: 1, step: 'Done', result: JSON.stringify(result), error: null, updated_at: this.knex.fn.now() });
  }

  /** `final` false: the job will be started again (state back to queued, the error kept for the record). */
  async failed(id: string, error: JobFailure, final: boolean): Promise<void> {
    await this.knex('import_jobs')
      .where({ id })
      .update({ state: final ? 'failed' : 'queued', step: final ? 'Failed' : 'Waiting to try again', error: JSON.stringify(error), updated_at: this.knex.fn.now() });
  }
}
