import { Injectable } from '@nestjs/common';
import type { FlagsOverTime, OverviewLevelRow, OverviewReviewerRow, ProjectOverview } from '@sagline/common/api-types';
import type { ProjectAccess } from '../auth/project-access';
import { notFound } from '../common/api-error';
import { ReadCache } from '../db/read-cache';
import { EMPTY_COUNTS, toCounts, toOverviewRevision, toSignOff } from './overview.mapper';
import { OverviewRepository, type OverviewGroupRow } from './overview.repository';
import { ReviewerAssignmentsRepository } from './reviewer-assignments.repository';
import { SignOffsRepository } from './sign-offs.repository';

/** The Overview: counts from SQL, put in the order the screen shows them. */
@Injectable()
export class OverviewService {
  constructor(
    private readonly repo: OverviewRepository,
    private readonly assignments: ReviewerAssignmentsRepository,
    private readonly signOffs: SignOffsRepository,
    private readonly cache: ReadCache,
  ) {}

  /** Answered from memory while no data changed (db/read-cache.ts). */
  overview(access: ProjectAccess): Promise<ProjectOverview> {
    return this.cache.get(`overview:${access.projectId}`, () => this.count(access.projectId));
  }

  private async count(projectId: number): Promise<ProjectOverview> {
    const [project, latest, levels, levelAssignments, signOffs, today] = await Promise.all([
      this.repo.project(projectId),
      this.repo.latestRevision(projectId),
      this.repo.levels(projectId),
      this.assignments.levelAssignments(projectId),
      this.signOffs.newestPerLevel(projectId),
      this.repo.today(),
    ]);
    if (!project) throw notFound(`Project ${projectId} was not found, or you are not on its team.`);
    const groups = mergeGroups(await this.repo.grouped(projectId, latest?.id ?? null));

    const levelGroups = groups.filter((g) => g.grp === 'level');
    const byLevelId = new Map(levelGroups.filter((g) => g.present && g.level_id !== null).map((g) => [g.level_id!, g]));
    const assigned = new Map(levelAssignments.map((a) => [a.level_id, a]));
    const signed = new Map(signOffs.map((s) => [s.level_id, s]));

    const levelRows: OverviewLevelRow[] = levels.map((l) => {
      const a = assigned.get(l.id);
      const s = signed.get(l.id);
      return {
        level: { id: l.id, name: l.name },
        ...toCounts(byLevelId.get(l.id) ?? EMPTY_COUNTS),
        assignedReviewer: a?.reviewer_id != null && a.reviewer_name !== null ? { id: a.reviewer_id, name: a.reviewer_name } : null,
        signOff: s ? toSignOff(s) : null,
      };
    });
    // Level names the schedule used that are not (or no longer) the project's levels.
    for (const g of levelGroups.filter((g) => g.present && g.level_id === null).sort((a, b) => (a.level_name ?? '').localeCompare(b.level_name ?? ''))) {
      levelRows.push({ level: { id: null, name: g.level_name ?? '' }, ...toCounts(g), assignedReviewer: null, signOff: null });
    }
    const gone = levelGroups.find((g) => g.present === false);
    if (gone) levelRows.push({ level: null, ...toCounts(gone), assignedReviewer: null, signOff: null });

    const reviewerGroups = groups.filter((g) => g.grp === 'reviewer');
    const named = reviewerGroups.filter((g) => g.present && g.reviewer_id !== null).sort(byName);
    const reviewerRows: OverviewReviewerRow[] = [
      ...named,
      ...reviewerGroups.filter((g) => g.present && g.reviewer_id === null),
      ...reviewerGroups.filter((g) => g.present === false),
    ].map((g) => ({
      reviewer: g.reviewer_id !== null ? { id: g.reviewer_id, name: g.reviewer_name ?? '', email: g.reviewer_email ?? '' } : null,
      present: g.present !== false,
      ...toCounts(g),
    }));

    const total = groups.find((g) => g.grp === 'total');
    return {
      project: { id: project.id, name: project.name, number: project.number },
      latestRevision: latest ? toOverviewRevision(latest) : null,
      totals: toCounts(total ?? EMPTY_COUNTS),
      levels: levelRows,
      reviewers: reviewerRows,
      today,
    };
  }

  /** Kept like the overview, per window length. */
  flagsOverTime(access: ProjectAccess, days: number): Promise<FlagsOverTime> {
    return this.cache.get(`flags-over-time:${access.projectId}:${days}`, async () => {
      const points = await this.repo.flagsOverTime(access.projectId, days);
      return { from: points[0]?.day ?? '', to: points[points.length - 1]?.day ?? '', points };
    });
  }
}

function byName(a: OverviewGroupRow, b: OverviewGroupRow): number {
  return (a.reviewer_name ?? '').localeCompare(b.reviewer_name ?? '') || (a.reviewer_id ?? 0) - (b.reviewer_id ?? 0);
}

const groupKey = (g: OverviewGroupRow) =>
  g.grp === 'total' ? 'total' : g.grp === 'level' ? `level:${g.present}:${g.level_id}:${g.level_name}` : `reviewer:${g.present}:${g.reviewer_id}`;

/** The member counts and the flag counts of the same group side by side (each row carries zeros for the other half). */
function mergeGroups(rows: OverviewGroupRow[]): OverviewGroupRow[] {
  const byKey = new Map<string, OverviewGroupRow>();
  for (const r of rows) {
    const key = groupKey(r);
    const seen = byKey.get(key);
    if (!seen) {
      byKey.set(key, { ...r });
      continue;
    }
    for (const f of ['members', 'pass', 'fail', 'unchecked', 'open', 'answered', 'closed', 'waived', 'total_flags', 'overdue'] as const) seen[f] += r[f];
    seen.reviewer_name ??= r.reviewer_name;
    seen.reviewer_email ??= r.reviewer_email;
  }
  return [...byKey.values()];
}
