import type { ErrorRequestHandler, RequestHandler } from 'express';
import { ZodError } from 'zod';
import { HttpError } from '../errors';

/** JSON 404 for any API path no router answered. */
export const apiNotFound: RequestHandler = (req, res) => {
  res.status(404).json({ error: `no such endpoint: ${req.method} ${req.originalUrl}` });
};

function statusOf(error: unknown): number {
  if (error instanceof HttpError) return error.status;
  if (error instanceof ZodError) return 400;
  const status = (error as { status?: unknown; statusCode?: unknown })?.status ?? (error as { statusCode?: unknown })?.statusCode;
  return typeof status === 'number' && status >= 400 && status < 600 ? status : 500;
}

function bodyOf(error: unknown, status: number, exposeStack: boolean): Record<string, unknown> {
  if (error instanceof ZodError) {
    return { error: 'invalid input', details: error.issues.map((issue) => ({ path: issue.path.join('.'), message: issue.message })) };
  }
  if (error instanceof HttpError) {
    return error.details === undefined ? { error: error.message } : { error: error.message, details: error.details };
  }
  if (status < 500) return { error: (error as Error)?.message ?? 'bad request' };
  return exposeStack ? { error: 'internal error', stack: (error as Error)?.stack } : { error: 'internal error' };
}

/**
 * The one error handler. Async handlers just throw (Express 5 forwards rejected
 * promises); stack traces reach a client only in development.
 */
export function errorHandler(exposeStack: boolean): ErrorRequestHandler {
  return (error, req, res, _next) => {
    const status = statusOf(error);
    if (status >= 500) req.log?.error({ err: error }, 'request failed');
    if (res.headersSent) return;
    res.status(status).json(bodyOf(error, status, exposeStack));
  };
}
