import type { Server } from 'node:http';
import type { NestExpressApplication } from '@nestjs/platform-express';
import { createKnex, type Knex } from '@sagline/database';
import type { MailboxMessage } from '@sagline/common/api-types';
import { createApp } from '../../src/app.factory';
import { parseConfig, type AppConfig } from '../../src/config/app-config';
import { DataVersion } from '../../src/db/data-version';
import { startFakeSmtp, type FakeSmtp } from '../../src/mail/fake-smtp';
import { OutboxService } from '../../src/mail/outbox.service';
import { createTestDatabase } from './pg-admin';

export const TEST_PUBLIC_URL = 'http://sagline.test';

/**
 * The api's configuration as a process started now would read it: the test
 * settings, the import and job settings (IMPORT_*, JOBS_*) a spec put in
 * process.env before starting or restarting the api, then `overrides`.
 */
function configOf(env: Record<string, string>, overrides: Record<string, string> = {}): AppConfig {
  const settings = Object.fromEntries(Object.entries(process.env).filter(([k]) => /^(IMPORT|JOBS)_/.test(k)));
  return parseConfig({ ...env, ...settings, ...overrides });
}

export interface TestAppOptions {
  /** Environment overrides, as the api would read them (e.g. SIGN_IN_RATE_LIMIT). */
  env?: Record<string, string>;
  /** Start without the fake SMTP server (mail then fails and stays queued). */
  withoutSmtp?: boolean;
  /** No server log: for tests that provoke a 5xx on purpose (the log would only be noise). */
  quiet?: boolean;
}

/**
 * One api over its own throwaway database, with a real fake SMTP server on
 * random ports. `knex` is the test's own connection, for factories and for
 * checking what was (not) written.
 */
export class TestApp {
  app!: NestExpressApplication;
  http!: Server;

  private constructor(
    public config: AppConfig,
    private readonly env: Record<string, string>,
    private readonly overrides: Record<string, string>,
    readonly knex: Knex,
    readonly mail: FakeSmtp | null,
    private readonly dropDb: () => Promise<void>,
    private readonly quiet: boolean,
  ) {}

  static async start(options: TestAppOptions = {}): Promise<TestApp> {
    const db = await createTestDatabase();
    const mail = options.withoutSmtp ? null : await startFakeSmtp({ smtpPort: 0, httpPort: 0 });
    const env: Record<string, string> = {
      NODE_ENV: 'test',
      DATABASE_URL: db.url,
      PUBLIC_URL: TEST_PUBLIC_URL,
      // A closed port when there is no fake: connection refused at once.
      SMTP_URL: mail?.smtpUrl ?? 'smtp://127.0.0.1:39',
      MAILBOX_URL: mail?.mailboxUrl ?? 'http://127.0.0.1:39',
      SIGN_IN_RATE_LIMIT: '1000/15m',
      MAIL_RETRY_SECONDS: '0',
      WEB_DIST: '/nonexistent-web-dist',
    };
    const t = new TestApp(configOf(env, options.env), env, options.env ?? {}, createKnex(db.url, { min: 0, max: 3 }), mail, db.drop, options.quiet ?? false);
    await t.boot();
    return t;
  }

  private async boot(): Promise<void> {
    this.app = await createApp(this.config, { logger: this.quiet ? false : ['error'] });
    this.http = this.app.getHttpServer();
  }

  /**
   * Waits until the api has heard of every change the test wrote through its own connection
   * (`knex`): the api keeps answers in memory until PostgreSQL notifies it of a change, and that
   * notification travels on its own connection (db/data-version.ts).
   */
  async settled(): Promise<void> {
    await this.app.get(DataVersion).caughtUp();
  }

  /** Closes the api and starts a new one on the same database (what a deploy or crash does). */
  async restart(): Promise<void> {
    await this.app.close();
    this.config = configOf(this.env, this.overrides);
    await this.boot();
  }

  get outbox(): OutboxService {
    return this.app.get(OutboxService);
  }

  /** Waits for background e-mail delivery, then returns what the fake SMTP server holds (newest first). */
  async mailbox(): Promise<MailboxMessage[]> {
    await this.outbox.settle();
    if (!this.mail) throw new Error('this test app runs without SMTP');
    return this.mail.messages();
  }

  /** Row counts of tables, to prove a refused request wrote nothing. */
  async counts(tables: string[] = ['users', 'projects', 'levels', 'project_roles', 'invitations', 'activity', 'outbound_mail']): Promise<Record<string, number>> {
    const out: Record<string, number> = {};
    for (const t of tables) {
      const row = await this.knex(t).count<{ count: string }[]>('* as count').first();
      out[t] = Number(row?.count ?? 0);
    }
    return out;
  }

  async close(): Promise<void> {
    await this.app.close();
    await this.knex.destroy();
    await this.mail?.close();
    await this.dropDb();
  }
}

/** The link of an e-mail's text that starts with `${PUBLIC_URL}${path}`. */
export function linkIn(message: MailboxMessage, path: string): string {
  const re = new RegExp(`${TEST_PUBLIC_URL.replace(/[.]/g, '\\.')}${path}[A-Za-z0-9_/-]+`);
  const m = re.exec(message.text);
  if (!m) throw new Error(`no ${path} link in the e-mail:\n${message.text}`);
  return m[0];
}
