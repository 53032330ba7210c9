/**
 * The local fake SMTP server for development and tests: it accepts every
 * message on loopback, keeps the newest ones in memory and serves them as JSON
 * (`MailboxMessage[]`, newest first) on `GET /messages`; `DELETE /messages`
 * empties it. STARTTLS is off (its built-in certificate is expired, so
 * nodemailer would fail the upgrade); the api's transport skips TLS on loopback.
 *
 * Run directly: `SMTP_PORT=2525 MAILBOX_PORT=2526 node api/dist/mail/fake-smtp.js`.
 */
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { simpleParser, type AddressObject } from 'mailparser';
import { SMTPServer } from 'smtp-server';
import type { MailboxMessage } from '@sagline/common/api-types';

export interface FakeSmtpOptions {
  /** 0 picks a free port. */
  smtpPort: number;
  httpPort: number;
  host?: string;
  /** How many messages to keep (oldest dropped first). */
  keep?: number;
}

export interface FakeSmtp {
  smtpPort: number;
  httpPort: number;
  smtpUrl: string;
  mailboxUrl: string;
  /** Newest first. */
  messages(): MailboxMessage[];
  clear(): void;
  close(): Promise<void>;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

export async function startFakeSmtp({ smtpPort, httpPort, host = '127.0.0.1', keep = 500 }: FakeSmtpOptions): Promise<FakeSmtp> {
  let inbox: MailboxMessage[] = [];

  const smtp = new SMTPServer({
    disabledCommands: ['STARTTLS'],
    authOptional: true,
    logger: false,
    size: MAX_MESSAGE_BYTES,
    onData(stream, session, callback) {
      simpleParser(stream)
        .then((mail) => {
          inbox = [
            {
              id: randomUUID(),
              receivedAt: new Date().toISOString(),
              from: mail.from?.text ?? session.envelope.mailFrom?.toString() ?? '',
              to: recipients(mail.to, session.envelope.rcptTo.map((r) => r.address)),
              subject: mail.subject ?? '',
              text: mail.text ?? '',
              html: typeof mail.html === 'string' ? mail.html : null,
            },
            ...inbox,
          ].slice(0, keep);
          callback();
        })
        .catch((err: Error) => callback(err));
    },
  });

  const web = http.createServer((req, res) => {
    const path = (req.url ?? '/').split('?')[0];
    if (path === '/messages' && req.method === 'GET') {
      res.writeHead(200, { 'content-type': 'application/json; charset=utf-8', 'cache-control': 'no-store' });
      res.end(JSON.stringify(inbox));
    } else if (path === '/messages' && req.method === 'DELETE') {
      inbox = [];
      res.writeHead(204).end();
    } else {
      res.writeHead(404, { 'content-type': 'application/json' }).end(JSON.stringify({ message: 'GET or DELETE /messages' }));
    }
  });

  await new Promise<void>((resolve, reject) => {
    smtp.once('error', reject);
    smtp.listen(smtpPort, host, () => resolve());
  });
  await new Promise<void>((resolve, reject) => {
    web.once('error', reject);
    web.listen(httpPort, host, () => resolve());
  });
  const actualSmtp = (smtp.server.address() as AddressInfo).port;
  const actualHttp = (web.address() as AddressInfo).port;

  return {
    smtpPort: actualSmtp,
    httpPort: actualHttp,
    smtpUrl: `smtp://${host}:${actualSmtp}`,
    mailboxUrl: `http://${host}:${actualHttp}`,
    messages: () => inbox,
    clear: () => {
      inbox = [];
    },
    close: async () => {
      await new Promise<void>((resolve) => smtp.close(() => resolve()));
      web.closeAllConnections();
      await new Promise<void>((resolve) => web.close(() => resolve()));
    },
  };
}

function recipients(to: AddressObject | AddressObject[] | undefined, envelope: string[]): string[] {
  const list = (Array.isArray(to) ? to : to ? [to] : []).flatMap((a) => a.value.map((v) => v.address ?? '')).filter(Boolean);
  return list.length ? list : envelope;
}

if (require.main === module) {
  const smtpPort = Number(process.env.SMTP_PORT ?? 2525);
  const httpPort = Number(process.env.MAILBOX_PORT ?? 2526);
  const host = process.env.MAIL_HOST ?? '127.0.0.1';
  startFakeSmtp({ smtpPort, httpPort, host })
    .then((fake) => {
      process.stdout.write(`fake SMTP on ${fake.smtpUrl}, mailbox JSON on ${fake.mailboxUrl}/messages\n`);
      const stop = () => fake.close().then(() => process.exit(0));
      process.on('SIGINT', stop);
      process.on('SIGTERM', stop);
    })
    .catch((err: Error) => {
      process.stderr.write(`fake SMTP could not start: ${err.message} (is port ${smtpPort} or ${httpPort} taken? set SMTP_PORT / MAILBOX_PORT)\n`);
      process.exit(1);
    });
}
