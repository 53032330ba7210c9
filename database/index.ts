import knexFactory, { type Knex } from 'knex';
import { knexConfig } from './knexfile';

export { knexConfig, FolderMigrationSource } from './knexfile';
export { hashPassword, verifyPassword, DUMMY_PASSWORD_HASH } from './src/passwords';
export { seedDemo, hasUsers } from './seeds/demo';
export { DEMO_PEOPLE, DEMO_PASSWORD, DEMO_PROJECT, type DemoPerson } from './seeds/demo-people';
export type { Knex } from 'knex';

/**
 * PostgreSQL NOTIFY channel on which every committed write to the data the api answers with is announced
 * (migration 20261203010000_notify_data_changes; the payload is the table's name). The api listens on it to
 * drop what it has cached (api/src/db/data-version.ts).
 */
export const DATA_CHANGED_CHANNEL = 'sagline_data_changed';

/** A Knex instance for a PostgreSQL URL (the api, the CLI and the tests all use this). */
export function createKnex(url: string, pool?: Knex.PoolConfig): Knex {
  return knexFactory(knexConfig(url, pool));
}

/** Runs every pending migration; returns the names it ran. */
export async function migrateLatest(knex: Knex): Promise<string[]> {
  const [, names] = (await knex.migrate.latest()) as [number, string[]];
  return names;
}

/** Rolls back every migration (tests and `reset` only). */
export async function rollbackAll(knex: Knex): Promise<string[]> {
  const [, names] = (await knex.migrate.rollback(undefined, true)) as [number, string[]];
  return names;
}
