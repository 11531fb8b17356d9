import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';

/**
 * Double-submit CSRF tokens (csrf-csrf), named the way Angular's HttpClient expects: it
 * reads the cookie XSRF-TOKEN and sends it back in the X-XSRF-TOKEN header on every
 * state-changing request. The token is an HMAC over the session id, so a token planted
 * from elsewhere, or one from before sign-in, does not pass.
 */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

export interface Csrf {
  /** Validates state-changing requests; refreshes the cookie on reads once a session exists. */
  protect: RequestHandler;
  /** Issues a token for this session (a fresh one after the session id changed). */
  issue(req: Request, res: Response, options?: { fresh?: boolean }): string;
}

export function createCsrf(secret: string, secureCookies: boolean): Csrf {
  const { doubleCsrfProtection, generateCsrfToken } = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.sessionID ?? '',
    cookieName: CSRF_COOKIE,
    // Readable by the page's script: that is how double-submit works.
    cookieOptions: { httpOnly: false, sameSite: 'lax', secure: secureCookies, path: '/' },
    getCsrfTokenFromRequest: (req) => req.get(CSRF_HEADER),
    errorConfig: {
      statusCode: 403,
      message: 'This page is out of date or the request came from another site: reload the page and try again.',
      code: 'EBADCSRFTOKEN',
    },
  });

  const issue: Csrf['issue'] = (req, res, options = {}) => {
    if (req.session) req.session.csrfBound = true;
    return generateCsrfToken(req, res, { overwrite: options.fresh ?? false });
  };

  const protect: RequestHandler = (req, res, next) => {
    const established = !!req.user || !!req.session?.csrfBound;
    if (['GET', 'HEAD', 'OPTIONS'].includes(req.method) && established) issue(req, res);
    doubleCsrfProtection(req, res, next);
  };

  return { protect, issue };
}
