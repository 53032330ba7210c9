import { Injectable } from '@nestjs/common';
import type { ImportDiff } from '@sagline/common/api-types';
import type { Trx } from '../db/transaction';
import { ReviewerAssignmentsRepository } from './reviewer-assignments.repository';
import { SignOffsService } from './sign-offs.service';

/**
 * What the overview needs from every import commit, called inside its
 * transaction once the new revision's members are written:
 * the managers' reviewer assignments are applied to the new members, and the
 * sign-offs of levels the revision touched are voided. Also called by the
 * recompute of a limit-set change (onResultsRecomputed).
 */
@Injectable()
export class OverviewRevisionHook {
  constructor(
    private readonly assignments: ReviewerAssignmentsRepository,
    private readonly signOffs: SignOffsService,
  ) {}

  async onRevisionCommitted(trx: Trx, projectId: number, revision: { id: number; number: number }, diff: ImportDiff): Promise<void> {
    if (await this.assignments.hasAny(trx, projectId)) await this.assignments.refresh(trx, projectId, revision.id, 'assigned');
    await this.signOffs.voidTouchedLevels(trx, projectId, revision, diff);
  }

  /**
   * Called inside the transaction that recomputes the latest revision under a
   * new limit set (a set chosen, or the set in use edited; inline or as a
   * job): the sign-offs of levels on which a verdict flipped are voided, the
   * reason naming the set and the marks. Returns the levels voided.
   */
  onResultsRecomputed(...args: Parameters<SignOffsService['voidFlippedLevels']>): Promise<string[]> {
    return this.signOffs.voidFlippedLevels(...args);
  }
}
