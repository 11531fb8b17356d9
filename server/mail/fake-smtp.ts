import type { AddressInfo } from 'node:net';
import { SMTPServer } from 'smtp-server';
import { MailInbox } from './inbox';

export interface FakeSmtp {
  url: string;
  inbox: MailInbox;
  close(): Promise<void>;
}

export interface FakeSmtpOptions {
  inboxFolder: string;
  host?: string;
  /** 0 picks a free port; only the app's own transport needs to know it. */
  port?: number;
}

const MAX_MESSAGE_BYTES = 10 * 1024 * 1024;

/**
 * A local SMTP server that accepts every message and files it in the inbox. No TLS and
 * no authentication: it listens on the loopback interface only.
 */
export async function startFakeSmtp(options: FakeSmtpOptions): Promise<FakeSmtp> {
  const inbox = new MailInbox(options.inboxFolder);
  const host = options.host ?? '127.0.0.1';
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    banner: 'Chillwarden development mail catcher',
    size: MAX_MESSAGE_BYTES,
    onData(stream, _session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('error', callback);
      stream.on('end', () => {
        try {
          inbox.save(Buffer.concat(chunks));
          callback();
        } catch (error) {
          callback(error as Error);
        }
      });
    },
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(options.port ?? 0, host, () => resolve());
  });
  const { port } = server.server.address() as AddressInfo;
  return {
    url: `smtp://${host}:${port}`,
    inbox,
    close: () => new Promise<void>((resolve) => server.close(() => resolve())),
  };
}
