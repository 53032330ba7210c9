import { Inject, Injectable, type OnApplicationShutdown } from '@nestjs/common';
import nodemailer, { type Transporter } from 'nodemailer';
import { APP_CONFIG } from '../config/config.tokens';
import type { AppConfig } from '../config/app-config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string | null;
}

const LOOPBACK = new Set(['127.0.0.1', 'localhost', '::1', '[::1]']);

/** nodemailer over SMTP_URL. Short timeouts: a dead server must not hold a request for minutes. */
@Injectable()
export class MailTransport implements OnApplicationShutdown {
  private readonly transporter: Transporter;

  constructor(@Inject(APP_CONFIG) private readonly config: AppConfig) {
    const host = new URL(config.smtpUrl).hostname;
    this.transporter = nodemailer.createTransport({
      url: config.smtpUrl,
      // The local fake (and a relay on this machine) speaks plain SMTP; real servers get STARTTLS.
      ignoreTLS: LOOPBACK.has(host),
      connectionTimeout: 5_000,
      greetingTimeout: 5_000,
      socketTimeout: 15_000,
    });
  }

  async send(mail: OutgoingMail): Promise<void> {
    await this.transporter.sendMail({ from: this.config.mailFrom, to: mail.to, subject: mail.subject, text: mail.text, html: mail.html ?? undefined });
  }

  onApplicationShutdown(): void {
    this.transporter.close();
  }
}
