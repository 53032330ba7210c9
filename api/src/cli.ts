/**
 * The api's command line (built to api/dist/cli.js; reads DATABASE_URL):
 *   node api/dist/cli.js seed-demo   import samples/halvercote-yard.xlsx as revision 1 of the
 *                                    demo project, when it has no revision yet (after the
 *                                    database seed: node database/dist/src/cli.js seed)
 */
import 'reflect-metadata';
import { Module, type DynamicModule } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { ActivityModule } from './activity/activity.module';
import { AuthModule } from './auth/auth.module';
import { ConfigError, parseConfig, type AppConfig } from './config/app-config';
import { ConfigModule } from './config/config.module';
import { DbModule } from './db/db.module';
import { seedDemoRevision } from './imports/demo-seed';
import { ImportsModule } from './imports/imports.module';

const COMMANDS = ['seed-demo'] as const;
type Command = (typeof COMMANDS)[number];

const say = (msg: string) => process.stderr.write(`[api] ${msg}\n`);

/** Only what the commands need: no HTTP server, no mail, no job worker (AuthModule: the route guards are built even without HTTP). */
@Module({})
class CliModule {
  static forRoot(config: AppConfig): DynamicModule {
    return { module: CliModule, imports: [ConfigModule.forRoot(config), DbModule, AuthModule, ActivityModule, ImportsModule] };
  }
}

async function run(command: Command): Promise<void> {
  // This process queues nothing and must not take jobs of running api processes.
  process.env.JOBS_WORKER = 'off';
  const config = parseConfig(process.env);
  const app = await NestFactory.createApplicationContext(CliModule.forRoot(config), { logger: ['error', 'warn'] });
  try {
    if (command === 'seed-demo') say(`seed-demo: ${await seedDemoRevision(app)}`);
  } finally {
    await app.close();
  }
}

function main(): void {
  const command = process.argv[2] as Command | undefined;
  if (!command || !COMMANDS.includes(command)) {
    say(`usage: cli.js ${COMMANDS.join('|')}  (DATABASE_URL=postgres://user@host:port/db)`);
    process.exit(2);
  }
  run(command).catch((err: unknown) => {
    if (err instanceof ConfigError) say(err.message);
    else say(`${command} failed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}

main();
