import type { INestApplicationContext } from '@nestjs/common';
import { DEMO_PROJECT } from '@sagline/database';
import type { ProjectAccess } from '../auth/project-access';
import type { SessionUser } from '../auth/session-user';
import { MembersRepository } from '../members/members.repository';
import { FlagChangesService } from './flag-changes.service';
import { FlagsRepository } from './flags.repository';
import { FlagsService } from './flags.service';

/** A calendar date `days` from today (UTC), "YYYY-MM-DD". */
function day(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

/**
 * Flags at different stages on the demo project (product.md: "some failing
 * members and open flags at different stages"), made through the same
 * services as the routes, so each has its history, activity and e-mails:
 * on the six most utilised failing members of the latest revision, raised by
 * the project's checkers in turn and assigned to its first engineer — two
 * open (one overdue), one answered, one closed after its answer, one waived,
 * one open and unassigned. Does nothing when the project is missing, has no
 * revision, no checker or engineer, or has flags already (so it can run
 * after every seed). Returns one line saying what it did.
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
  const plans = [
    { due: day(14), then: 'open' },
    { due: day(-3), then: 'open' },
    { due: day(7), then: 'answered' },
    { due: day(-10), then: 'closed' },
    { due: null, then: 'waived' },
    { due: null, then: 'unassigned' },
  ] as const;

  let raised = 0;
  for (let i = 0; i < failing.length; i++) {
    const m = failing[i];
    const plan = plans[i];
    const checker = as(checkers[i % checkers.length], 'checker');
    let flag = await flags.raise(checker.access, checker.user, {
      mark: m.mark,
      checkName: m.governing_check,
      comment: `${m.governing_check} exceeded at utilisation ${m.max_utilization?.toFixed(2)}; the I that would pass is in the checks table.`,
      assigneeId: plan.then === 'unassigned' ? null : engineer.id,
      dueDate: plan.due,
    });
    raised++;
    if (plan.then === 'answered' || plan.then === 'closed') {
      flag = await changes.answer(engineerAs.access, engineerAs.user, flag.id, { version: flag.version, body: 'Next revision takes the next deeper section of the same family; the required I is met with margin.' });
    }
    if (plan.then === 'closed') {
      await changes.close(checker.access, checker.user, flag.id, { version: flag.version, body: 'Agreed; close when the revision shows it.' });
    }
    if (plan.then === 'waived') {
      await changes.waive(checker.access, checker.user, flag.id, { version: flag.version, reason: 'Accepted by the engineer of record: finishes on this member tolerate the deflection (demo).' });
    }
  }
  return `raised ${raised} demo flags on revision ${latest.number} of project ${projectNumber} (open, overdue, answered, closed, waived, unassigned)`;
}
