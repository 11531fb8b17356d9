import type { Logger } from 'pino';
import type { DataSource, EntityManager, Repository } from 'typeorm';
import type { InvitationPreview } from '../../shared/api/auth';
import type { InvitationStatus, InvitationSummary, InviteRequest, UnitOption } from '../../shared/api/users';
import type { Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { assertPasswordAcceptable } from '../auth/password-policy';
import type { Scope } from '../auth/scope';
import { returnedRows } from '../auth/sql';
import { hashToken, newLinkToken } from '../auth/tokens';
import { Invitation } from '../entities/invitation';
import { Organization } from '../entities/organization';
import { User } from '../entities/user';
import { badRequest, conflict, forbidden, HttpError, notFound } from '../errors';
import type { AuditService } from './audit';
import type { MailService } from './mail';
import type { PasswordService } from './passwords';

/** An invitation link lasts a week (common practice: long enough to reach someone, short enough to go stale). */
export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60_000;

export const INVALID_INVITATION_LINK = 'This invitation link does not work any more: it was used already, withdrawn, or it expired. Ask your property manager for a new one.';

export interface InvitationsServiceDeps {
  dataSource: DataSource;
  clock: Clock;
  scope: Scope;
  audit: AuditService;
  mail: MailService;
  passwords: PasswordService;
  logger: Logger;
}

function statusOf(invitation: Invitation, now: Date): InvitationStatus {
  if (invitation.acceptedAt) return 'accepted';
  if (invitation.revokedAt) return 'revoked';
  return invitation.expiresAt <= now ? 'expired' : 'pending';
}

/**
 * A manager invites a contractor or a tenant (an admin may also invite a manager); the
 * invitee opens the e-mailed link, which works once and expires, and sets a password.
 */
export class InvitationsService {
  private readonly invitations: Repository<Invitation>;

  constructor(private readonly deps: InvitationsServiceDeps) {
    this.invitations = deps.dataSource.getRepository(Invitation);
  }

  async invite(actor: Actor, request: InviteRequest, ip: string | null): Promise<InvitationSummary> {
    const organizationId = this.organizationOf(actor);
    await this.assertMayInvite(actor, request);
    if (await this.emailTaken(this.deps.dataSource.manager, request.email)) throw conflict('An account with this e-mail address already exists.');
    const now = this.deps.clock.now();
    const link = newLinkToken();
    const invitation = await this.deps.dataSource.transaction(async (manager) => {
      // A new invitation replaces any earlier one to the same address in this organization.
      await manager.query(
        `UPDATE invitation SET revoked_at = $3 WHERE organization_id = $1 AND lower(email) = $2 AND accepted_at IS NULL AND revoked_at IS NULL`,
        [organizationId, request.email, now],
      );
      return manager.getRepository(Invitation).save({
        organizationId,
        email: request.email,
        displayName: request.displayName,
        role: request.role,
        isAdmin: request.role === 'manager' && !!request.isAdmin,
        unitId: request.role === 'tenant' ? (request.unitId ?? null) : null,
        tokenHash: link.tokenHash,
        invitedByUserId: actor.id,
        createdAt: now,
        expiresAt: new Date(now.getTime() + INVITATION_LIFETIME_MS),
      });
    });
    await this.sendInvitation(actor, invitation, link.token);
    await this.deps.audit.record({ action: 'invitation-sent', actor, targetType: 'invitation', targetId: invitation.id, ip, detail: { email: invitation.email, role: invitation.role, unitId: invitation.unitId } });
    return this.get(actor, invitation.id);
  }

  /** The organization's invitations, newest first (the last 200 is plenty for a screen). */
  async list(actor: Actor): Promise<InvitationSummary[]> {
    const rows = await this.withDetails().where('invitation.organization_id = :organizationId', { organizationId: this.organizationOf(actor) }).orderBy('invitation.created_at', 'DESC').take(200).getMany();
    const now = this.deps.clock.now();
    return rows.map((row) => this.toSummary(row, now));
  }

  async revoke(actor: Actor, invitationId: string, ip: string | null): Promise<void> {
    const invitation = await this.requireInvitation(actor, invitationId);
    if (invitation.acceptedAt) throw conflict('This invitation was accepted already; deactivate the account instead.');
    if (invitation.revokedAt) return;
    await this.invitations.update(invitation.id, { revokedAt: this.deps.clock.now() });
    await this.deps.audit.record({ action: 'invitation-revoked', actor, targetType: 'invitation', targetId: invitation.id, ip, detail: { email: invitation.email } });
  }

  /** What the accept page shows; the link is checked but not spent. */
  async preview(token: string): Promise<InvitationPreview> {
    const invitation = await this.withDetails()
      .where('invitation.token_hash = :tokenHash', { tokenHash: hashToken(token) })
      .getOne();
    if (!invitation || statusOf(invitation, this.deps.clock.now()) !== 'pending') throw badRequest(INVALID_INVITATION_LINK);
    return {
      email: invitation.email,
      displayName: invitation.displayName,
      role: invitation.role,
      organizationName: invitation.organization.name,
      unitLabel: invitation.unit?.label ?? null,
      propertyName: invitation.unit?.property?.name ?? null,
      expiresAt: invitation.expiresAt.toISOString(),
    };
  }

  /** Spends the link and creates the account, in one transaction so two clicks make one account. */
  async accept(token: string, password: string, displayName: string | undefined, ip: string | null): Promise<{ email: string }> {
    const now = this.deps.clock.now();
    const { invitation, userId } = await this.deps.dataSource.transaction(async (manager) => {
      const [row] = returnedRows<{ id: string }>(
        await manager.query(
          `UPDATE invitation SET accepted_at = $2
            WHERE token_hash = $1 AND accepted_at IS NULL AND revoked_at IS NULL AND expires_at > $2
          RETURNING id`,
          [hashToken(token), now],
        ),
      );
      if (!row) throw badRequest(INVALID_INVITATION_LINK);
      const spent = await manager.getRepository(Invitation).findOneByOrFail({ id: row.id });
      if (await this.emailTaken(manager, spent.email)) throw conflict('An account with this e-mail address already exists: sign in, or reset your password.');
      assertPasswordAcceptable(password, spent.email);
      const user = await manager.getRepository(User).save({
        email: spent.email,
        displayName: displayName ?? spent.displayName,
        role: spent.role,
        isAdmin: spent.isAdmin,
        organizationId: spent.organizationId,
        unitId: spent.unitId,
        passwordHash: await this.deps.passwords.hash(password),
      });
      await manager.getRepository(Invitation).update(spent.id, { acceptedUserId: user.id });
      return { invitation: spent, userId: user.id };
    });
    await this.deps.audit.record({ action: 'invitation-accepted', organizationId: invitation.organizationId, targetType: 'user', targetId: userId, ip, detail: { email: invitation.email, role: invitation.role, invitationId: invitation.id } });
    return { email: invitation.email };
  }

  /** Units a tenant can be invited to: the organization's, by property and label. */
  async unitOptions(actor: Actor): Promise<UnitOption[]> {
    const rows: { id: string; label: string; property_name: string }[] = await this.deps.dataSource.query(
      `SELECT u.id, u.label, p.name AS property_name
         FROM unit u JOIN property p ON p.id = u.property_id
        WHERE p.organization_id = $1 AND u.archived_at IS NULL AND p.archived_at IS NULL
        ORDER BY p.name, u.label`,
      [this.organizationOf(actor)],
    );
    return rows.map((row) => ({ id: row.id, label: row.label, propertyName: row.property_name }));
  }

  private async get(actor: Actor, invitationId: string): Promise<InvitationSummary> {
    return this.toSummary(await this.requireInvitation(actor, invitationId), this.deps.clock.now());
  }

  private async assertMayInvite(actor: Actor, request: InviteRequest): Promise<void> {
    if (request.role === 'manager' && !actor.isAdmin) throw forbidden('Only an administrator can invite a manager.');
    if (request.isAdmin && request.role !== 'manager') throw badRequest('invalid input', [{ path: 'isAdmin', message: 'only a manager can be an administrator' }]);
    if (request.role !== 'tenant' && request.unitId) throw badRequest('invalid input', [{ path: 'unitId', message: 'only a tenant has a unit' }]);
    if (request.role === 'tenant') await this.deps.scope.requireManagedUnit(actor, request.unitId as string);
  }

  private async sendInvitation(actor: Actor, invitation: Invitation, token: string): Promise<void> {
    const details = await this.withDetails().where('invitation.id = :id', { id: invitation.id }).getOneOrFail();
    try {
      await this.deps.mail.sendInvitation(invitation.email, {
        token,
        displayName: invitation.displayName,
        inviterName: actor.displayName,
        organizationName: details.organization.name,
        role: invitation.role,
        unitLabel: details.unit?.label ?? null,
        propertyName: details.unit?.property?.name ?? null,
        expiresAt: invitation.expiresAt,
      });
    } catch (error) {
      // An invitation nobody received must not linger as pending.
      await this.invitations.update(invitation.id, { revokedAt: this.deps.clock.now() });
      if (error instanceof HttpError) throw error;
      this.deps.logger.error({ err: error }, 'invitation e-mail not sent');
      throw new HttpError(502, 'The invitation e-mail could not be sent; try again in a moment.');
    }
  }

  /** Inviting is a manager's; the route says so too, this makes sure. */
  private organizationOf(actor: Actor): string {
    if (actor.role !== 'manager' || !actor.organizationId) throw forbidden('Only a manager invites people.');
    return actor.organizationId;
  }

  private async requireInvitation(actor: Actor, invitationId: string): Promise<Invitation> {
    const invitation = await this.withDetails()
      .where('invitation.id = :invitationId AND invitation.organization_id = :organizationId', { invitationId, organizationId: this.organizationOf(actor) })
      .getOne();
    if (!invitation) throw notFound('invitation');
    return invitation;
  }

  private emailTaken(manager: EntityManager, email: string): Promise<boolean> {
    return manager.getRepository(User).createQueryBuilder('user').where('lower(user.email) = :email', { email: email.toLowerCase() }).getExists();
  }

  private withDetails() {
    return this.invitations
      .createQueryBuilder('invitation')
      .innerJoinAndSelect('invitation.organization', 'organization')
      .leftJoinAndSelect('invitation.unit', 'unit')
      .leftJoinAndSelect('unit.property', 'property')
      .leftJoinAndSelect('invitation.invitedBy', 'invitedBy');
  }

  private toSummary(invitation: Invitation, now: Date): InvitationSummary {
    return {
      id: invitation.id,
      email: invitation.email,
      displayName: invitation.displayName,
      role: invitation.role,
      isAdmin: invitation.isAdmin,
      unit: invitation.unit ? { id: invitation.unit.id, label: invitation.unit.label, propertyName: invitation.unit.property?.name ?? '' } : null,
      invitedBy: invitation.invitedBy?.displayName ?? null,
      status: statusOf(invitation, now),
      createdAt: invitation.createdAt.toISOString(),
      expiresAt: invitation.expiresAt.toISOString(),
    };
  }
}
