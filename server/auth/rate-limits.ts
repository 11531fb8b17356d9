import { ipKeyGenerator, rateLimit, type Options, type RateLimitInfo } from 'express-rate-limit';
import type { Request, RequestHandler } from 'express';

/**
 * Limits on guessing. The numbers are common practice (OWASP's Authentication and
 * Forgot Password cheat sheets ask for throttling but name no figures); each is a setting.
 * Failed sign-ins count per account and per IP address; reset requests count all of
 * them, because their answer is the same whether or not the account exists.
 */
export interface RateLimitSettings {
  signInFailuresPerAccount: number;
  signInFailuresPerIp: number;
  signInWindowMs: number;
  resetRequestsPerAccount: number;
  resetRequestsPerIp: number;
  resetWindowMs: number;
  /** Wrong or expired link tokens, and wrong current passwords, per IP. */
  tokenFailuresPerIp: number;
  tokenWindowMs: number;
}

export const DEFAULT_RATE_LIMITS: RateLimitSettings = {
  signInFailuresPerAccount: 5,
  signInFailuresPerIp: 20,
  signInWindowMs: 15 * 60_000,
  resetRequestsPerAccount: 3,
  resetRequestsPerIp: 10,
  resetWindowMs: 60 * 60_000,
  tokenFailuresPerIp: 20,
  tokenWindowMs: 15 * 60_000,
};

function emailKey(req: Request): string {
  const email = typeof req.body?.email === 'string' ? req.body.email.trim().toLowerCase() : '';
  return `account:${email}`;
}

function ipKey(req: Request): string {
  return `ip:${ipKeyGenerator(req.ip ?? '')}`;
}

function minutes(ms: number): string {
  const count = Math.ceil(ms / 60_000);
  return count === 1 ? '1 minute' : `${count} minutes`;
}

function limiter(options: Partial<Options> & { message: string }): RequestHandler {
  const { message, ...rest } = options;
  return rateLimit({
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    ...rest,
    handler: (req, res) => {
      const info = (req as Request & { rateLimit?: RateLimitInfo }).rateLimit;
      const resetMs = info?.resetTime ? info.resetTime.getTime() - Date.now() : (options.windowMs ?? 60_000);
      res.status(429).json({ error: message, retryAfterSeconds: Math.max(1, Math.ceil(resetMs / 1000)) });
    },
  });
}

export interface Limiters {
  signIn: RequestHandler[];
  resetRequest: RequestHandler[];
  tokenUse: RequestHandler[];
  currentPassword: RequestHandler[];
}

/** New limiter instances (and counters) per app, so one spec's attempts do not leak into another's. */
export function createLimiters(settings: RateLimitSettings): Limiters {
  const signInWait = minutes(settings.signInWindowMs);
  const resetWait = minutes(settings.resetWindowMs);
  const tokenWait = minutes(settings.tokenWindowMs);
  return {
    signIn: [
      limiter({
        windowMs: settings.signInWindowMs,
        limit: settings.signInFailuresPerIp,
        skipSuccessfulRequests: true,
        keyGenerator: ipKey,
        message: `Too many failed sign-ins from your network. Wait ${signInWait} and try again.`,
      }),
      limiter({
        windowMs: settings.signInWindowMs,
        limit: settings.signInFailuresPerAccount,
        skipSuccessfulRequests: true,
        keyGenerator: emailKey,
        message: `Too many failed sign-ins for this account. Wait ${signInWait}, or reset your password.`,
      }),
    ],
    resetRequest: [
      limiter({ windowMs: settings.resetWindowMs, limit: settings.resetRequestsPerIp, keyGenerator: ipKey, message: `Too many reset requests from your network. Wait ${resetWait} and try again.` }),
      limiter({ windowMs: settings.resetWindowMs, limit: settings.resetRequestsPerAccount, keyGenerator: emailKey, message: `Too many reset requests for this address. Check your inbox, or wait ${resetWait}.` }),
    ],
    tokenUse: [
      limiter({ windowMs: settings.tokenWindowMs, limit: settings.tokenFailuresPerIp, skipSuccessfulRequests: true, keyGenerator: ipKey, message: `Too many attempts with links that did not work. Wait ${tokenWait} and try again.` }),
    ],
    currentPassword: [
      limiter({
        windowMs: settings.signInWindowMs,
        limit: settings.signInFailuresPerAccount,
        skipSuccessfulRequests: true,
        keyGenerator: (req) => `user:${req.user?.id ?? ipKey(req)}`,
        message: `Too many wrong current passwords. Wait ${signInWait} and try again.`,
      }),
    ],
  };
}
