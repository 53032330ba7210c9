import net from 'node:net';
import { randomUUID } from 'node:crypto';
import type { DigestRunReport, FlagDetail, MailboxMessage } from '@sagline/common/api-types';
import { JobQueue } from '../src/jobs/job-queue';
import { startFakeSmtp, type FakeSmtp } from '../src/mail/fake-smtp';
import { digestMail } from '../src/mail/digest/digest-mail';
import { parseDigestSettings } from '../src/mail/digest/digest-settings';
import type { WaitingFlag } from '../src/mail/digest/digest.repository';
import { DIGEST_QUEUE } from '../src/mail/digest/digest.tokens';
import { utcDay } from '../src/mail/digest/digest.service';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { MembersFactory } from './support/members-factory';
import { TestApp, TEST_PUBLIC_URL } from './support/test-app';

const DAY = '2026-12-10';

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.once('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

const digests = (messages: MailboxMessage[]) => messages.filter((m) => /Sagline digest/.test(m.subject));

/**
 * Two projects. Rafe (engineer on both) holds three open flags, one overdue
 * on the digest's day; Priya (checker) raised a flag that Ines answered, so
 * it waits on Priya to close; Ines has an open flag but turned her digest
 * off; the manager is told of the overdue flags of the project she manages;
 * the admin (on no project) has nothing waiting; a closed flag waits on nobody.
 */
async function scenario(t: TestApp) {
  const make = new Factories(t.knex);
  const admin = await make.user({ name: 'Ada Brennick', isAdmin: true });
  const checker = await make.user({ name: 'Priya Castellanos' });
  const rafe = await make.user({ name: 'Rafe Lindqvist' });
  const ines = await make.user({ name: 'Ines Okafor' });
  const manager = await make.user({ name: 'Mireille Fontaine' });
  const yard = await make.project({ name: 'Halvercote Yard', team: [[checker, 'checker'], [rafe, 'engineer'], [ines, 'engineer'], [manager, 'manager']] });
  const annex = await make.project({ name: 'Halvercote Annex', team: [[checker, 'checker'], [rafe, 'engineer']] });
  const members = new MembersFactory(t);
  await members.revision(yard.id, rafe.id, ['B1', 'B2', 'B3', 'B4', 'B5', 'B6'].map((mark) => ({ mark, I: 20 })));
  await members.revision(annex.id, rafe.id, [{ mark: 'A1', I: 20 }]);
  const c = {
    admin: await ApiClient.signedIn(t.http, admin.email, PASSWORD),
    checker: await ApiClient.signedIn(t.http, checker.email, PASSWORD),
    rafe: await ApiClient.signedIn(t.http, rafe.email, PASSWORD),
    ines: await ApiClient.signedIn(t.http, ines.email, PASSWORD),
    manager: await ApiClient.signedIn(t.http, manager.email, PASSWORD),
  };
  const raise = async (project: TestProject, mark: string, assignee: TestUser, dueDate: string | null): Promise<FlagDetail> => {
    const res = await c.checker.post(`/api/projects/${project.id}/flags`, { mark, assigneeId: assignee.id, dueDate });
    if (res.status !== 201) throw new Error(`raise ${mark}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.body;
  };
  const flags = {
    later: await raise(yard, 'B2', rafe, '2026-12-20'),
    overdue: await raise(yard, 'B1', rafe, '2026-12-08'),
    annex: await raise(annex, 'A1', rafe, null),
    answered: await raise(yard, 'B3', ines, '2026-12-01'),
    closed: await raise(yard, 'B4', rafe, '2026-12-01'),
    inesOpen: await raise(yard, 'B5', ines, '2026-12-01'),
  };
  const answered = await c.ines.post(`/api/projects/${yard.id}/flags/${flags.answered.id}/answer`, { version: flags.answered.version, body: 'Deeper joist, see revision 2.' });
  expect(answered.status).toBe(200);
  expect((await c.checker.post(`/api/projects/${yard.id}/flags/${flags.closed.id}/close`, { version: flags.closed.version })).status).toBe(200);
  expect((await c.ines.patch('/api/me/preferences', { digest: false })).body).toEqual({ digest: false });
  await t.outbox.settle();
  t.mail?.clear();
  return { admin, checker, rafe, ines, manager, yard, annex, c, flags };
}

describe('the daily digest', () => {
  let t: TestApp;
  let s: Awaited<ReturnType<typeof scenario>>;

  beforeAll(async () => {
    t = await TestApp.start();
    s = await scenario(t);
  });
  afterAll(() => t.close());

  it('e-mails each person what waits on them across their projects, overdue first', async () => {
    const res = await s.c.admin.post('/api/digests/send', { date: DAY });
    expect(res.status).toBe(200);
    expect(res.body as DigestRunReport).toEqual({ date: DAY, queued: 3, nothingWaiting: 1, off: 1, alreadySent: 0 });

    const mail = digests(await t.mailbox());
    expect(mail.map((m) => m.to[0]).sort()).toEqual([s.checker.email, s.rafe.email, s.manager.email].sort());

    const rafe = mail.find((m) => m.to.includes(s.rafe.email))!;
    expect(rafe.subject).toBe(`3 flags wait on you (1 overdue): Sagline digest ${DAY}`);
    const link = (projectId: number, flagId: number) => `${TEST_PUBLIC_URL}/projects/${projectId}/flags/${flagId}`;
    expect(rafe.text).toBe(
      [
        'Hello Rafe,',
        '',
        `3 flags wait on you on Sagline today (${DAY}), 1 overdue.`,
        '',
        'Overdue (1)',
        `- Halvercote Yard · B1: ${s.flags.overdue.title} (due 2026-12-08, 2 days overdue; assigned to you, open)`,
        `  ${link(s.yard.id, s.flags.overdue.id)}`,
        '',
        'Assigned to you: answer once the member is resolved (2)',
        `- Halvercote Yard · B2: ${s.flags.later.title} (due 2026-12-20; assigned to you, open)`,
        `  ${link(s.yard.id, s.flags.later.id)}`,
        `- Halvercote Annex · A1: ${s.flags.annex.title} (no due date; assigned to you, open)`,
        `  ${link(s.annex.id, s.flags.annex.id)}`,
        '',
        `You get this digest each day something waits on you. Turn it off on your Account page: ${TEST_PUBLIC_URL}/account`,
      ].join('\n') + '\n',
    );
    // The closed flag (B4) waits on nobody.
    expect(rafe.text).not.toContain('B4');

    const priya = mail.find((m) => m.to.includes(s.checker.email))!;
    expect(priya.subject).toBe(`1 flag waits on you (1 overdue): Sagline digest ${DAY}`);
    expect(priya.text).toContain(`- Halvercote Yard · B3: ${s.flags.answered.title} (due 2026-12-01, 9 days overdue; answered by Ines Okafor, waiting for you to close or reopen)`);
    expect(priya.text).not.toContain('B5');

    // The manager: every overdue flag of Halvercote Yard (open or answered), none of the Annex she does not manage.
    const mireille = mail.find((m) => m.to.includes(s.manager.email))!;
    expect(mireille.subject).toBe(`3 overdue flags in projects you manage: Sagline digest ${DAY}`);
    expect(mireille.text).toContain(`3 flags are overdue in projects you manage on Sagline today (${DAY}).`);
    expect(mireille.text).toContain('Overdue in projects you manage (3)');
    expect(mireille.text).toContain(`- Halvercote Yard · B3: ${s.flags.answered.title} (due 2026-12-01, 9 days overdue; with Ines Okafor, answered by Ines Okafor)`);
    expect(mireille.text).toContain(`- Halvercote Yard · B5: ${s.flags.inesOpen.title} (due 2026-12-01, 9 days overdue; with Ines Okafor, not answered)`);
    expect(mireille.text).toContain(`- Halvercote Yard · B1: ${s.flags.overdue.title} (due 2026-12-08, 2 days overdue; with Rafe Lindqvist, not answered)`);
    expect(mireille.text).not.toMatch(/B2|B4|A1/);
  });

  it('sends nobody the same day twice, however often it runs', async () => {
    const again = await s.c.admin.post('/api/digests/send', { date: DAY });
    expect(again.body).toEqual({ date: DAY, queued: 0, nothingWaiting: 1, off: 1, alreadySent: 3 });
    const both = await Promise.all([s.c.admin.post('/api/digests/send', { date: '2026-12-11' }), s.c.admin.post('/api/digests/send', { date: '2026-12-11' })]);
    expect(both[0].body.queued + both[1].body.queued).toBe(3);
    const mail = digests(await t.mailbox());
    expect(mail.filter((m) => m.subject.endsWith(DAY))).toHaveLength(3);
    expect(mail.filter((m) => m.subject.endsWith('2026-12-11'))).toHaveLength(3);
    expect(await t.knex('digest_log').count<{ count: string }[]>('* as count').first()).toEqual({ count: '6' });
  });

  it('sends a person who turns the digest back on their next one', async () => {
    expect((await s.c.ines.get('/api/me/preferences')).body).toEqual({ digest: false });
    expect((await s.c.ines.patch('/api/me/preferences', { digest: true })).body).toEqual({ digest: true });
    expect((await s.c.ines.get('/api/me/preferences')).body).toEqual({ digest: true });
    const res = await s.c.admin.post('/api/digests/send', { date: '2026-12-12' });
    expect(res.body).toMatchObject({ queued: 4, off: 0 });
    const ines = digests(await t.mailbox()).filter((m) => m.to.includes(s.ines.email));
    expect(ines).toHaveLength(1);
    expect(ines[0].text).toContain('B5');
    expect(ines[0].text).not.toContain('B3');
  });

  it('keeps preferences and the digest route to whom they belong, and refuses bad input', async () => {
    expectError(await new ApiClient(t.http).get('/api/me/preferences'), 401, 'UNAUTHENTICATED');
    expectError(await s.c.rafe.patch('/api/me/preferences', { digest: 'sometimes' }), 400, 'VALIDATION_FAILED', /digest: must be true .* or false/);
    expectError(await s.c.rafe.patch('/api/me/preferences', { digest: false, admin: true }), 400, 'VALIDATION_FAILED');
    expectError(await s.c.manager.post('/api/digests/send', {}), 403, 'FORBIDDEN');
    expectError(await s.c.admin.post('/api/digests/send', { date: '10/12/2026' }), 400, 'VALIDATION_FAILED', /date: must be a calendar date written YYYY-MM-DD/);
    expectError(await s.c.admin.post('/api/digests/send', { date: '2026-04-31' }), 400, 'VALIDATION_FAILED', /date: must be a calendar date/);
    expect((await s.c.rafe.get('/api/me/preferences')).body).toEqual({ digest: true });
  });

  it('is scheduled every day at 07:00 UTC, and the scheduled job writes the digest of the day', async () => {
    const queue = t.app.get(JobQueue);
    // The worker registers the schedule once pg-boss has started.
    let schedule: { cron: string; options: { tz?: string } } | undefined;
    for (let i = 0; i < 100 && !schedule; i++) {
      schedule = await t.knex('pgboss.schedule').where({ name: DIGEST_QUEUE }).first().catch(() => undefined);
      if (!schedule) await new Promise((r) => setTimeout(r, 100));
    }
    expect(schedule).toMatchObject({ cron: '0 7 * * *', options: { tz: 'UTC' } });

    // What pg-boss's clock does at 07:00: send a job to the queue; the worker runs the digest of today.
    await queue.send(DIGEST_QUEUE, {}, { id: randomUUID(), retryLimit: 2, expireInSeconds: 60 });
    const today = utcDay();
    let done = 0;
    // Rafe, Priya and Ines have flags waiting whatever the day; the manager only once some are overdue.
    for (let i = 0; i < 150 && done < 3; i++) {
      done = Number((await t.knex('digest_log').where({ day: today }).count<{ count: string }[]>('* as count').first())!.count);
      if (done < 3) await new Promise((r) => setTimeout(r, 100));
    }
    await new Promise((r) => setTimeout(r, 300));
    const mail = digests(await t.mailbox()).filter((m) => m.subject.endsWith(today));
    expect(mail.map((m) => m.to[0])).toEqual(expect.arrayContaining([s.checker.email, s.ines.email, s.rafe.email]));
    expect(mail.map((m) => m.to[0]).sort()).toEqual(
      (await t.knex('digest_log').join('users', 'users.id', 'digest_log.user_id').where({ day: today }).pluck('users.email')).sort(),
    );
  });
});

describe('the digest when SMTP is down', () => {
  let t: TestApp;
  let fake: FakeSmtp | null = null;
  let smtpPort: number;

  beforeAll(async () => {
    smtpPort = await freePort();
    t = await TestApp.start({ withoutSmtp: true, quiet: true, env: { SMTP_URL: `smtp://127.0.0.1:${smtpPort}` } });
  });
  afterAll(async () => {
    await t.close();
    await fake?.close();
  });

  it('keeps the digests queued, and delivers each exactly once when SMTP is back', async () => {
    const s = await scenario(t);
    expect((await s.c.admin.post('/api/digests/send', { date: DAY })).body).toMatchObject({ queued: 3 });
    await t.outbox.settle();
    const queued = await t.knex('outbound_mail').where('subject', 'like', '%Sagline digest%').orderBy('id');
    expect(queued.map((m) => [m.to, m.status, m.attempts])).toEqual(
      expect.arrayContaining([[s.rafe.email, 'queued', 1], [s.checker.email, 'queued', 1], [s.manager.email, 'queued', 1]]),
    );
    // A second run while SMTP is down adds nothing.
    expect((await s.c.admin.post('/api/digests/send', { date: DAY })).body).toMatchObject({ queued: 0, alreadySent: 3 });

    fake = await startFakeSmtp({ smtpPort, httpPort: 0 });
    const later = new Date(Date.now() + 4 * 3_600_000);
    const [a, b] = await Promise.all([t.outbox.flushOutbox(later), t.outbox.flushOutbox(later)]);
    expect(a.sent + b.sent).toBeGreaterThanOrEqual(3);
    await t.outbox.flushOutbox(later);
    const got = digests(fake.messages());
    expect(got.map((m) => m.to[0]).sort()).toEqual([s.checker.email, s.rafe.email, s.manager.email].sort());
    expect(await t.knex('outbound_mail').where('subject', 'like', '%Sagline digest%').pluck('status')).toEqual(['sent', 'sent', 'sent']);
  });
});

describe('the digest e-mail of a manager with many overdue flags', () => {
  it('lists ten per project and links to the rest', () => {
    const items: WaitingFlag[] = Array.from({ length: 13 }, (_, i) => ({
      user_id: 1, why: 'managed', assignee_name: 'Rafe Lindqvist', flag_id: 100 + i, project_id: 7, project_name: 'Halvercote Yard',
      mark: `B${i + 1}`, title: `B${i + 1} fails L/360 live`, due_date: '2026-12-01', overdue: true, answered_by: null,
    }));
    const mail = digestMail({ to: 'mireille@firm.example', name: 'Mireille Fontaine', day: DAY, publicUrl: TEST_PUBLIC_URL, items });
    expect(mail.subject).toBe(`13 overdue flags in projects you manage: Sagline digest ${DAY}`);
    expect(mail.text).toContain('Overdue in projects you manage (13)');
    expect(mail.text.match(/^- Halvercote Yard · B\d+:/gm)).toHaveLength(10);
    expect(mail.text).toContain(`- … 3 more overdue in Halvercote Yard: ${TEST_PUBLIC_URL}/projects/7/flags?overdue=true`);
  });
});

describe('DIGEST_CRON', () => {
  it('takes a five-field cron in UTC or off, and says what is wrong with anything else', () => {
    expect(parseDigestSettings({})).toEqual({ cron: '0 7 * * *' });
    expect(parseDigestSettings({ DIGEST_CRON: ' 30  6 * * 1-5 ' })).toEqual({ cron: '30 6 * * 1-5' });
    expect(parseDigestSettings({ DIGEST_CRON: 'OFF' })).toEqual({ cron: null });
    expect(() => parseDigestSettings({ DIGEST_CRON: 'every morning' })).toThrow(/DIGEST_CRON "every morning" is not a five-field cron expression in UTC such as "0 7 \* \* \*"/);
    expect(() => parseDigestSettings({ DIGEST_CRON: '0 7 * *' })).toThrow(/DIGEST_CRON/);
  });

  it('moves the schedule when it changes, and removes it when turned off', async () => {
    const t = await TestApp.start();
    const row = () => t.knex('pgboss.schedule').where({ name: DIGEST_QUEUE }).first().catch(() => undefined);
    // The worker writes the schedule once pg-boss has started, a moment after the api is up.
    const settled = async (done: (r: { cron: string } | undefined) => boolean) => {
      for (let i = 0; i < 100; i++) {
        const r = await row();
        if (done(r)) return r;
        await new Promise((res) => setTimeout(res, 100));
      }
      return row();
    };
    const before = process.env.DIGEST_CRON;
    try {
      expect(await settled((r) => r?.cron === '0 7 * * *')).toMatchObject({ cron: '0 7 * * *' });
      process.env.DIGEST_CRON = '15 5 * * 1-5';
      await t.restart();
      expect(await settled((r) => r?.cron === '15 5 * * 1-5')).toMatchObject({ cron: '15 5 * * 1-5', options: { tz: 'UTC' } });
      process.env.DIGEST_CRON = 'off';
      await t.restart();
      expect(await settled((r) => r === undefined)).toBeUndefined();
    } finally {
      if (before === undefined) delete process.env.DIGEST_CRON;
      else process.env.DIGEST_CRON = before;
      await t.close();
    }
  });
});
