import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html?: string | null;
}

/** The SMTP side of mail; only the outbox job and the health check call it. */
export interface MailTransport {
  send(mail: OutgoingMail): Promise<void>;
  ping(): Promise<void>;
  close(): void;
}

export function createMailTransport(config: Config): MailTransport {
  const url = new URL(config.SMTP_URL);
  const transporter = nodemailer.createTransport(
    {
      host: url.hostname,
      port: Number(url.port || (url.protocol === 'smtps:' ? 465 : 587)),
      secure: url.protocol === 'smtps:',
      ...(url.username ? { auth: { user: decodeURIComponent(url.username), pass: decodeURIComponent(url.password) } } : {}),
      connectionTimeout: 3000,
      greetingTimeout: 3000,
      socketTimeout: 10000,
    },
    { from: config.MAIL_FROM },
  );
  return {
    async send(mail) {
      await transporter.sendMail({
        to: mail.to,
        subject: mail.subject,
        text: mail.text,
        ...(mail.html ? { html: mail.html } : {}),
      });
    },
    async ping() {
      await transporter.verify();
    },
    close() {
      transporter.close();
    },
  };
}
