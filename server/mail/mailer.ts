import nodemailer from 'nodemailer';
import { HttpError } from '../errors';

/** One message as the templates produce it: always both a plain-text and an HTML body. */
export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

export interface SmtpMailerOptions {
  smtpUrl: string;
  from: string;
  /** The local fake server offers no TLS; a real relay keeps nodemailer's STARTTLS. */
  local?: boolean;
}

/** nodemailer over SMTP: the fake server in development and tests, SMTP_URL in production. */
export function createSmtpMailer(options: SmtpMailerOptions): Mailer {
  const transport = nodemailer.createTransport(options.smtpUrl, { from: options.from });
  if (options.local) transport.options.ignoreTLS = true;
  return {
    async send(mail) {
      await transport.sendMail({ to: mail.to, subject: mail.subject, text: mail.text, html: mail.html });
    },
    close: () => transport.close(),
  };
}

/** For an app built without mail (specs that never send): sending is a clear 503. */
export const unconfiguredMailer: Mailer = {
  async send() {
    throw new HttpError(503, 'e-mail is not configured on this server');
  },
  close() {},
};
