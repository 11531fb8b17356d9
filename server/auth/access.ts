import type { RequestHandler } from 'express';
import type { Role } from '../../shared/domain';
import { HttpError, unauthorized } from '../errors';
import type { Actor } from './actor';

/**
 * Who may call a route: anyone, anyone signed in, the listed roles, or the listed roles
 * with the admin flag (managers who manage the organization's users).
 */
export type AccessRule = 'public' | 'signed-in' | readonly Role[] | { readonly roles: readonly Role[]; readonly admin: true };

export type AccessVerdict = 'allowed' | 'sign-in-required' | 'wrong-role';

export const ADMIN_ONLY: AccessRule = { roles: ['manager'], admin: true };

function rolesOf(rule: Exclude<AccessRule, 'public' | 'signed-in'>): readonly Role[] {
  return 'roles' in rule ? rule.roles : rule;
}

export function verdict(rule: AccessRule, actor: Actor | null): AccessVerdict {
  if (rule === 'public') return 'allowed';
  if (!actor) return 'sign-in-required';
  if (rule === 'signed-in') return 'allowed';
  if (!rolesOf(rule).includes(actor.role)) return 'wrong-role';
  if ('admin' in rule && !actor.isAdmin) return 'wrong-role';
  return 'allowed';
}

export function describeAccess(rule: AccessRule): string {
  if (rule === 'public' || rule === 'signed-in') return rule;
  return rolesOf(rule).join(' | ') + ('admin' in rule ? ' (admin)' : '');
}

/**
 * Route guard: 401 when nobody is signed in, 403 when the role may not call the route at
 * all. Whether a given record is within the actor's reach is the service's question (404).
 */
export function requireRole(rule: AccessRule): RequestHandler {
  return (req, _res, next) => {
    const outcome = verdict(rule, req.user ?? null);
    if (outcome === 'sign-in-required') throw unauthorized();
    if (outcome === 'wrong-role') throw new HttpError(403, 'your account may not do this');
    next();
  };
}
