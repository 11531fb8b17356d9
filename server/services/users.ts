import type { Logger } from 'pino';
import type { DataSource, Repository } from 'typeorm';
import type { Profile, UpdateProfileRequest } from '../../shared/api/auth';
import type { ChangeUserRequest, Page, UserQuery, UserSummary } from '../../shared/api/users';
import { toActor, type Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import type { Scope } from '../auth/scope';
import { revokeSessions } from '../auth/session';
import { Organization } from '../entities/organization';
import { User } from '../entities/user';
import { badRequest, conflict, forbidden, notFound } from '../errors';
import type { AuditService } from './audit';
import type { MailService } from './mail';
import type { PasswordService } from './passwords';

export interface UsersServiceDeps {
  dataSource: DataSource;
  clock: Clock;
  scope: Scope;
  audit: AuditService;
  mail: MailService;
  passwords: PasswordService;
  logger: Logger;
}

const SORT_COLUMNS: Record<UserQuery['sort'], string> = {
  displayName: 'user.displayName',
  email: 'user.email',
  role: 'user.role',
  createdAt: 'user.createdAt',
};

function likePattern(text: string): string {
  return `%${text.replace(/[\\%_]/g, (char) => `\\${char}`)}%`;
}

export function toUserSummary(user: User): UserSummary {
  return {
    id: user.id,
    email: user.email,
    displayName: user.displayName,
    role: user.role,
    isAdmin: user.isAdmin,
    phone: user.phone,
    unit: user.unit ? { id: user.unit.id, label: user.unit.label, propertyName: user.unit.property?.name ?? '' } : null,
    deactivatedAt: user.deactivatedAt?.toISOString() ?? null,
    createdAt: user.createdAt.toISOString(),
  };
}

/**
 * Accounts of an organization (admin user management) and each person's own profile.
 * Every lookup is bounded by the actor's organization: another organization's user is
 * "not found".
 */
export class UsersService {
  private readonly users: Repository<User>;

  constructor(private readonly deps: UsersServiceDeps) {
    this.users = deps.dataSource.getRepository(User);
  }

  /** For the session: the active user behind a session, or null once deactivated or gone. */
  async actorById(userId: string): Promise<Actor | null> {
    const user = await this.users.findOneBy({ id: userId });
    return user && !user.deactivatedAt ? toActor(user) : null;
  }

  async list(actor: Actor, query: UserQuery): Promise<Page<UserSummary>> {
    const organizationId = this.administeredOrganization(actor);
    const builder = this.withUnit().where('user.organization_id = :organizationId', { organizationId });
    if (query.q) builder.andWhere('(user.display_name ILIKE :q OR user.email ILIKE :q)', { q: likePattern(query.q) });
    if (query.role) builder.andWhere('user.role = :role', { role: query.role });
    if (query.status === 'active') builder.andWhere('user.deactivated_at IS NULL');
    if (query.status === 'deactivated') builder.andWhere('user.deactivated_at IS NOT NULL');
    builder
      .orderBy(SORT_COLUMNS[query.sort], query.direction === 'asc' ? 'ASC' : 'DESC')
      .addOrderBy('user.id', 'ASC')
      .skip(query.page * query.pageSize)
      .take(query.pageSize);
    const [users, total] = await builder.getManyAndCount();
    return { items: users.map(toUserSummary), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, userId: string): Promise<UserSummary> {
    return toUserSummary(await this.requireUser(actor, userId));
  }

  /** Role, unit and admin flag. Nobody changes their own, so an organization always keeps an admin. */
  async change(actor: Actor, userId: string, change: ChangeUserRequest, ip: string | null): Promise<UserSummary> {
    const target = await this.requireUser(actor, userId);
    if (target.id === actor.id) throw conflict('You cannot change your own role or admin flag; ask another administrator.');
    const next = await this.nextRoleOf(actor, target, change);
    const before = { role: target.role, isAdmin: target.isAdmin, unitId: target.unitId };
    await this.users.update(target.id, next);
    await this.deps.audit.record({ action: 'role-changed', actor, targetType: 'user', targetId: target.id, ip, detail: { email: target.email, from: before, to: next } });
    return this.get(actor, userId);
  }

  async deactivate(actor: Actor, userId: string, ip: string | null): Promise<UserSummary> {
    const target = await this.requireUser(actor, userId);
    if (target.id === actor.id) throw conflict('You cannot deactivate your own account; ask another administrator.');
    if (!target.deactivatedAt) {
      await this.users.update(target.id, { deactivatedAt: this.deps.clock.now() });
      await revokeSessions(this.deps.dataSource, target.id);
      await this.deps.audit.record({ action: 'user-deactivated', actor, targetType: 'user', targetId: target.id, ip, detail: { email: target.email } });
    }
    return this.get(actor, userId);
  }

  async reactivate(actor: Actor, userId: string, ip: string | null): Promise<UserSummary> {
    const target = await this.requireUser(actor, userId);
    if (target.deactivatedAt) {
      await this.users.update(target.id, { deactivatedAt: null });
      await this.deps.audit.record({ action: 'user-reactivated', actor, targetType: 'user', targetId: target.id, ip, detail: { email: target.email } });
    }
    return this.get(actor, userId);
  }

  async profile(actor: Actor): Promise<Profile> {
    const user = await this.withUnit().where('user.id = :id', { id: actor.id }).getOne();
    if (!user) throw notFound('user');
    const organization = user.organizationId ? await this.deps.dataSource.getRepository(Organization).findOneBy({ id: user.organizationId }) : null;
    const summary = toUserSummary(user);
    return { ...toActor(user), phone: user.phone, organizationName: organization?.name ?? null, unit: user.role === 'tenant' ? summary.unit : null };
  }

  async updateProfile(actor: Actor, changes: UpdateProfileRequest): Promise<Profile> {
    if (Object.keys(changes).length > 0) await this.users.update(actor.id, changes);
    return this.profile(actor);
  }

  /** Needs the current password; the old address is told, in case it was not the owner. */
  async changeEmail(actor: Actor, email: string, currentPassword: string, ip: string | null): Promise<Profile> {
    await this.deps.passwords.assertCurrentPassword(actor, currentPassword);
    if (email === actor.email.toLowerCase()) return this.profile(actor);
    const taken = await this.users.createQueryBuilder('user').where('lower(user.email) = :email', { email }).getExists();
    if (taken) throw conflict('Another account already uses this e-mail address.');
    await this.users.update(actor.id, { email });
    await this.deps.audit.record({ action: 'email-changed', actor, targetType: 'user', targetId: actor.id, ip, detail: { from: actor.email, to: email } });
    this.deps.mail.sendEmailChanged(actor.email, actor.displayName, email).catch((error: unknown) => this.deps.logger.warn({ err: error }, 'e-mail change notice not sent'));
    return this.profile({ ...actor, email });
  }

  private withUnit() {
    return this.users.createQueryBuilder('user').leftJoinAndSelect('user.unit', 'unit').leftJoinAndSelect('unit.property', 'property');
  }

  /** User management is for an organization's administrators; the route says so too, this makes sure. */
  private administeredOrganization(actor: Actor): string {
    if (actor.role !== 'manager' || !actor.isAdmin || !actor.organizationId) throw forbidden('Only an administrator manages users.');
    return actor.organizationId;
  }

  private async requireUser(actor: Actor, userId: string): Promise<User> {
    const organizationId = this.administeredOrganization(actor);
    const user = await this.withUnit().where('user.id = :userId AND user.organization_id = :organizationId', { userId, organizationId }).getOne();
    if (!user) throw notFound('user');
    return user;
  }

  private async nextRoleOf(actor: Actor, target: User, change: ChangeUserRequest): Promise<Pick<User, 'role' | 'isAdmin' | 'unitId'>> {
    const role = change.role ?? target.role;
    if (role !== 'tenant' && change.unitId) throw badRequest('invalid input', [{ path: 'unitId', message: 'only a tenant has a unit' }]);
    if (role !== 'manager' && change.isAdmin) throw badRequest('invalid input', [{ path: 'isAdmin', message: 'only a manager can be an administrator' }]);
    const unitId = role === 'tenant' ? (change.unitId !== undefined ? change.unitId : target.unitId) : null;
    if (role === 'tenant') {
      if (!unitId) throw badRequest('invalid input', [{ path: 'unitId', message: 'choose the unit the tenant lives in' }]);
      await this.deps.scope.requireManagedUnit(actor, unitId);
    }
    return { role, unitId, isAdmin: role === 'manager' ? (change.isAdmin ?? target.isAdmin) : false };
  }
}
