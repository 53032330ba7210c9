import type { INestApplicationContext } from '@nestjs/common';
import type { Knex } from '@sagline/database';
import { KNEX } from '../db/db.tokens';
import { DemoHistoryRepository, type DemoStep } from './demo-history.repository';

/** When something happens in the demo's story: `daysAgo` days before today, at `time` ("HH:MM", UTC). */
export interface StoryMoment {
  daysAgo: number;
  time: `${number}:${number}`;
}

/** The instant of a story moment, counted back from today's date in UTC. */
export function instantOf(m: StoryMoment, now = new Date()): Date {
  const [h, min] = m.time.split(':').map(Number);
  return new Date(Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - m.daysAgo, h, min));
}

/**
 * The demo's history over the last weeks. The seed does every step through
 * the real services (parse and commit, raise, answer, close, waive), so each
 * step writes what a person's request would — revision, flag, flag events,
 * activity entries, e-mails — dated now. `step` notes which rows a step wrote
 * (between two id watermarks) and when the story says it happened;
 * `backdateDemoHistory` then moves those rows to their moments in one
 * transaction. Only dates move: every count, status and due date stays as
 * the services wrote it ("overdue" is still decided against today, in SQL).
 * Sent e-mails keep the time they were really sent.
 */
export class DemoHistory {
  private readonly steps: DemoStep[] = [];
  private readonly repo: DemoHistoryRepository;

  constructor(
    app: INestApplicationContext,
    readonly projectId: number,
    private readonly now = new Date(),
  ) {
    this.repo = new DemoHistoryRepository(app.get<symbol, Knex>(KNEX, { strict: false }));
  }

  /** Runs one step of the seed now and remembers that the story puts it at `when`. */
  async step<T>(when: StoryMoment, work: () => Promise<T>): Promise<T> {
    const before = await this.repo.watermark();
    const out = await work();
    this.steps.push({ at: instantOf(when, this.now), before, after: await this.repo.watermark() });
    return out;
  }

  /**
   * Moves what the steps wrote to the story's moments (and, given
   * `projectCreated`, the project's creation back to it), all in one
   * transaction.
   */
  async backdateDemoHistory(projectCreated?: StoryMoment): Promise<void> {
    await this.repo.backdate(this.projectId, this.steps, projectCreated && instantOf(projectCreated, this.now));
  }
}
