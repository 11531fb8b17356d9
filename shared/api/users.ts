/** User management, invitations and the audit log: contracts shared by client and server. */
import { z } from 'zod';
import type { Role } from '../domain';
import { DisplayNameSchema, EmailSchema, RoleSchema } from './auth';

export const USER_STATUSES = ['active', 'deactivated', 'all'] as const;
export type UserStatus = (typeof USER_STATUSES)[number];

export const USER_SORTS = ['displayName', 'email', 'role', 'createdAt'] as const;

/** Query of `GET /api/users`: server-paged, filtered and sorted. */
export const UserQuery = z.object({
  q: z.string().trim().max(100).optional(),
  role: RoleSchema.optional(),
  status: z.enum(USER_STATUSES).default('active'),
  sort: z.enum(USER_SORTS).default('displayName'),
  direction: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
});
export type UserQuery = z.infer<typeof UserQuery>;
export type UserQueryInput = z.input<typeof UserQuery>;

export interface Page<T> {
  items: T[];
  total: number;
  page: number;
  pageSize: number;
}

export interface UserSummary {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  isAdmin: boolean;
  phone: string;
  unit: { id: string; label: string; propertyName: string } | null;
  deactivatedAt: string | null;
  createdAt: string;
}

export const UserIdParams = z.object({ userId: z.uuid('not a user id') });

/**
 * `PATCH /api/users/:userId`: change role (and with it the unit) or the admin flag.
 * A tenant needs a unit of the organization; managers and contractors have none.
 */
export const ChangeUserRequest = z
  .object({
    role: RoleSchema.optional(),
    unitId: z.uuid().nullable().optional(),
    isAdmin: z.boolean().optional(),
  })
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type ChangeUserRequest = z.infer<typeof ChangeUserRequest>;

/** `POST /api/invitations`. Only an admin may invite a manager. */
export const InviteRequest = z
  .object({
    email: EmailSchema,
    displayName: DisplayNameSchema,
    role: RoleSchema,
    unitId: z.uuid().nullable().optional(),
    isAdmin: z.boolean().optional(),
  })
  .strict()
  .refine((invite) => invite.role !== 'tenant' || !!invite.unitId, { message: 'choose the unit the tenant lives in', path: ['unitId'] });
export type InviteRequest = z.infer<typeof InviteRequest>;

export const InvitationIdParams = z.object({ invitationId: z.uuid('not an invitation id') });

export type InvitationStatus = 'pending' | 'accepted' | 'revoked' | 'expired';

export interface InvitationSummary {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  isAdmin: boolean;
  unit: { id: string; label: string; propertyName: string } | null;
  invitedBy: string | null;
  status: InvitationStatus;
  createdAt: string;
  expiresAt: string;
}

/** A unit a tenant can be invited to or moved to. */
export interface UnitOption {
  id: string;
  label: string;
  propertyName: string;
}

export const AUDIT_ACTIONS = [
  'sign-in',
  'sign-in-failed',
  'sign-out',
  'password-reset-requested',
  'password-reset',
  'password-changed',
  'email-changed',
  'invitation-sent',
  'invitation-revoked',
  'invitation-accepted',
  'role-changed',
  'user-deactivated',
  'user-reactivated',
  'data-export',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const AuditQuery = z.object({
  action: z.enum(AUDIT_ACTIONS).optional(),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
});
export type AuditQuery = z.infer<typeof AuditQuery>;

export interface AuditEntry {
  id: string;
  at: string;
  action: AuditAction;
  actorEmail: string | null;
  targetType: string | null;
  targetId: string | null;
  ip: string | null;
  detail: Record<string, unknown>;
}
