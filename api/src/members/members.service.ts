import { Injectable } from '@nestjs/common';
import type { MemberDetail, MemberFacets, MemberHistoryEntry, MembersPage } from '@sagline/common/api-types';
import { analyzeBeam } from '@sagline/common/engine';
import { buildBeamInput, VERDICT_CAUTION, type LimitRule, type MaterialId } from '@sagline/common/limits';
import { memberBeamInput, memberChanges, type ScheduleMember } from '@sagline/common/schedule';
import type { ProjectAccess } from '../auth/project-access';
import { notFound } from '../common/api-error';
import { ReadCache } from '../db/read-cache';
import { FlagsService } from '../flags/flags.service';
import type { ListMembersQuery } from './dto/list-members.dto';
import { toMemberFilter } from './member-filter';
import { toFieldChange, toLoadView, toMemberRow, toResultView, toRevisionRef, toRuleView, toScheduleMember } from './members.mapper';
import { MembersRepository, type MemberLoadRow, type RevisionRefRow } from './members.repository';

/**
 * The Members list and facets of one revision, and one member explained:
 * its stored data, the engine input built as the import builds it, a fresh
 * engine report (curves, contributions), the stored results with their
 * rules' sources, its flags and its history across revisions.
 */
@Injectable()
export class MembersService {
  constructor(
    private readonly members: MembersRepository,
    private readonly flags: FlagsService,
    private readonly cache: ReadCache,
  ) {}

  /** A page of the list, kept in memory per query while no data changed (db/read-cache.ts). */
  list(access: ProjectAccess, q: ListMembersQuery): Promise<MembersPage> {
    return this.cache.get(`members:${access.projectId}:${JSON.stringify(q)}`, () => this.readPage(access, q));
  }

  /** The facets (counts per level, category, …), kept like the list. */
  facets(access: ProjectAccess, revisionParam: string): Promise<MemberFacets> {
    return this.cache.get(`member-facets:${access.projectId}:${revisionParam}`, () => this.countFacets(access, revisionParam));
  }

  private async readPage(access: ProjectAccess, q: ListMembersQuery): Promise<MembersPage> {
    const filter = toMemberFilter(q);
    // The usual page (rows there): revision, rows and total in one query.
    const offset = (q.page - 1) * q.pageSize;
    const found = await this.members.listPageOfRevision(access.projectId, q.revision === 'latest' ? 'latest' : Number(q.revision), filter, q.sort, offset, q.pageSize);
    if (found) {
      return { items: found.rows.map(toMemberRow), total: found.total, page: q.page, pageSize: q.pageSize, revision: toRevisionRef(found.revision) };
    }
    // No row: say why (no revision yet, another project's revision, nothing matches, a page past the end).
    const revision = await this.revision(access.projectId, q.revision, { optional: true });
    if (!revision) return { items: [], total: 0, page: q.page, pageSize: q.pageSize, revision: null };
    const [rows, total] = await Promise.all([
      this.members.listPage(access.projectId, revision.id, filter, q.sort, (q.page - 1) * q.pageSize, q.pageSize),
      this.members.count(revision.id, filter),
    ]);
    return { items: rows.map(toMemberRow), total, page: q.page, pageSize: q.pageSize, revision: toRevisionRef(revision) };
  }

  private async countFacets(access: ProjectAccess, revisionParam: string): Promise<MemberFacets> {
    const revision = await this.revision(access.projectId, revisionParam, { optional: true });
    if (!revision) {
      return { revision: null, total: 0, verdicts: { pass: 0, fail: 0, unchecked: 0 }, levels: [], categories: [], materials: [], reviewers: [], checks: [] };
    }
    const f = await this.members.facets(revision.id);
    const failing = new Map(f.failingChecks.map((c) => [c.check_name, c.fail_count]));
    const names = [...new Set([...f.checkNames, ...failing.keys()])];
    return {
      revision: toRevisionRef(revision),
      total: f.totals.total,
      verdicts: { pass: f.totals.pass, fail: f.totals.fail, unchecked: f.totals.unchecked },
      levels: f.levels.map((l) => ({ id: l.level_id, name: l.level_name, count: l.count, failCount: l.fail_count })),
      categories: f.categories.map((c) => ({ value: c.value, count: c.count, failCount: c.fail_count })),
      materials: f.materials.map((c) => ({ value: c.value, count: c.count, failCount: c.fail_count })),
      reviewers: f.reviewers.map((r) => ({ id: r.reviewer_id, name: r.reviewer_name, count: r.count, failCount: r.fail_count })),
      checks: names.map((name) => ({ name, failCount: failing.get(name) ?? 0 })).sort((a, b) => b.failCount - a.failCount || a.name.localeCompare(b.name)),
    };
  }

  async detail(access: ProjectAccess, mark: string, revisionParam: string): Promise<MemberDetail> {
    const projectId = access.projectId;
    const revision = (await this.revision(projectId, revisionParam, { optional: false }))!;
    const row = await this.members.findByMark(projectId, revision.id, mark);
    if (!row) {
      throw notFound(`There is no member "${mark}" in revision ${revision.number}; the Members screen lists the marks of each revision.`);
    }
    const [loads, results, limitSet, unitSystem, latest, historyRows] = await Promise.all([
      this.members.loadsOf([row.id]),
      this.members.resultsOf(row.id),
      this.members.revisionLimitSet(revision.id),
      this.members.unitSystem(projectId),
      this.members.latestRevision(projectId),
      this.members.historyOf(projectId, row.mark),
    ]);
    const schedule = toScheduleMember(row, loads);
    // The import's own construction (checks/member-analysis.ts): the member's spans, supports and
    // loads, with the checks of its category and material, over its own load cases and length.
    const beamInput = buildBeamInput(memberBeamInput(schedule), limitSet!, row.category, row.material as MaterialId);
    const report = analyzeBeam(beamInput);

    const ruleIds = [...new Set(results.map((r) => r.rule_id))];
    const rules = ruleIds.map((id) => limitSet!.rules.find((r) => r.id === id)).filter((r): r is LimitRule => r !== undefined);

    const flags = await this.flags.forMark(projectId, latest?.id ?? null, row.mark);
    const history = await this.history(historyRows, unitSystem);

    const { e, depth, camber, notes, source_row } = row;
    return {
      revision: toRevisionRef(revision),
      isLatest: latest?.id === revision.id,
      unitSystem,
      member: { ...toMemberRow(row), E: e, depth, camber, notes, sourceRow: source_row },
      loads: loads.map(toLoadView),
      beamInput,
      report,
      results: results.map(toResultView),
      rules: rules.map(toRuleView),
      caution: VERDICT_CAUTION,
      flags,
      history,
    };
  }

  /** Per revision: present or not, verdict, and the fields changed since the last revision that had the member. */
  private async history(rows: Awaited<ReturnType<MembersRepository['historyOf']>>, unitSystem: 'SI' | 'US'): Promise<MemberHistoryEntry[]> {
    const ids = rows.flatMap((r) => (r.member ? [r.member.id] : []));
    const loads = await this.members.loadsOf(ids);
    const byMember = new Map<number, MemberLoadRow[]>();
    for (const l of loads) byMember.set(l.member_id, [...(byMember.get(l.member_id) ?? []), l]);
    let previous: ScheduleMember | null = null;
    return rows.map((r) => {
      const revision = toRevisionRef({ id: r.revision_id, number: r.number, label: r.label, created_at: r.created_at });
      if (!r.member) return { revision, present: false, verdict: null, maxUtilization: null, governingCheck: null, changes: [] };
      const now = toScheduleMember(r.member, byMember.get(r.member.id) ?? []);
      const changes = previous ? memberChanges(previous, now).map((c) => toFieldChange(c, unitSystem)) : [];
      previous = now;
      return { revision, present: true, verdict: r.member.verdict, maxUtilization: r.member.max_utilization, governingCheck: r.member.governing_check, changes };
    });
  }

  /** `latest` or a revision id of the project (404 for another project's); `optional`: no revision at all is not an error. */
  private async revision(projectId: number, param: string, options: { optional: boolean }): Promise<RevisionRefRow | undefined> {
    if (param === 'latest') {
      const latest = await this.members.latestRevision(projectId);
      if (!latest && !options.optional) throw notFound('This project has no revision yet; upload a member schedule on the Imports screen first.');
      return latest;
    }
    const found = await this.members.findRevision(projectId, Number(param));
    if (!found) throw notFound(`Revision ${param} was not found in this project; the revisions list shows the ones there are.`);
    return found;
  }
}
