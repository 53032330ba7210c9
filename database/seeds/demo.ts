import type { Knex } from 'knex';
import { hashPassword } from '../src/passwords';
import { DEMO_PASSWORD, DEMO_PEOPLE, DEMO_PROJECT } from './demo-people';

/** True when the database holds at least one account. */
export async function hasUsers(knex: Knex): Promise<boolean> {
  const row = await knex('users').first('id');
  return row !== undefined;
}

export interface SeedReport {
  usersCreated: number;
  projectCreated: boolean;
}

/**
 * The demo: the people of DEMO_PEOPLE and the project "Halvercote Yard" with
 * its levels and everyone's role. Idempotent: people and the project are
 * matched by e-mail and project number, and only what is missing is added
 * (existing passwords are never overwritten). One transaction.
 */
export async function seedDemo(knex: Knex): Promise<SeedReport> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  return knex.transaction(async (trx) => {
    let usersCreated = 0;
    const ids = new Map<string, number>();
    for (const person of DEMO_PEOPLE) {
      const inserted = await trx('users')
        .insert({ email: person.email, name: person.name, password_hash: passwordHash, is_admin: person.role === 'admin' })
        .onConflict('email')
        .ignore()
        .returning('id');
      if (inserted.length) usersCreated += 1;
      const row = await trx('users').where({ email: person.email }).first('id');
      ids.set(person.email, row.id);
    }

    const adminId = ids.get(DEMO_PEOPLE.find((p) => p.role === 'admin')!.email)!;
    let project = await trx('projects').where({ number: DEMO_PROJECT.number }).first('id');
    const projectCreated = !project;
    if (!project) {
      [project] = await trx('projects')
        .insert({ name: DEMO_PROJECT.name, number: DEMO_PROJECT.number, unit_system: DEMO_PROJECT.unitSystem, created_by: adminId })
        .returning('id');
      await trx('activity').insert({
        project_id: project.id,
        actor_id: adminId,
        action: 'project.created',
        summary: `Created the project ${DEMO_PROJECT.name} (${DEMO_PROJECT.number})`,
        data: JSON.stringify({ levels: DEMO_PROJECT.levels }),
      });
    }
    await trx('levels')
      .insert(DEMO_PROJECT.levels.map((name, position) => ({ project_id: project.id, name, position })))
      .onConflict(['project_id', 'name'])
      .ignore();
    const roles = DEMO_PEOPLE.filter((p) => p.role !== 'admin').map((p) => ({
      project_id: project.id,
      user_id: ids.get(p.email)!,
      role: p.role,
    }));
    await trx('project_roles').insert(roles).onConflict(['project_id', 'user_id']).ignore();
    return { usersCreated, projectCreated };
  });
}
