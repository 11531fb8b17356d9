/**
 * Sign-in, session, password and profile contracts, shared by the client and the server.
 * The server validates every request body with these schemas; the client uses the same
 * rules in its forms so both agree on what is accepted.
 */
import { z } from 'zod';
import { ROLES, type Role } from '../domain';
import { passwordLengthProblem } from './password-rules';
import type { SessionUser } from './session';

export type { SessionUser };

/** E-mail addresses are compared in lower case, without surrounding spaces. */
export const EmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'an e-mail address has at most 254 characters')
  .pipe(z.email({ message: 'enter a valid e-mail address' }));

export { PASSWORD_MAX_BYTES, PASSWORD_MAX_LENGTH, PASSWORD_MIN_LENGTH } from './password-rules';

/** A new password: the shared length rules (password-rules.ts), as a zod schema. */
export const NewPasswordSchema = z.string().superRefine((password, context) => {
  const problem = passwordLengthProblem(password);
  if (problem) context.addIssue({ code: 'custom', message: problem });
});

/** A password being checked (sign-in, current password): any non-empty string up to the cap. */
const GivenPasswordSchema = z.string().min(1, 'enter your password').max(256);

export const SignInRequest = z.object({ email: EmailSchema, password: GivenPasswordSchema });
export type SignInRequest = z.infer<typeof SignInRequest>;

export const ForgotPasswordRequest = z.object({ email: EmailSchema });
export type ForgotPasswordRequest = z.infer<typeof ForgotPasswordRequest>;

/** Tokens travel in the link's fragment and then in request bodies, never in a URL the server sees. */
export const TokenSchema = z.string().trim().min(20).max(200).regex(/^[A-Za-z0-9_-]+$/, 'this link is not valid');

export const ResetPasswordRequest = z.object({ token: TokenSchema, password: NewPasswordSchema });
export type ResetPasswordRequest = z.infer<typeof ResetPasswordRequest>;

export const TEMPERATURE_UNITS = ['F', 'C'] as const;

/** An IANA time zone name the runtime knows, e.g. "America/Chicago". */
export const TimeZoneSchema = z
  .string()
  .trim()
  .max(64)
  .refine((zone) => {
    try {
      new Intl.DateTimeFormat('en-US', { timeZone: zone });
      return true;
    } catch {
      return false;
    }
  }, 'choose a time zone from the list');

export const DisplayNameSchema = z.string().trim().min(1, 'enter a name').max(120);
export const PhoneSchema = z.string().trim().max(40).regex(/^[0-9+().\-\s]*$/, 'use digits, spaces and + ( ) - only');

export const UpdateProfileRequest = z
  .object({
    displayName: DisplayNameSchema,
    phone: PhoneSchema,
    temperatureUnit: z.enum(TEMPERATURE_UNITS),
    timeZone: TimeZoneSchema.nullable(),
  })
  .partial()
  .strict();
export type UpdateProfileRequest = z.infer<typeof UpdateProfileRequest>;

export const ChangePasswordRequest = z.object({ currentPassword: GivenPasswordSchema, newPassword: NewPasswordSchema });
export type ChangePasswordRequest = z.infer<typeof ChangePasswordRequest>;

export const ChangeEmailRequest = z.object({ email: EmailSchema, currentPassword: GivenPasswordSchema });
export type ChangeEmailRequest = z.infer<typeof ChangeEmailRequest>;

export const AcceptInvitationRequest = z.object({
  token: TokenSchema,
  password: NewPasswordSchema,
  displayName: DisplayNameSchema.optional(),
});
export type AcceptInvitationRequest = z.infer<typeof AcceptInvitationRequest>;

export const InspectInvitationRequest = z.object({ token: TokenSchema });
export type InspectInvitationRequest = z.infer<typeof InspectInvitationRequest>;

export const RoleSchema = z.enum(ROLES);

/** `GET /api/auth/session` and `POST /api/auth/sign-in` answer this. */
export interface SessionResponse {
  user: SessionUser | null;
}

export interface Profile extends SessionUser {
  phone: string;
  organizationName: string | null;
  /** A tenant's own unit. */
  unit: { id: string; label: string; propertyName: string } | null;
}

/** What the accept-invitation page shows before the invitee sets a password. */
export interface InvitationPreview {
  email: string;
  displayName: string;
  role: Role;
  organizationName: string;
  unitLabel: string | null;
  propertyName: string | null;
  expiresAt: string;
}

/** Every error answer has this shape; `details` lists field problems for invalid input. */
export interface ApiError {
  error: string;
  details?: { path: string; message: string }[];
  retryAfterSeconds?: number;
}
