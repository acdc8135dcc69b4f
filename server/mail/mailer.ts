// Outgoing mail through SMTP: the local mailbox in development and tests, a real relay through SMTP_* settings.
import nodemailer from 'nodemailer';
import type { Config } from '../config';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
}

export function createMailer(smtp: Config['smtp']): Mailer {
  const transport = nodemailer.createTransport({
    host: smtp.host,
    port: smtp.port,
    secure: smtp.secure,
    // The local mailbox offers no TLS; a real relay is reached with SMTP_SECURE=1 or upgrades on its own.
    ignoreTLS: !smtp.secure && smtp.host === '127.0.0.1',
    auth: smtp.user ? { user: smtp.user, pass: smtp.password } : undefined,
    connectionTimeout: 10_000,
  });
  return {
    async send(mail) {
      await transport.sendMail({ from: smtp.from, ...mail });
    },
  };
}
