import { randomBytes } from 'node:crypto';
import cookieParser from 'cookie-parser';
import type { RequestHandler } from 'express';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { AppConfig } from '../config';
import { auditController } from '../controllers/audit';
import { authController } from '../controllers/auth';
import { devInboxController } from '../controllers/dev-inbox';
import { invitationsController } from '../controllers/invitations';
import { profileController } from '../controllers/profile';
import { usersController } from '../controllers/users';
import type { MailInbox } from '../mail/inbox';
import { unconfiguredMailer, type Mailer } from '../mail/mailer';
import { auditRoutes } from '../routes/audit';
import { authRoutes } from '../routes/auth';
import { devInboxRoutes } from '../routes/dev-inbox';
import { invitationsRoutes } from '../routes/invitations';
import { profileRoutes } from '../routes/profile';
import { usersRoutes } from '../routes/users';
import { AuditService } from '../services/audit';
import { InvitationsService } from '../services/invitations';
import { MailService } from '../services/mail';
import { DEFAULT_PASSWORD_HASH_ROUNDS, PasswordService } from '../services/passwords';
import { UsersService } from '../services/users';
import { systemClock, type Clock } from './clock';
import { createCsrf, type Csrf } from './csrf';
import { createPassport } from './passport';
import { createLimiters, DEFAULT_RATE_LIMITS, type RateLimitSettings } from './rate-limits';
import type { RouteGroup } from './route-table';
import { Scope } from './scope';
import { deriveKey } from './secrets';
import { sessionMiddleware } from './session';

/** What main.ts (or a spec) decides about accounts; everything has a default. */
export interface AccountsOptions {
  mailer?: Mailer;
  /** The fake SMTP server's inbox, served to developers when given. */
  devInbox?: MailInbox | null;
  clock?: Clock;
  /** Signs cookies; without one, a random per-process secret (sessions end at restart). */
  sessionSecret?: string;
  passwordHashRounds?: number;
  rateLimits?: Partial<RateLimitSettings>;
  sessionIdleMs?: number;
  sessionAbsoluteMs?: number;
}

export interface AccountServices {
  scope: Scope;
  audit: AuditService;
  mail: MailService;
  passwords: PasswordService;
  users: UsersService;
  invitations: InvitationsService;
}

export interface Accounts {
  services: AccountServices;
  /** Cookies, session, passport, CSRF and the absolute session lifetime, in that order. */
  middleware: RequestHandler[];
  routes: RouteGroup[];
}

/** A session ends 8 hours after the last request, and 7 days after sign-in at the latest (common practice). */
export const DEFAULT_SESSION_IDLE_MS = 8 * 60 * 60_000;
export const DEFAULT_SESSION_ABSOLUTE_MS = 7 * 24 * 60 * 60_000;

/** The account services alone (specs call them without HTTP to check the rules behind the routes). */
export function buildAccountServices(dataSource: DataSource, config: AppConfig, logger: Logger, options: AccountsOptions = {}, clock: Clock = systemClock): AccountServices {
  const scope = new Scope(dataSource);
  const audit = new AuditService(dataSource, clock);
  const mail = new MailService(options.mailer ?? unconfiguredMailer, config.publicUrl);
  const rounds = options.passwordHashRounds ?? DEFAULT_PASSWORD_HASH_ROUNDS;
  const passwords = new PasswordService({ dataSource, clock, rounds, mail, audit, logger });
  const users = new UsersService({ dataSource, clock, scope, audit, mail, passwords, logger });
  const invitations = new InvitationsService({ dataSource, clock, scope, audit, mail, passwords, logger });
  return { scope, audit, mail, passwords, users, invitations };
}

/** Ends a session that outlived the absolute lifetime, however active; the next request is anonymous. */
function absoluteLifetime(clock: Clock, lifetimeMs: number, csrf: Csrf): RequestHandler {
  return (req, res, next) => {
    const startedMs = req.session?.signedInAtMs;
    if (!req.user || startedMs === undefined || clock.now().getTime() - startedMs <= lifetimeMs) return next();
    req.session.regenerate((error?: unknown) => {
      if (error) return next(error);
      req.user = undefined;
      csrf.issue(req, res, { fresh: true });
      next();
    });
  };
}

export function createAccounts(deps: { config: AppConfig; dataSource: DataSource; logger: Logger; options?: AccountsOptions }): Accounts {
  const options = deps.options ?? {};
  const clock = options.clock ?? systemClock;
  const services = buildAccountServices(deps.dataSource, deps.config, deps.logger, options, clock);
  const secret = options.sessionSecret ?? randomBytes(32).toString('base64url');
  const secureCookies = deps.config.publicUrl.startsWith('https:');
  const passport = createPassport({ verifyCredentials: (email, password) => services.passwords.verifyCredentials(email, password), actorById: (id) => services.users.actorById(id) });
  const csrf = createCsrf(deriveKey(secret, 'csrf'), secureCookies);
  const limiters = createLimiters({ ...DEFAULT_RATE_LIMITS, ...options.rateLimits });

  const middleware: RequestHandler[] = [
    cookieParser(),
    sessionMiddleware(deps.dataSource, { secret: deriveKey(secret, 'session'), secureCookies, idleMs: options.sessionIdleMs ?? DEFAULT_SESSION_IDLE_MS, pruneIntervalSeconds: 15 * 60 }),
    passport.initialize(),
    passport.session(),
    csrf.protect,
    absoluteLifetime(clock, options.sessionAbsoluteMs ?? DEFAULT_SESSION_ABSOLUTE_MS, csrf),
  ];

  const auth = authController({ passport, csrf, clock, passwords: services.passwords, audit: services.audit, logger: deps.logger });
  const routes = [
    authRoutes(auth, limiters),
    profileRoutes(profileController(services), limiters),
    usersRoutes(usersController(services.users)),
    invitationsRoutes(invitationsController(services.invitations), limiters),
    auditRoutes(auditController(services.audit)),
    ...(options.devInbox ? devInboxRoutes(devInboxController(options.devInbox)) : []),
  ];
  return { services, middleware, routes };
}
