/**
 * A return URL from the query string, used only if it stays on this site: a path that
 * starts with one slash (not `//host` or `/\host`, which browsers read as another site).
 */
export function safeReturnUrl(value: string | null | undefined): string | null {
  if (!value || !value.startsWith('/') || value.startsWith('//') || value.startsWith('/\\')) return null;
  if (/^\/(sign-in|forgot-password|reset-password|accept-invitation)\b/.test(value)) return null;
  return value;
}
