import { createKnex, DEMO_PASSWORD, DEMO_PEOPLE, hasUsers, migrateLatest, rollbackAll, seedDemo, verifyPassword, type Knex } from '@sagline/database';
import { createTestDatabase } from './support/pg-admin';

async function tables(knex: Knex): Promise<string[]> {
  const { rows } = await knex.raw<{ rows: { tablename: string }[] }>(`select tablename from pg_tables where schemaname = 'public' order by tablename`);
  return rows.map((r) => r.tablename).filter((n) => !n.startsWith('knex_migrations'));
}

const SCHEMA = [
  'activity', 'digest_log', 'flag_events', 'flags', 'import_drafts', 'import_jobs', 'invitations', 'level_sign_offs', 'levels', 'limit_sets', 'member_loads', 'members',
  'outbound_mail', 'project_roles', 'projects', 'rate_limit_hits', 'recompute_jobs', 'results', 'reviewer_assignments', 'revisions', 'sessions', 'users',
];

describe('migrations', () => {
  let db: { url: string; drop(): Promise<void> };
  let knex: Knex;

  beforeAll(async () => {
    db = await createTestDatabase({ empty: true });
    knex = createKnex(db.url, { min: 0, max: 2 });
  });
  afterAll(async () => {
    await knex.destroy();
    await db.drop();
  });

  it('go up from empty, all the way down, and up again', async () => {
    expect(await tables(knex)).toEqual([]);
    const up = await migrateLatest(knex);
    expect(up.length).toBeGreaterThanOrEqual(9);
    for (const name of up) expect(name).toMatch(/^\d{14}_[a-z]+(_[a-z]+)+$/);
    expect(await tables(knex)).toEqual(SCHEMA);
    expect(await migrateLatest(knex)).toEqual([]);

    const down = await rollbackAll(knex);
    expect(down).toEqual([...up].reverse());
    expect(await tables(knex)).toEqual([]);

    expect(await migrateLatest(knex)).toEqual(up);
    expect(await tables(knex)).toEqual(SCHEMA);
  });

  it('keep e-mails lower-case and roles known at the database level too', async () => {
    await expect(knex('users').insert({ email: 'Mixed@Case.example', name: 'X' })).rejects.toThrow(/users_email_lower_case/);
    const [{ id }] = await knex('users').insert({ email: 'role.check@firm.example', name: 'Y' }).returning('id');
    const [p] = await knex('projects').insert({ name: 'P', number: 'P-1', unit_system: 'SI' }).returning('id');
    await expect(knex('project_roles').insert({ project_id: p.id, user_id: id, role: 'owner' })).rejects.toThrow(/project_roles_role_known/);
    // Deleting a project takes its levels and roles with it.
    await knex('levels').insert({ project_id: p.id, name: 'L1', position: 0 });
    await knex('project_roles').insert({ project_id: p.id, user_id: id, role: 'viewer' });
    await knex('projects').where({ id: p.id }).delete();
    expect(await knex('levels').where({ project_id: p.id }).count('* as n').first()).toEqual({ n: '0' });
    expect(await knex('project_roles').where({ project_id: p.id }).count('* as n').first()).toEqual({ n: '0' });
    await knex('users').delete();
  });

  it('seed the demo once, idempotently, with working sign-ins', async () => {
    expect(await hasUsers(knex)).toBe(false);
    expect(await seedDemo(knex)).toEqual({ usersCreated: DEMO_PEOPLE.length, projectCreated: true });
    const counts = async () => Object.fromEntries(await Promise.all(['users', 'projects', 'levels', 'project_roles'].map(async (t) => [t, Number((await knex(t).count('* as n').first())!.n)])));
    const first = await counts();
    expect(first).toEqual({ users: 7, projects: 1, levels: 6, project_roles: 6 });
    expect(await seedDemo(knex)).toEqual({ usersCreated: 0, projectCreated: false });
    expect(await counts()).toEqual(first);

    const levels = await knex('levels as l').join('projects as p', 'p.id', 'l.project_id').where('p.number', 'HY-2026').orderBy('l.position').pluck('l.name');
    expect(levels).toEqual(['L1', 'L2', 'L3', 'L4', 'L5', 'Roof']);
    const roles = await knex('project_roles as r').join('users as u', 'u.id', 'r.user_id').orderBy('u.email').select('u.email', 'r.role');
    expect(roles).toEqual(
      DEMO_PEOPLE.filter((p) => p.role !== 'admin').map((p) => ({ email: p.email, role: p.role })).sort((a, b) => a.email.localeCompare(b.email)),
    );
    const admin = await knex('users').where({ email: 'admin@halvercote.example' }).first();
    expect(admin.is_admin).toBe(true);
    expect(await verifyPassword(DEMO_PASSWORD, admin.password_hash)).toBe(true);
    for (const p of DEMO_PEOPLE) expect(p.email).toMatch(/@halvercote\.example$/);
  });
});
