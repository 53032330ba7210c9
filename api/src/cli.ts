/**
 * The api's command line (built to api/dist/cli.js; reads DATABASE_URL):
 *   node api/dist/cli.js seed-demo   import samples/halvercote-yard.xlsx as revision 1 of the
 *                                    demo project, when it has no revision yet (after the
 *                                    database seed: node database/dist/src/cli.js seed), then
 *                                    raise demo flags at every stage when it has none yet; both
 *                                    dated over the last four weeks (flags/demo-history.ts)
 *   node api/dist/cli.js send-digest [YYYY-MM-DD]
 *                                    write and send the daily digest of that day (default today,
 *                                    UTC) now; people already sent that day's digest get none
 */
import 'reflect-metadata';
import { Module, type DynamicModule } from '@nestjs/common';
import { NestFactory } from '@nestjs/core';
import { ActivityModule } from './activity/activity.module';
import { isCalendarDay } from './activity/dto/calendar-day';
import { AuthModule } from './auth/auth.module';
import { ConfigError, parseConfig, type AppConfig } from './config/app-config';
import { ConfigModule } from './config/config.module';
import { DbModule } from './db/db.module';
import { seedDemoFlags } from './flags/demo-flags';
import { FlagsModule } from './flags/flags.module';
import { seedDemoRevision } from './imports/demo-seed';
import { ImportsModule } from './imports/imports.module';
import { DigestModule } from './mail/digest/digest.module';
import { DigestService } from './mail/digest/digest.service';
import { OutboxService } from './mail/outbox.service';

const COMMANDS = ['seed-demo', 'send-digest'] as const;
type Command = (typeof COMMANDS)[number];

const say = (msg: string) => process.stderr.write(`[api] ${msg}\n`);

/** Only what the commands need: no HTTP server, no mail, no job worker (AuthModule: the route guards are built even without HTTP). */
@Module({})
class CliModule {
  static forRoot(config: AppConfig): DynamicModule {
    return { module: CliModule, imports: [ConfigModule.forRoot(config), DbModule, AuthModule, ActivityModule, ImportsModule, FlagsModule, DigestModule] };
  }
}

async function run(command: Command): Promise<void> {
  // This process queues nothing and must not take jobs of running api processes.
  process.env.JOBS_WORKER = 'off';
  const config = parseConfig(process.env);
  const app = await NestFactory.createApplicationContext(CliModule.forRoot(config), { logger: ['error', 'warn'] });
  try {
    if (command === 'seed-demo') {
      say(`seed-demo: ${await seedDemoRevision(app)}`);
      say(`seed-demo: ${await seedDemoFlags(app)}`);
      // The flags' e-mails: one attempt now; what fails stays queued for the api's retry.
      await app.get(OutboxService).settle();
    }
    if (command === 'send-digest') say(`send-digest: ${await sendDigest(app, process.argv[3])}`);
  } finally {
    await app.close();
  }
}

/** The digest of `day` (default today, UTC), written and sent before the command ends. */
async function sendDigest(app: Awaited<ReturnType<typeof NestFactory.createApplicationContext>>, day?: string): Promise<string> {
  if (day !== undefined && !isCalendarDay(day)) throw new Error(`"${day}" is not a day written YYYY-MM-DD; leave it out for today (UTC)`);
  const r = await app.get(DigestService).run(day);
  await app.get(OutboxService).settle();
  return `${r.date}: ${r.queued} digest(s) queued and sent, ${r.nothingWaiting} with nothing waiting, ${r.off} turned off, ${r.alreadySent} sent before (unsent ones stay queued for the api's retry)`;
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
