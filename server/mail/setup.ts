import path from 'node:path';
import { startFakeSmtp } from './fake-smtp';
import type { MailInbox } from './inbox';
import { createSmtpMailer, type Mailer } from './mailer';

export const DEFAULT_MAIL_FROM = 'Chillwarden <no-reply@chillwarden.example.com>';

export interface MailSetup {
  mailer: Mailer;
  /** The fake server's inbox, when mail stays on this machine; null with a real relay. */
  inbox: MailInbox | null;
  /** Whether a developer may read the inbox over HTTP (see devInboxAllowed). */
  inboxOverHttp: boolean;
  description: string;
  close(): Promise<void>;
}

const LOOPBACK_HOSTS = new Set(['127.0.0.1', '::1', 'localhost']);

/**
 * Reading the fake inbox over HTTP hands out every reset link, so it is offered only
 * while the server listens on the loopback interface (as `npm start` does), or when
 * DEV_INBOX=on says so explicitly; DEV_INBOX=off turns it off.
 */
export function devInboxAllowed(env: NodeJS.ProcessEnv, host: string): boolean {
  if (env.DEV_INBOX === 'on') return true;
  if (env.DEV_INBOX === 'off') return false;
  return LOOPBACK_HOSTS.has(host);
}

/**
 * SMTP_URL set: mail goes to that relay. Unset: a fake SMTP server starts inside this
 * process and files messages as .eml files under DATA_DIR/mail — one process fewer to
 * run, and the dev inbox page reads the same folder the server writes.
 */
export async function startMail(env: NodeJS.ProcessEnv, options: { dataDir: string; host: string }): Promise<MailSetup> {
  const from = env.MAIL_FROM ?? DEFAULT_MAIL_FROM;
  if (env.SMTP_URL) {
    const mailer = createSmtpMailer({ smtpUrl: env.SMTP_URL, from });
    return { mailer, inbox: null, inboxOverHttp: false, description: `e-mail via ${new URL(env.SMTP_URL).host}`, close: async () => mailer.close() };
  }
  const fake = await startFakeSmtp({ inboxFolder: path.join(options.dataDir, 'mail'), port: Number(env.FAKE_SMTP_PORT ?? 0) });
  const mailer = createSmtpMailer({ smtpUrl: fake.url, from, local: true });
  return {
    mailer,
    inbox: fake.inbox,
    inboxOverHttp: devInboxAllowed(env, options.host),
    description: `e-mail kept locally by the fake SMTP server at ${fake.url}, filed in ${fake.inbox.folder}`,
    async close() {
      mailer.close();
      await fake.close();
    },
  };
}
