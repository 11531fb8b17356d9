import type { RequestHandler } from 'express';
import type { ZodType } from 'zod';

export interface RequestSchemas {
  params?: ZodType;
  query?: ZodType;
  body?: ZodType;
}

/**
 * Parses the request with the shared zod schemas and puts the parsed values back, so
 * the controller reads clean, typed input. A ZodError becomes a 400 in the error handler.
 */
export function validate(schemas: RequestSchemas): RequestHandler {
  return (req, _res, next) => {
    if (schemas.params) req.params = schemas.params.parse(req.params) as typeof req.params;
    // Express 5 makes req.query a getter; redefine it on this request.
    if (schemas.query) Object.defineProperty(req, 'query', { value: schemas.query.parse(req.query), writable: true, configurable: true, enumerable: true });
    if (schemas.body) req.body = schemas.body.parse(req.body ?? {});
    next();
  };
}
