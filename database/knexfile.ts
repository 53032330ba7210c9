import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';

/**
 * The one Knex configuration used by the api, the database CLI and the tests.
 *
 * Migrations are loaded by our own source (below) so the same history runs
 * from TypeScript (tsx, jest: `*.ts`) and from the compiled build
 * (`dist/migrations/*.js`). The extension is taken from this very file, and
 * the names recorded in `knex_migrations` carry no extension, so a database
 * migrated by one is recognised by the other.
 */
const EXTENSION = path.extname(__filename);
const MIGRATIONS_DIR = path.join(__dirname, 'migrations');

interface MigrationModule {
  up(knex: Knex): Promise<void>;
  down(knex: Knex): Promise<void>;
}

export class FolderMigrationSource implements Knex.MigrationSource<string> {
  constructor(private readonly dir = MIGRATIONS_DIR, private readonly ext = EXTENSION) {}

  async getMigrations(): Promise<string[]> {
    return fs
      .readdirSync(this.dir)
      .filter((f) => f.endsWith(this.ext) && !f.endsWith('.d.ts'))
      .map((f) => f.slice(0, -this.ext.length))
      .sort();
  }

  getMigrationName(name: string): string {
    return name;
  }

  async getMigration(name: string): Promise<MigrationModule> {
    // eslint-disable-next-line @typescript-eslint/no-require-imports
    return require(path.join(this.dir, name + this.ext)) as MigrationModule;
  }
}

/** Knex options for a PostgreSQL URL. `pool` sizes can be overridden per process. */
export function knexConfig(url: string, pool: Knex.PoolConfig = { min: 0, max: 10 }): Knex.Config {
  return {
    client: 'pg',
    connection: url,
    pool,
    log: {
      // A failed connection is thrown to the caller (and logged there with its request id);
      // knex would also print it, stack and all, on every attempt.
      warn: (message: unknown) => {
        if (typeof message === 'string' && message.startsWith('Acquire connection error')) return;
        console.warn(message);
      },
    },
    migrations: {
      migrationSource: new FolderMigrationSource(),
      tableName: 'knex_migrations',
    },
  };
}

/** For the knex CLI (`npx knex --knexfile database/knexfile.ts`), which reads DATABASE_URL. */
const cliConfig: Knex.Config = knexConfig(process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/sagline');
export default cliConfig;
