import { Injectable } from '@nestjs/common';
import type { ScheduleMember } from '@sagline/common/schedule';
import type { AnalysisOutcome } from '../checks/member-analysis';

interface Entry {
  members: ScheduleMember[];
  outcome: AnalysisOutcome;
  limitSetId: number;
  limitSetVersion: number;
  at: number;
}

/** Drafts kept; a preview is usually committed within minutes, by the same person. */
const SIZE = 4;
const MAX_AGE_MS = 30 * 60_000;

/**
 * The last few previews' parsed members and engine results, so a commit in
 * the same api process skips unpacking the draft and running the engine
 * again (for 10,000 members most of a second). Only a shortcut: the engine is
 * deterministic, and a commit that finds nothing here (another process, a
 * restart, a retried job) reads the draft and recomputes the same numbers.
 */
@Injectable()
export class DraftCache {
  private readonly entries = new Map<string, Entry>();

  put(draftId: string, entry: Omit<Entry, 'at'>): void {
    this.entries.set(draftId, { ...entry, at: Date.now() });
    while (this.entries.size > SIZE) this.entries.delete(this.entries.keys().next().value as string);
  }

  /** The entry when it was made under this very limit-set version (and is not stale). */
  take(draftId: string, limitSetId: number, limitSetVersion: number): Omit<Entry, 'at'> | undefined {
    const e = this.entries.get(draftId);
    this.entries.delete(draftId);
    if (!e || e.limitSetId !== limitSetId || e.limitSetVersion !== limitSetVersion || Date.now() - e.at > MAX_AGE_MS) return undefined;
    return e;
  }
}
