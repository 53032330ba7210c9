import { Injectable } from '@nestjs/common';

/**
 * The last overview (or flags-over-time series) computed per project, kept with the fingerprint of the
 * data it was computed from (OverviewRepository.fingerprint). A request
 * reads the fingerprint (a few index reads, no member touched) and answers
 * from here only when it is unchanged, so every api process answers what
 * the database holds now: nothing here has to be shared, invalidated or
 * survive a restart (architecture.md: no state in memory that matters).
 * The fingerprint is read BEFORE the counts, so a change committed while
 * they are counted leaves a stale key, and the next request counts again.
 * Bounded: the projects used least recently are dropped first.
 */
@Injectable()
export class OverviewCache<T> {
  private readonly entries = new Map<number, { key: string; value: T }>();

  constructor(private readonly capacity = 200) {}

  get(projectId: number, key: string): T | undefined {
    const hit = this.entries.get(projectId);
    if (!hit || hit.key !== key) return undefined;
    // Re-insert: Map order is the recency order.
    this.entries.delete(projectId);
    this.entries.set(projectId, hit);
    return hit.value;
  }

  set(projectId: number, key: string, value: T): void {
    this.entries.delete(projectId);
    this.entries.set(projectId, { key, value });
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value!);
  }
}
