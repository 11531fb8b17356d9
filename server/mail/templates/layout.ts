/**
 * The frame every Chillwarden e-mail shares: a plain-text body and an HTML body built
 * from the same paragraphs, so both say the same thing. Inline styles only, because
 * mail programs drop style sheets.
 */
export const PRODUCT_NAME = 'Chillwarden';

export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export interface MailBody {
  subject: string;
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  /** Smaller print after the action: expiry, "if this was not you". */
  notes?: string[];
}

export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (char) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[char] as string);
}

function textOf(body: MailBody): string {
  const lines = [body.greeting, '', ...body.paragraphs.flatMap((paragraph) => [paragraph, ''])];
  if (body.action) lines.push(`${body.action.label}:`, body.action.url, '');
  for (const note of body.notes ?? []) lines.push(note, '');
  lines.push(`— ${PRODUCT_NAME}`, '');
  return lines.join('\n');
}

function htmlOf(body: MailBody): string {
  const paragraph = (text: string) => `<p style="margin:0 0 16px">${escapeHtml(text)}</p>`;
  const note = (text: string) => `<p style="margin:0 0 12px;color:#5b6770;font-size:13px">${escapeHtml(text)}</p>`;
  const action = body.action
    ? `<p style="margin:24px 0"><a href="${escapeHtml(body.action.url)}" style="background:#0f5c73;color:#ffffff;padding:12px 20px;border-radius:6px;text-decoration:none;display:inline-block">${escapeHtml(body.action.label)}</a></p>` +
      `<p style="margin:0 0 16px;font-size:13px;color:#5b6770">Or paste this address into your browser: ${escapeHtml(body.action.url)}</p>`
    : '';
  return [
    '<!doctype html><html><body style="margin:0;padding:24px;background:#f3f6f7;font-family:Roboto,Arial,sans-serif;color:#1b2830">',
    '<div style="max-width:560px;margin:0 auto;background:#ffffff;border-radius:8px;padding:28px">',
    `<p style="margin:0 0 20px;font-weight:600;letter-spacing:.04em;color:#0f5c73">${PRODUCT_NAME}</p>`,
    paragraph(body.greeting),
    ...body.paragraphs.map(paragraph),
    action,
    ...(body.notes ?? []).map(note),
    '</div></body></html>',
  ].join('');
}

export function compose(body: MailBody): MailContent {
  return { subject: body.subject, text: textOf(body), html: htmlOf(body) };
}

export function formatExpiry(expiresAt: Date, timeZone: string | null): string {
  return new Intl.DateTimeFormat('en-US', {
    year: 'numeric',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZone: timeZone ?? 'UTC',
    timeZoneName: 'short',
  }).format(expiresAt);
}
