import type { Request, RequestHandler, Response } from 'express';
import type { Logger } from 'pino';
import type { ForgotPasswordRequest, ResetPasswordRequest, SessionResponse } from '../../shared/api/auth';
import type { Clock } from '../auth/clock';
import { CSRF_COOKIE, type Csrf } from '../auth/csrf';
import { authenticateLocal, logIn, type AppPassport } from '../auth/passport';
import { SESSION_COOKIE } from '../auth/session';
import { HttpError } from '../errors';
import type { AuditService } from '../services/audit';
import type { PasswordService } from '../services/passwords';

export interface AuthControllerDeps {
  passport: AppPassport;
  csrf: Csrf;
  clock: Clock;
  passwords: PasswordService;
  audit: AuditService;
  logger: Logger;
}

/** One message for an unknown address, a wrong password and a deactivated account: no enumeration. */
export const BAD_CREDENTIALS = 'The e-mail address or password is not correct.';

export const RESET_REQUESTED = 'If an account uses this address, a link to choose a new password is on its way. It works once, for an hour.';

function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) => req.session.destroy((error?: unknown) => (error ? reject(error) : resolve())));
}

export function authController(deps: AuthControllerDeps) {
  const session: RequestHandler = (req, res) => {
    deps.csrf.issue(req, res);
    const body: SessionResponse = { user: req.user ?? null };
    res.json(body);
  };

  const signIn = async (req: Request, res: Response) => {
    const actor = await authenticateLocal(deps.passport, req, res);
    if (!actor) {
      await deps.audit.record({ action: 'sign-in-failed', ip: req.ip ?? null, detail: { email: req.body.email } });
      throw new HttpError(401, BAD_CREDENTIALS);
    }
    await logIn(req, actor);
    req.session.signedInAtMs = deps.clock.now().getTime();
    deps.csrf.issue(req, res, { fresh: true });
    await deps.audit.record({ action: 'sign-in', actor, ip: req.ip ?? null });
    const body: SessionResponse = { user: actor };
    res.json(body);
  };

  const signOut = async (req: Request, res: Response) => {
    const actor = req.user ?? null;
    await destroySession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/' });
    res.clearCookie(CSRF_COOKIE, { path: '/' });
    if (actor) await deps.audit.record({ action: 'sign-out', actor, ip: req.ip ?? null });
    res.status(204).end();
  };

  /** Answers at once and the same way for every address; the e-mail goes out in the background. */
  const forgotPassword: RequestHandler = (req, res) => {
    const body: ForgotPasswordRequest = req.body;
    deps.passwords.requestReset(body.email, req.ip ?? null).catch((error: unknown) => deps.logger.error({ err: error }, 'password reset e-mail failed'));
    res.status(202).json({ message: RESET_REQUESTED });
  };

  const resetPassword = async (req: Request, res: Response) => {
    const body: ResetPasswordRequest = req.body;
    await deps.passwords.resetWithToken(body.token, body.password, req.ip ?? null);
    res.status(204).end();
  };

  return { session, signIn, signOut, forgotPassword, resetPassword };
}
