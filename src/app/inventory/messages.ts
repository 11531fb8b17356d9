import { ApiError } from '../core/http/api-error.interceptor';

/** A sentence for the view from whatever failed; the server's own message when it sent one. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return capitalise(error.message);
  if (error instanceof Error && error.message) return capitalise(error.message);
  return 'Something went wrong. Try again.';
}

/** Field messages of a 400 from the server's zod check, by field path. */
export function fieldErrors(error: unknown): Record<string, string> {
  if (!(error instanceof ApiError) || !Array.isArray(error.details)) return {};
  const messages: Record<string, string> = {};
  for (const detail of error.details as { path?: unknown; message?: unknown }[]) {
    if (typeof detail?.path === 'string' && typeof detail.message === 'string') messages[detail.path] ??= capitalise(detail.message);
  }
  return messages;
}

export function capitalise(text: string): string {
  return text ? text[0].toUpperCase() + text.slice(1) : text;
}
