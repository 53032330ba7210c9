import type { INestApplicationContext } from '@nestjs/common';
import { DEMO_PROJECT } from '@sagline/database';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { MembersRepository } from '../members/members.repository';
import { DemoHistory, instantOf, type StoryMoment } from './demo-history';
import { FlagChangesService } from './flag-changes.service';
import { FlagsRepository } from './flags.repository';
import { FlagsService } from './flags.service';

/** A calendar date `days` from today (UTC), "YYYY-MM-DD". */
function day(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/**
 * The demo flags, one per failing member from the most utilised down: what
 * becomes of each, its due date in days from today, and when the story puts
 * each step (demo-history.ts): raised on different days in the three weeks
 * after revision 1 (25 days ago, demo-seed.ts); the earliest two were dealt
 * with (answered then closed, waived), one was answered last week, the one
 * due 3 days ago is overdue, the newest waits for someone to take it.
 */
export const DEMO_FLAG_PLANS: readonly {
  then: 'open' | 'answered' | 'closed' | 'waived' | 'unassigned';
  dueInDays: number | null;
  raised: StoryMoment;
  answered?: StoryMoment;
  closed?: StoryMoment;
  waived?: StoryMoment;
}[] = [
  { then: 'open', dueInDays: 14, raised: { daysAgo: 9, time: '13:35' } },
  { then: 'open', dueInDays: -3, raised: { daysAgo: 15, time: '10:05' } },
  { then: 'answered', dueInDays: 7, raised: { daysAgo: 12, time: '09:50' }, answered: { daysAgo: 5, time: '11:20' } },
  { then: 'closed', dueInDays: -10, raised: { daysAgo: 23, time: '09:25' }, answered: { daysAgo: 20, time: '14:05' }, closed: { daysAgo: 18, time: '10:30' } },
  { then: 'waived', dueInDays: null, raised: { daysAgo: 22, time: '11:15' }, waived: { daysAgo: 17, time: '16:45' } },
  { then: 'unassigned', dueInDays: null, raised: { daysAgo: 2, time: '15:55' } },
];

/**
 * Flags at different stages on the demo project (product.md: "some failing
 * members and open flags at different stages"), made through the same
 * services as the routes, so each has its history, activity and e-mails:
 * on the six most utilised failing members of the latest revision, raised by
 * the project's checkers in turn and assigned to its first engineer — two
 * open (one overdue), one answered, one closed after its answer, one waived,
 * one open and unassigned. Their history is then dated over the last three
 * weeks as DEMO_FLAG_PLANS tells (demo-history.ts): raised on different days,
 * answered, closed or waived days later; the due dates count from today, so
 * the overdue one is overdue today. When the latest revision is newer than
 * the story's first raise (a revision uploaded since), the flags keep today's
 * dates: a flag is never dated before its revision. Does nothing when the
 * project is missing, has no revision, no checker or engineer, or has flags
 * already (so it can run after every seed). Returns one line saying what it did.
 */
export async function seedDemoFlags(app: INestApplicationContext, projectNumber = DEMO_PROJECT.number): Promise<string> {
  const repo = app.get(FlagsRepository, { strict: false });
  const members = app.get(MembersRepository, { strict: false });
  const flags = app.get(FlagsService, { strict: false });
  const changes = app.get(FlagChangesService, { strict: false });

  const projectId = await repo.projectIdByNumber(projectNumber);
  if (projectId === undefined) return `no project ${projectNumber}: no flags raised`;
  if (await repo.hasFlags(projectId)) return `project ${projectNumber} has flags already: none raised`;
  const latest = await members.latestRevision(projectId);
  if (!latest) return `project ${projectNumber} has no revision yet: no flags raised`;
  const team = await repo.team(projectId);
  const checkers = team.filter((p) => p.role === 'checker');
  const engineer = team.find((p) => p.role === 'engineer');
  if (!checkers.length || !engineer) return `project ${projectNumber} needs a checker and an engineer: no flags raised`;
  const failing = await members.listPage(projectId, latest.id, { verdicts: ['fail'] }, '-utilization', 0, 6);
  if (failing.length === 0) return `no failing member in revision ${latest.number}: no flags raised`;

  const as = (p: { id: number; name: string; email: string }, role: ProjectAccess['role']): { access: ProjectAccess; user: SessionUser } => ({
    access: { projectId, role, myRole: role ?? 'admin', canManage: role === 'manager' },
    user: { id: p.id, name: p.name, email: p.email, isAdmin: false },
  });
  const engineerAs = as(engineer, 'engineer');
  const plans = DEMO_FLAG_PLANS.map((p) => ({ ...p, due: p.dueInDays === null ? null : day(p.dueInDays) }));
  const history = new DemoHistory(app, projectId);
  const firstRaise = instantOf(plans.slice(0, failing.length).reduce((a, p) => (p.raised.daysAgo > a.raised.daysAgo ? p : a)).raised);
  const dated = latest.created_at.getTime() < firstRaise.getTime();

  let raised = 0;
  for (let i = 0; i < failing.length; i++) {
    const m = failing[i];
    const plan = plans[i];
    const checker = as(checkers[i % checkers.length], 'checker');
    let flag = await history.step(plan.raised, () =>
      flags.raise(checker.access, checker.user, {
        mark: m.mark,
        checkName: m.governing_check,
        comment: `${m.governing_check} exceeded at utilisation ${m.max_utilization?.toFixed(2)}; the I that would pass is in the checks table.`,
        assigneeId: plan.then === 'unassigned' ? null : engineer.id,
        dueDate: plan.due,
      }),
    );
    raised++;
    if (plan.answered) {
      const v = flag.version;
      flag = await history.step(plan.answered, () =>
        changes.answer(engineerAs.access, engineerAs.user, flag.id, { version: v, body: 'Next revision takes the next deeper section of the same family; the required I is met with margin.' }),
      );
    }
    if (plan.closed) {
      const v = flag.version;
      await history.step(plan.closed, () => changes.close(checker.access, checker.user, flag.id, { version: v, body: 'Agreed; close when the revision shows it.' }));
    }
    if (plan.waived) {
      const v = flag.version;
      await history.step(plan.waived, () =>
        changes.waive(checker.access, checker.user, flag.id, { version: v, reason: 'Accepted by the engineer of record: finishes on this member tolerate the deflection (demo).' }),
      );
    }
  }
  const stages = '(open, overdue, answered, closed, waived, unassigned)';
  if (!dated) return `raised ${raised} demo flags on revision ${latest.number} of project ${projectNumber} ${stages}, dated now (the revision is newer than their story)`;
  await history.backdateDemoHistory();
  const days = plans
    .slice(0, raised)
    .flatMap((p) => [p.raised, p.answered, p.closed, p.waived])
    .filter((m): m is StoryMoment => m !== undefined)
    .map((m) => m.daysAgo);
  return `raised ${raised} demo flags on revision ${latest.number} of project ${projectNumber} ${stages}, their history dated from ${Math.max(...days)} to ${Math.min(...days)} days ago`;
}
