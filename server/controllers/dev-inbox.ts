import type { Request, Response } from 'express';
import type { InboxMessage, InboxSummary, MailInbox } from '../mail/inbox';
import { escapeHtml } from '../mail/templates';
import { notFound } from '../errors';

/**
 * The fake SMTP server's inbox for developers and the end-to-end suite: JSON under
 * /api/dev/inbox and a plain page at /dev/inbox. Mounted only while mail stays local.
 */
function page(title: string, body: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${escapeHtml(title)} · Chillwarden dev inbox</title>
<style>body{font-family:Roboto,Arial,sans-serif;margin:24px;color:#1b2830}table{border-collapse:collapse}td,th{padding:6px 12px;border-bottom:1px solid #d5dde0;text-align:left}pre{white-space:pre-wrap;background:#f3f6f7;padding:16px;border-radius:6px}</style>
</head><body><p><a href="/dev/inbox">Dev inbox</a> — e-mail the server sent while no real mail relay is set (SMTP_URL).</p>${body}</body></html>`;
}

function linkify(text: string): string {
  return escapeHtml(text).replace(/https?:\/\/[^\s<>"]+/g, (url) => `<a href="${url}">${url}</a>`);
}

function listPage(messages: InboxSummary[]): string {
  if (messages.length === 0) return page('Inbox', '<h1>Inbox</h1><p>No messages yet. Invite someone or ask for a password reset, then reload.</p>');
  const rows = messages
    .map((m) => `<tr><td>${escapeHtml(m.receivedAt)}</td><td>${escapeHtml(m.to)}</td><td><a href="/dev/inbox/${m.id}">${escapeHtml(m.subject || '(no subject)')}</a></td></tr>`)
    .join('');
  return page('Inbox', `<h1>Inbox</h1><table><thead><tr><th>Received</th><th>To</th><th>Subject</th></tr></thead><tbody>${rows}</tbody></table>`);
}

function messagePage(message: InboxMessage): string {
  return page(
    message.subject,
    `<h1>${escapeHtml(message.subject)}</h1>
<p>From ${escapeHtml(message.from)} to ${escapeHtml(message.to)}, received ${escapeHtml(message.receivedAt)}.</p>
<p><a href="/dev/inbox/${message.id}/html">HTML version</a> · <a href="/api/dev/inbox/${message.id}/raw">.eml file</a></p>
<pre>${linkify(message.text)}</pre>`,
  );
}

export function devInboxController(inbox: MailInbox) {
  const messageOf = async (req: Request): Promise<InboxMessage> => {
    const message = await inbox.get(req.params.messageId as string);
    if (!message) throw notFound('message');
    return message;
  };
  return {
    list: async (_req: Request, res: Response) => {
      res.json(await inbox.list());
    },
    get: async (req: Request, res: Response) => {
      res.json(await messageOf(req));
    },
    raw: (req: Request, res: Response) => {
      const raw = inbox.raw(req.params.messageId as string);
      if (!raw) throw notFound('message');
      res.type('message/rfc822').attachment(`${req.params.messageId}.eml`).send(raw);
    },
    listPage: async (_req: Request, res: Response) => {
      res.type('html').send(listPage(await inbox.list()));
    },
    messagePage: async (req: Request, res: Response) => {
      res.type('html').send(messagePage(await messageOf(req)));
    },
    /** The message's own HTML, sandboxed: no script runs and nothing loads from elsewhere. */
    htmlBody: async (req: Request, res: Response) => {
      const message = await messageOf(req);
      res.setHeader('Content-Security-Policy', "sandbox allow-popups allow-top-navigation-by-user-activation; default-src 'none'; style-src 'unsafe-inline'; img-src data:");
      res.type('html').send(message.html ?? `<pre>${linkify(message.text)}</pre>`);
    },
  };
}
