import type { Knex } from '@sagline/database';
import { KNEX } from '../src/db/db.tokens';
import { ApiClient } from './support/api-client';
import { Factories, PASSWORD, type TestProject } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp } from './support/test-app';

/**
 * The Members screen on a 10,000-member revision (four such revisions in the
 * table, as a project has after a few uploads): every list query the api
 * sends must reach the members through an index (no sequential scan of the
 * whole table), as PostgreSQL's own EXPLAIN says for the very SQL the api ran.
 */
describe('members list at 10,000 members per revision', () => {
  const PER_REVISION = 10_000;
  let t: TestApp;
  let project: TestProject;
  let client: ApiClient;
  let latestId: number;
  const captured: { sql: string; bindings: unknown[] }[] = [];

  beforeAll(async () => {
    t = await TestApp.start();
    const make = new Factories(t.knex);
    const engineer = await make.user();
    const reviewer = await make.user();
    project = await make.project({ team: [[engineer, 'engineer'], [reviewer, 'checker']] });
    const first = await new MembersFactory(t).revision(project.id, engineer.id, [{ mark: 'SEED1', I: 20 }]);
    const k = t.knex;
    // Three more revisions like the first, then 10,000 members with results in each.
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
         select ?, 'B' || g, (array[?, ?, ?]::int[])[1 + g % 3], (array['L1', 'L2', 'Roof'])[1 + g % 3], 'G/' || g, 'floor', case when g % 7 = 0 then 'timber' else 'steel' end,
                '[6]'::jsonb, 'pinned', 200e9, 1e-4, 6, case when g % 2 = 0 then ?::int end, g + 1, 'L/360 live', (g % 150) / 100.0,
                case when g % 150 > 100 then 'fail' else 'pass' end, 1e-4
           from generate_series(1, ?::int) as g`,
        [revisionId, l1.id, l2.id, l3.id, reviewer.id, PER_REVISION],
      );
      await k.raw(
        `insert into results (member_id, revision_id, check_name, combination, rule_id, segment_index, segment_kind, segment_from, segment_to, x, deflection, effective_length, span_ratio, limit_ratio, allowed, governing, utilization, pass, required_i)
         select m.id, m.revision_id, c.name, 'L', c.rule, 0, 'span', 0, 6, 3, -0.01, 6, 600, c.ratio, 6 / c.ratio, 'ratio', m.max_utilization, m.verdict = 'pass', 1e-4
           from members m cross join (values ('L/360 live', 'floor.live', 360), ('L/240 total', 'floor.total.steel', 240)) as c(name, rule, ratio)
          where m.revision_id = ?`,
        [revisionId],
      );
    }
    await k.raw('analyze members');
    await k.raw('analyze results');
    await k.raw('analyze flags');
    client = await ApiClient.signedIn(t.http, reviewer.email, PASSWORD);
    const appKnex = t.app.get<Knex>(KNEX, { strict: false });
    appKnex.on('query', (q: { sql: string; bindings?: unknown[] }) => {
      if (/"members"/.test(q.sql)) captured.push({ sql: q.sql, bindings: [...(q.bindings ?? [])] });
    });
  }, 120_000);
  afterAll(() => t.close());

  /** The plan nodes of a statement, flattened. */
  async function planOf(sql: string, bindings: unknown[]): Promise<{ type: string; relation?: string; index?: string }[]> {
    // The event carries PostgreSQL's $1, $2 … placeholders; knex.raw wants ? in order.
    const order: unknown[] = [];
    const text = sql.replace(/\$(\d+)/g, (_, n: string) => {
      order.push(bindings[Number(n) - 1]);
      return '?';
    });
    const res = await t.knex.raw(`explain (format json) ${text}`, order as Knex.RawBinding[]);
    const nodes: { type: string; relation?: string; index?: string }[] = [];
    const walk = (n: Record<string, unknown>) => {
      nodes.push({ type: n['Node Type'] as string, relation: n['Relation Name'] as string | undefined, index: n['Index Name'] as string | undefined });
      for (const child of (n.Plans as Record<string, unknown>[] | undefined) ?? []) walk(child);
    };
    walk(res.rows[0]['QUERY PLAN'][0].Plan);
    return nodes;
  }

  const cases: [string, string, RegExp][] = [
    ['default order (mark, natural)', '', /members_revision_mark_natural_index/],
    ['most utilised first', 'sort=-utilization', /members_revision_utilization_index/],
    ['least utilised first', 'sort=utilization&page=3', /members_revision_utilization_index/],
    ['failing only', 'verdict=fail', /members_revision_(verdict|mark_natural)_index/],
    ['one level, by level', 'level=LEVEL&sort=level', /members_revision_level_index|members_revision_mark_natural_index/],
    ['failing one check', `check=${encodeURIComponent('L/240 total')}`, /results_revision_failing_check_index/],
    ['utilisation band', 'utilMin=0.9&utilMax=1.2&sort=-utilization', /members_revision_utilization_index/],
    ['a reviewer, page 20', 'reviewer=REVIEWER&page=20', /members_revision_(reviewer|mark_natural)_index/],
  ];

  for (const [name, query, index] of cases) {
    it(`${name}: the list and its count read members through an index`, async () => {
      captured.length = 0;
      const q = query.replace('LEVEL', String(project.levels[1].id)).replace('REVIEWER', String((await t.knex('members').where({ revision_id: latestId }).whereNotNull('reviewer_id').first('reviewer_id')).reviewer_id));
      const started = Date.now();
      const res = await client.get(`/api/projects/${project.id}/members?${q}`);
      const ms = Date.now() - started;
      expect(res.status).toBe(200);
      expect(res.body.revision.id).toBe(latestId);
      expect(res.body.total).toBeGreaterThan(0);
      // Generous on a shared machine; the point is "not seconds".
      expect(ms).toBeLessThan(1500);
      const statements = captured.filter((c) => /from "members" as "m"/.test(c.sql));
      // One round trip: the revision, the page and its count in one statement.
      expect(statements).toHaveLength(1);
      const plans = await Promise.all(statements.map((s) => planOf(s.sql, s.bindings)));
      for (const plan of plans) {
        expect(plan.filter((n) => n.type === 'Seq Scan' && (n.relation === 'members' || n.relation === 'results'))).toEqual([]);
      }
      expect(plans.flat().map((n) => n.index ?? '').join(' ')).toMatch(index);
    });
  }

  it('counts the facets of the 10,000 members in SQL, quickly', async () => {
    const started = Date.now();
    const res = await client.get(`/api/projects/${project.id}/members/facets`);
    expect(Date.now() - started).toBeLessThan(1500);
    // Members fail where g % 150 > 100: residues 101 … 149, 49 in every 150; 10,000 = 66 × 150 + 100, and
    // the last 100 (residues 1 … 100) all pass: 66 × 49 = 3,234. Levels: g % 3 = 0, 1, 2 → 3,333, 3,334, 3,333.
    const fail = 3234;
    expect(res.body).toMatchObject({ total: PER_REVISION, verdicts: { pass: PER_REVISION - fail, fail, unchecked: 0 } });
    expect(res.body.levels.map((l: { name: string; count: number }) => [l.name, l.count])).toEqual([['L1', 3333], ['L2', 3334], ['Roof', 3333]]);
    expect(res.body.checks).toEqual([{ name: 'L/240 total', failCount: fail }, { name: 'L/360 live', failCount: fail }]);
  });

  it('pages stay consistent at depth: page 200 of 50 is the members 9,951 to 10,000 in mark order', async () => {
    const res = await client.get(`/api/projects/${project.id}/members?page=200&pageSize=50`);
    expect(res.body.items.map((m: { mark: string }) => m.mark)).toEqual(Array.from({ length: 50 }, (_, i) => `B${9951 + i}`));
  });
});
