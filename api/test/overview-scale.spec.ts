import type { Knex } from '@sagline/database';
import type { ProjectOverview } from '@sagline/common/api-types';
import { KNEX } from '../src/db/db.tokens';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * The Overview on a 10,000-member revision (four such revisions in the
 * table) with 2,000 flags and their histories: the counts agree with counts
 * made independently, the members are reached through the revision's index
 * (never a sequential scan of every revision's members), and the timings are
 * printed (not asserted: the machine is shared; the load benchmark measures).
 */
describe('overview at 10,000 members and 2,000 flags', () => {
  const PER_REVISION = 10_000;
  const FLAGS = 2_000;
  let t: TestApp;
  let project: TestProject;
  let client: ApiClient;
  let latestId: number;
  const captured: { sql: string; bindings: unknown[] }[] = [];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const engineer = await make.user();
    const reviewers = [await make.user(), await make.user(), await make.user()];
    project = await make.project({ team: [[engineer, 'engineer'], ...reviewers.map((r) => [r, 'checker'] as [typeof r, 'checker'])] });
    const first = await new MembersFactory(t).revision(project.id, engineer.id, [{ mark: 'SEED1', I: 20 }]);
    const k = t.knex;
    for (let n = 2; n <= 4; n++) {
      await k.raw(
        `insert into revisions (project_id, number, label, uploaded_by, file_name, file_type, file_size, file_bytes, parse_report, diff, limit_set_id, limit_set, member_count, pass_count, fail_count)
         select project_id, ?, label, uploaded_by, file_name, file_type, file_size, file_bytes, parse_report, diff, limit_set_id, limit_set, ?, 0, 0 from revisions where id = ?`,
        [n, PER_REVISION, first.id],
      );
    }
    const revisions: number[] = await k('revisions').where({ project_id: project.id }).orderBy('number').pluck('id');
    latestId = revisions[revisions.length - 1];
    const [l1, l2, l3] = project.levels;
    for (const revisionId of revisions) {
      await k.raw(
        `insert into members (revision_id, mark, level_id, level_name, grid, category, material, spans, supports, e, i, length, reviewer_id, source_row, governing_check, max_utilization, verdict, required_i)
         select ?, 'B' || g, (array[?, ?, ?]::int[])[1 + g % 3], (array['L1', 'L2', 'Roof'])[1 + g % 3], 'G/' || g, 'floor', 'steel',
                '[6]'::jsonb, 'pinned', 200e9, 1e-4, 6, (array[?, ?, ?, null]::int[])[1 + g % 4], g + 1, 'L/360 live', (g % 150) / 100.0,
                case when g % 150 > 100 then 'fail' else 'pass' end, 1e-4
           from generate_series(1, ?::int) as g`,
        [revisionId, l1.id, l2.id, l3.id, ...reviewers.map((r) => r.id), PER_REVISION],
      );
    }
    // 2,000 flags on every fifth mark, statuses in turn, with their status histories over the last 60 days.
    await k.raw(
      `insert into flags (project_id, mark, check_name, status, title, waive_reason, due_date, created_at)
       select ?, 'B' || (g * 5), 'L/360 live', (array['open', 'answered', 'closed', 'waived'])[1 + g % 4], 'Flag ' || g,
              case when g % 4 = 3 then 'Accepted.' end, (now() at time zone 'utc')::date + (g % 30) - 15, now() - (g % 60) * interval '1 day'
         from generate_series(1, ?::int) as g`,
      [project.id, FLAGS],
    );
    await k.raw(
      `insert into flag_events (flag_id, kind, from_status, to_status, created_at)
       select id, 'status', null, 'open', created_at from flags where project_id = ?
       union all
       select id, 'status', 'open', status, created_at + interval '1 hour' from flags where project_id = ? and status <> 'open'`,
      [project.id, project.id],
    );
    for (const table of ['members', 'flags', 'flag_events']) await k.raw(`analyze ${table}`);
    client = await ApiClient.signedIn(t.http, reviewers[0].email, PASSWORD);
    const appKnex = t.app.get<Knex>(KNEX, { strict: false });
    appKnex.on('query', (q: { sql: string; bindings?: unknown[] }) => {
      if (/members m|flags f|level_sign_offs|reviewer_assignments|revisions/.test(q.sql)) captured.push({ sql: q.sql, bindings: [...(q.bindings ?? [])] });
    });
  }, 180_000);
  afterAll(() => t.close());

  /** A change to one flag, as any flag route makes it: the cached overview no longer holds. */
  const bump = () => t.knex('flags').where({ project_id: project.id, mark: 'B5' }).update({ version: t.knex.raw('version + 1') });

  async function timed(url: string, runs: number, before?: () => Promise<unknown>): Promise<{ p50: number; max: number }> {
    const ms: number[] = [];
    for (let i = 0; i < runs; i++) {
      await before?.();
      const start = process.hrtime.bigint();
      const res = await client.get(url);
      ms.push(Number(process.hrtime.bigint() - start) / 1e6);
      expect(res.status).toBe(200);
    }
    ms.sort((a, b) => a - b);
    return { p50: ms[Math.floor(runs / 2)], max: ms[runs - 1] };
  }

  it('counts what independent queries count', async () => {
    const o = (await client.get(`/api/projects/${project.id}/overview`)).body as ProjectOverview;
    const k = t.knex;
    const byLevel: { level_name: string; n: number; fail: number }[] = await k('members').where({ revision_id: latestId }).groupBy('level_name').orderBy('level_name')
      .select('level_name', k.raw('count(*)::int as n'), k.raw(`count(*) filter (where verdict = 'fail')::int as fail`));
    expect(o.levels.map((l) => [l.level?.name, l.members, l.fail]).sort()).toEqual(byLevel.map((r) => [r.level_name, r.n, r.fail]).sort());
    expect(o.totals.members).toBe(PER_REVISION);
    expect(o.totals.flagsTotal).toBe(FLAGS);
    expect([o.totals.flagsOpen, o.totals.flagsAnswered, o.totals.flagsClosed, o.totals.flagsWaived]).toEqual([500, 500, 500, 500]);
    const levelFlags = o.levels.reduce((s, l) => s + l.flagsTotal, 0);
    const reviewerFlags = o.reviewers.reduce((s, r) => s + r.flagsTotal, 0);
    expect([levelFlags, reviewerFlags]).toEqual([FLAGS, FLAGS]);
    expect(o.reviewers.reduce((s, r) => s + r.members, 0)).toBe(PER_REVISION);
  });

  it('reads one revision of members through its index, and prints the timings', async () => {
    captured.length = 0;
    await bump();
    await client.get(`/api/projects/${project.id}/overview`);
    const grouped = captured.find((c) => /grouping sets/.test(c.sql));
    expect(grouped).toBeDefined();
    const order: unknown[] = [];
    const text = grouped!.sql.replace(/\$(\d+)/g, (_, n: string) => {
      order.push(grouped!.bindings[Number(n) - 1]);
      return '?';
    });
    const res = await t.knex.raw(`explain (format json) ${text}`, order as Knex.RawBinding[]);
    if (process.env.H4_EXPLAIN) {
      for (const c of captured) {
        const o: unknown[] = [];
        const q = c.sql.replace(/\$(\d+)/g, (_, n: string) => (o.push(c.bindings[Number(n) - 1]), '?'));
        console.log((await t.knex.raw(`explain (analyze) ${q}`, o as Knex.RawBinding[])).rows.map((r: Record<string, string>) => r['QUERY PLAN']).join('\n'));
      }
    }
    const scans: { type: string; relation?: string; index?: string }[] = [];
    const walk = (n: Record<string, unknown>) => {
      scans.push({ type: n['Node Type'] as string, relation: n['Relation Name'] as string | undefined, index: n['Index Name'] as string | undefined });
      for (const c of (n.Plans as Record<string, unknown>[] | undefined) ?? []) walk(c);
    };
    walk(res.rows[0]['QUERY PLAN'][0].Plan);
    const onMembers = scans.filter((s) => s.relation === 'members');
    expect(onMembers.length).toBeGreaterThan(0);
    expect(onMembers.every((s) => s.type !== 'Seq Scan')).toBe(true);

    await timed(`/api/projects/${project.id}/overview`, 5);
    const overview = await timed(`/api/projects/${project.id}/overview`, 30);
    const cold = await timed(`/api/projects/${project.id}/overview`, 30, bump);
    const chart = await timed(`/api/projects/${project.id}/overview/flags-over-time?days=90`, 30);
    console.log(
      `overview at ${PER_REVISION} members, ${FLAGS} flags (one client, in-process, shared machine): ` +
        `GET overview p50 ${overview.p50.toFixed(1)} ms (max ${overview.max.toFixed(1)}) when nothing changed, ` +
        `${cold.p50.toFixed(1)} ms (max ${cold.max.toFixed(1)}) after a flag changed, ` +
        `GET flags-over-time p50 ${chart.p50.toFixed(1)} ms (max ${chart.max.toFixed(1)}); members plan: ${onMembers.map((s) => `${s.type} ${s.index ?? ''}`).join(', ')}`,
    );
  });
});
