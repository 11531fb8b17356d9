import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { simpleParser, type AddressObject } from 'mailparser';

export interface InboxSummary {
  id: string;
  receivedAt: string;
  from: string;
  to: string;
  subject: string;
}

export interface InboxMessage extends InboxSummary {
  text: string;
  html: string | null;
  /** The links of the plain-text body, in order: what a developer clicks. */
  links: string[];
}

const ID_PATTERN = /^\d{13}-[0-9a-f]{8}$/;

function addressText(address: AddressObject | AddressObject[] | undefined): string {
  if (!address) return '';
  return (Array.isArray(address) ? address : [address]).map((entry) => entry.text).join(', ');
}

/**
 * The fake SMTP server's mailbox: one `.eml` file per message in a folder, newest first.
 * Files are the record, so messages survive a restart and open in any mail program.
 */
export class MailInbox {
  constructor(readonly folder: string) {
    fs.mkdirSync(folder, { recursive: true });
  }

  save(raw: Buffer, receivedAtMs = Date.now()): string {
    const id = `${String(receivedAtMs).padStart(13, '0')}-${randomBytes(4).toString('hex')}`;
    fs.writeFileSync(path.join(this.folder, `${id}.eml`), raw);
    return id;
  }

  ids(limit = 200): string[] {
    return fs
      .readdirSync(this.folder)
      .filter((name) => name.endsWith('.eml') && ID_PATTERN.test(name.slice(0, -4)))
      .map((name) => name.slice(0, -4))
      .sort()
      .reverse()
      .slice(0, limit);
  }

  async list(limit = 200): Promise<InboxSummary[]> {
    const messages = await Promise.all(this.ids(limit).map((id) => this.get(id)));
    return messages.filter((message): message is InboxMessage => message !== null).map(({ id, receivedAt, from, to, subject }) => ({ id, receivedAt, from, to, subject }));
  }

  raw(id: string): Buffer | null {
    if (!ID_PATTERN.test(id)) return null;
    const file = path.join(this.folder, `${id}.eml`);
    return fs.existsSync(file) ? fs.readFileSync(file) : null;
  }

  async get(id: string): Promise<InboxMessage | null> {
    const raw = this.raw(id);
    if (!raw) return null;
    const parsed = await simpleParser(raw);
    const text = parsed.text ?? '';
    return {
      id,
      receivedAt: new Date(Number(id.slice(0, 13))).toISOString(),
      from: addressText(parsed.from),
      to: addressText(parsed.to),
      subject: parsed.subject ?? '',
      text,
      html: typeof parsed.html === 'string' ? parsed.html : null,
      links: text.match(/https?:\/\/[^\s<>"]+/g) ?? [],
    };
  }

  /** The newest message to an address, for specs and the end-to-end flow. */
  async latestTo(address: string): Promise<InboxMessage | null> {
    for (const id of this.ids()) {
      const message = await this.get(id);
      if (message && message.to.toLowerCase().includes(address.toLowerCase())) return message;
    }
    return null;
  }
}
