import net from 'node:net';
import { startFakeSmtp, type FakeSmtp } from '../src/mail/fake-smtp';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD } from './support/factories';
import { TestApp } from './support/test-app';

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

describe('the mail outbox', () => {
  let t: TestApp;
  let smtpPort: number;
  let fake: FakeSmtp | null = null;

  beforeAll(async () => {
    smtpPort = await freePort();
    // SMTP_URL points at a port where nothing listens yet: the server is "down".
    t = await TestApp.start({ withoutSmtp: true, quiet: true, env: { SMTP_URL: `smtp://127.0.0.1:${smtpPort}` } });
  });
  afterAll(async () => {
    await t.close();
    await fake?.close();
  });

  it('keeps a message queued while SMTP is down, and a flush sends it exactly once when it is back', async () => {
    const make = new Factories(t.knex);
    const manager = await make.user({ name: 'Mireille Fontaine' });
    const project = await make.project({ team: [[manager, 'manager']] });
    const c = await ApiClient.signedIn(t.http, manager.email, PASSWORD);

    // The invitation itself succeeds: the e-mail waits in the outbox.
    const res = await c.post(`/api/projects/${project.id}/invitations`, { email: 'waiting.for.mail@firm.example', role: 'viewer' });
    expect(res.status).toBe(201);
    await t.outbox.settle();
    const queued = await t.knex('outbound_mail').where({ to: 'waiting.for.mail@firm.example' }).first();
    expect(queued).toMatchObject({ status: 'queued', attempts: 1, sent_at: null, last_error: expect.stringMatching(/ECONNREFUSED/) });
    expect(queued.next_attempt_at.getTime()).toBeGreaterThan(Date.now());

    // Not due yet: a flush now leaves it alone.
    expect(await t.outbox.flushOutbox()).toEqual({ sent: 0, queued: 0, failed: 0 });

    // Still down when due: stays queued with a second attempt counted.
    const later = new Date(Date.now() + 2 * 3_600_000);
    expect(await t.outbox.flushOutbox(later)).toEqual({ sent: 0, queued: 1, failed: 0 });

    fake = await startFakeSmtp({ smtpPort, httpPort: 0 });
    const muchLater = new Date(Date.now() + 4 * 3_600_000);
    const [first, second] = await Promise.all([t.outbox.flushOutbox(muchLater), t.outbox.flushOutbox(muchLater)]);
    expect(first.sent + second.sent).toBe(1);
    expect(await t.outbox.flushOutbox(muchLater)).toEqual({ sent: 0, queued: 0, failed: 0 });

    const messages = fake.messages().filter((m) => m.to.includes('waiting.for.mail@firm.example'));
    expect(messages).toHaveLength(1);
    expect(messages[0].subject).toMatch(/invited you to/);
    const sent = await t.knex('outbound_mail').where({ id: queued.id }).first();
    expect(sent).toMatchObject({ status: 'sent', attempts: 3, last_error: null, sent_at: expect.any(Date) });
  });
});

describe('the development mailbox route', () => {
  it('lists what the fake SMTP server caught, newest first', async () => {
    const t = await TestApp.start();
    try {
      const make = new Factories(t.knex);
      const manager = await make.user();
      const project = await make.project({ team: [[manager, 'manager']] });
      const c = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
      await c.post(`/api/projects/${project.id}/invitations`, { email: 'first@firm.example', role: 'viewer' });
      await t.outbox.settle();
      await c.post(`/api/projects/${project.id}/invitations`, { email: 'second@firm.example', role: 'viewer' });
      await t.outbox.settle();
      const res = await new ApiClient(t.http).get('/api/dev/mailbox');
      expect(res.status).toBe(200);
      expect(res.body).toEqual([
        { id: expect.any(String), receivedAt: expect.any(String), from: expect.stringContaining('Sagline'), to: ['second@firm.example'], subject: expect.any(String), text: expect.stringContaining('/invitations/'), html: expect.stringContaining('<a href=') },
        expect.objectContaining({ to: ['first@firm.example'] }),
      ]);
    } finally {
      await t.close();
    }
  });

  it('says clearly when the mailbox is not running', async () => {
    const t = await TestApp.start({ withoutSmtp: true, quiet: true });
    try {
      expectError(await new ApiClient(t.http).get('/api/dev/mailbox'), 502, 'INTERNAL', /The local mailbox at http:\/\/127\.0\.0\.1:39 is not answering \(ECONNREFUSED\)/);
    } finally {
      await t.close();
    }
  });

  it('does not exist in production', async () => {
    const t = await TestApp.start({ env: { NODE_ENV: 'production', SESSION_SECRET: 'x'.repeat(40) } });
    try {
      expectError(await new ApiClient(t.http).get('/api/dev/mailbox'), 404, 'NOT_FOUND');
    } finally {
      await t.close();
    }
  });
});
