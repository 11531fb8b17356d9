import { Passport } from 'passport';
import { Strategy as LocalStrategy } from 'passport-local';
import type { Request, Response } from 'express';
import type { Actor } from './actor';

/** One app's own passport instance. */
export type AppPassport = InstanceType<typeof Passport>;

export interface CredentialChecks {
  verifyCredentials(email: string, password: string): Promise<Actor | null>;
  actorById(userId: string): Promise<Actor | null>;
}

/**
 * A passport instance of this app's own (not the global one), so every app a spec builds
 * has its own strategy. The session keeps only the user id; the user is loaded afresh on
 * every request, so deactivation and role changes apply at once.
 */
export function createPassport(checks: CredentialChecks): AppPassport {
  const passport = new Passport();
  passport.use(
    'local',
    new LocalStrategy({ usernameField: 'email', passwordField: 'password', session: true }, (email, password, done) => {
      checks.verifyCredentials(email, password).then((actor) => done(null, actor ?? false), done);
    }),
  );
  passport.serializeUser((user, done) => done(null, (user as Actor).id));
  passport.deserializeUser((userId: string, done) => {
    checks.actorById(userId).then((actor) => done(null, actor ?? false), done);
  });
  return passport;
}

/** Runs the local strategy on a validated body; resolves the actor, or null for bad credentials. */
export function authenticateLocal(passport: AppPassport, req: Request, res: Response): Promise<Actor | null> {
  return new Promise((resolve, reject) => {
    passport.authenticate('local', { session: false }, (error: unknown, user: Actor | false) => {
      if (error) reject(error);
      else resolve(user || null);
    })(req, res, reject);
  });
}

/** req.login, which regenerates the session (passport 0.7) so a planted session id is worthless. */
export function logIn(req: Request, actor: Actor): Promise<void> {
  return new Promise((resolve, reject) => req.login(actor, (error?: unknown) => (error ? reject(error) : resolve())));
}
