import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';
import { badRequest } from '../errors';

/**
 * For multipart forms: the structured part travels as JSON in one text field; it is
 * parsed and validated with the shared schema and becomes req.body.
 */
export function jsonField(field: string, schema: ZodType): RequestHandler {
  return (req, _res, next) => {
    const raw = (req.body as Record<string, unknown> | undefined)?.[field];
    if (typeof raw !== 'string') throw badRequest(`the form needs a "${field}" field holding JSON`);
    let parsed: unknown;
    try {
      parsed = JSON.parse(raw);
    } catch {
      throw badRequest(`the "${field}" field is not JSON`);
    }
    req.body = schema.parse(parsed);
    next();
  };
}
