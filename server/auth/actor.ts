import type { Request } from 'express';
import type { SessionUser } from '../../shared/api/session';
import type { User } from '../entities/user';
import { unauthorized } from '../errors';

/**
 * Who is acting: the signed-in user as loaded from the database on every request, so a
 * role change or deactivation takes effect at once. Services take an Actor, never a request.
 */
export type Actor = SessionUser;

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    // passport puts the deserialized user on req.user
    // eslint-disable-next-line @typescript-eslint/no-empty-object-type
    interface User extends SessionUser {}
  }
}

export function toActor(user: User): Actor {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    isAdmin: user.role === 'manager' && user.isAdmin,
    organizationId: user.organizationId,
    unitId: user.role === 'tenant' ? user.unitId : null,
    temperatureUnit: user.temperatureUnit,
    timeZone: user.timeZone,
  };
}

/** The signed-in actor; routes behind requireRole always have one. */
export function actorOf(req: Request): Actor {
  if (!req.user) throw unauthorized();
  return req.user;
}

export function optionalActor(req: Request): Actor | null {
  return req.user ?? null;
}
