import connectPgSimple from 'connect-pg-simple';
import session from 'express-session';
import type { RequestHandler } from 'express';
import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';

export const SESSION_COOKIE = 'chillwarden.sid';
export const SESSION_TABLE = 'http_session';

declare module 'express-session' {
  interface SessionData {
    /** Set once a CSRF token was issued, so an anonymous visitor's session (and token) persists. */
    csrfBound?: boolean;
    /** For the absolute lifetime: a session ends this long after sign-in however active it is. */
    signedInAtMs?: number;
  }
}

export interface SessionSettings {
  secret: string | string[];
  secureCookies: boolean;
  /** Idle timeout: the cookie and the stored session expire this long after the last request. */
  idleMs: number;
  /** Clear out expired rows this often; false leaves it to someone else (specs). */
  pruneIntervalSeconds: number | false;
}

/** The pg pool TypeORM already holds, so sessions need no second pool. */
function poolOf(dataSource: DataSource): Pool {
  return (dataSource.driver as unknown as { master: Pool }).master;
}

/**
 * Sessions in PostgreSQL. The cookie is HttpOnly, SameSite=Lax and Secure behind HTTPS;
 * nothing is stored for a visitor until there is something to keep.
 */
export function sessionMiddleware(dataSource: DataSource, settings: SessionSettings): RequestHandler {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pool: poolOf(dataSource),
    tableName: SESSION_TABLE,
    createTableIfMissing: false,
    pruneSessionInterval: settings.pruneIntervalSeconds,
  });
  return session({
    name: SESSION_COOKIE,
    secret: settings.secret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    cookie: { httpOnly: true, sameSite: 'lax', secure: settings.secureCookies, maxAge: settings.idleMs, path: '/' },
  });
}

/** Ends every stored session of a user (after a password reset or deactivation), except one if given. */
export async function revokeSessions(dataSource: DataSource, userId: string, exceptSessionId?: string): Promise<number> {
  const result = await dataSource.query(
    `DELETE FROM ${SESSION_TABLE} WHERE sess->'passport'->>'user' = $1 AND sid <> $2`,
    [userId, exceptSessionId ?? ''],
  );
  return Array.isArray(result) ? Number(result[1] ?? 0) : 0;
}
