/**
 * The database command line:
 *   node database/dist/src/cli.js migrate   run pending migrations
 *   node database/dist/src/cli.js seed      add the demo, only when there are no users yet
 *   node database/dist/src/cli.js reset     roll everything back and migrate again (tests; destroys data)
 *   node database/dist/src/cli.js rollback  roll back every migration (destroys data)
 * (or `npx tsx database/src/cli.ts <command>` from source). Reads DATABASE_URL.
 */
import { createKnex, hasUsers, migrateLatest, rollbackAll, seedDemo } from '../index';
import { DEMO_PASSWORD, DEMO_PEOPLE } from '../seeds/demo-people';

const COMMANDS = ['migrate', 'seed', 'reset', 'rollback'] as const;
type Command = (typeof COMMANDS)[number];

const say = (msg: string) => process.stderr.write(`[database] ${msg}\n`);

async function run(command: Command, url: string): Promise<void> {
  const knex = createKnex(url, { min: 0, max: 2 });
  try {
    if (command === 'migrate') {
      const names = await migrateLatest(knex);
      say(names.length ? `migrated: ${names.join(', ')}` : 'already up to date');
    } else if (command === 'seed') {
      if (await hasUsers(knex)) {
        say('the database already has users: demo seed skipped');
        return;
      }
      const report = await seedDemo(knex);
      say(`demo seeded: ${report.usersCreated} people, project ${report.projectCreated ? 'created' : 'kept'}; ` +
        `sign in as ${DEMO_PEOPLE[0].email} (password ${DEMO_PASSWORD})`);
    } else if (command === 'rollback') {
      const names = await rollbackAll(knex);
      say(names.length ? `rolled back: ${names.join(', ')}` : 'nothing to roll back');
    } else {
      await rollbackAll(knex);
      const names = await migrateLatest(knex);
      say(`reset: ${names.length} migrations applied to an empty schema`);
    }
  } finally {
    await knex.destroy();
  }
}

function main(): void {
  const command = process.argv[2] as Command | undefined;
  if (!command || !COMMANDS.includes(command)) {
    say(`usage: cli.js ${COMMANDS.join('|')}  (DATABASE_URL=postgres://user@host:port/db)`);
    process.exit(2);
  }
  const url = process.env.DATABASE_URL;
  if (!url) {
    say('DATABASE_URL is not set: give the PostgreSQL URL, e.g. DATABASE_URL=postgres://postgres@127.0.0.1:54329/sagline');
    process.exit(2);
  }
  run(command, url).catch((err: unknown) => {
    say(`${command} failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}

main();
