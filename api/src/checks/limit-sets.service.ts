import { Injectable } from '@nestjs/common';
import { US_IBC_2021_ACI_318_19, type LimitSet } from '@sagline/common/limits';
import { notFound } from '../common/api-error';
import { TransactionRunner, type Trx } from '../db/transaction';
import { LimitSetsRepository, toLimitSet, type LimitSetRow } from './limit-sets.repository';

/**
 * The preset a project starts with: IBC 2021 Table 1604.3 (with §1604.3.7 and
 * the TMS 402 masonry limit) together with ACI 318-19 Table 24.2.2 for
 * concrete members, as shipped in common/src/limits. The IBC rules are those
 * of the IBC 2021 preset; the concrete categories let a mixed building (the
 * demo has concrete transfer beams) import without editing the set first.
 */
export const DEFAULT_PRESET: LimitSet = US_IBC_2021_ACI_318_19;

export interface ProjectLimitSet {
  row: LimitSetRow;
  set: LimitSet;
}

@Injectable()
export class LimitSetsService {
  constructor(
    private readonly repo: LimitSetsRepository,
    private readonly tx: TransactionRunner,
  ) {}

  /**
   * The project's limit set. A project that has none yet (created before
   * limit sets existed, or just now) gets a copy of DEFAULT_PRESET first,
   * under a lock on the project row so two requests make one copy.
   */
  async forProject(projectId: number): Promise<ProjectLimitSet> {
    const found = await this.repo.findForProject(projectId);
    if (found) return { row: found, set: toLimitSet(found) };
    const row = await this.tx.run(async (trx) => {
      if (!(await this.repo.lockProject(trx, projectId))) throw notFound(`Project ${projectId} was not found, or you are not on its team.`);
      const again = await this.repo.findForProject(projectId, trx);
      if (again) return again;
      await this.repo.insertProjectCopy(trx, projectId, DEFAULT_PRESET);
      return (await this.repo.findForProject(projectId, trx))!;
    });
    return { row, set: toLimitSet(row) };
  }

  /**
   * Whether the project still points at this set at this version, read in
   * the caller's transaction after it took the project's lock (a change of
   * the set holds the same lock): an import commit checks this so it never
   * stores verdicts of a set that changed while it waited.
   */
  async isCurrent(trx: Trx, projectId: number, setId: number, version: number): Promise<boolean> {
    const row = await this.repo.findForProject(projectId, trx);
    return row !== undefined && row.id === setId && row.version === version;
  }
}
