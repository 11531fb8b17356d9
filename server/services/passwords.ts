import bcrypt from 'bcryptjs';
import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';
import { toActor, type Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import { assertPasswordAcceptable } from '../auth/password-policy';
import { revokeSessions } from '../auth/session';
import { returnedRows } from '../auth/sql';
import { hashToken, newLinkToken } from '../auth/tokens';
import { PasswordReset } from '../entities/password-reset';
import { User } from '../entities/user';
import { badRequest, HttpError } from '../errors';
import type { AuditService } from './audit';
import type { MailService } from './mail';

/** bcrypt work factor: OWASP Password Storage Cheat Sheet asks for 10 or more; 11 is about 0.2 s here. */
export const DEFAULT_PASSWORD_HASH_ROUNDS = 11;

/** A reset link lasts an hour (common practice; the OWASP Forgot Password Cheat Sheet asks only for "short"). */
export const RESET_LINK_LIFETIME_MS = 60 * 60_000;

export const INVALID_RESET_LINK = 'This reset link does not work any more: it was used already, replaced by a newer one, or it expired. Ask for a new one.';

export interface PasswordServiceDeps {
  dataSource: DataSource;
  clock: Clock;
  rounds: number;
  mail: MailService;
  audit: AuditService;
  logger: Logger;
}

/** Password hashing, sign-in checks, reset links and password changes. */
export class PasswordService {
  private dummyHash: Promise<string> | null = null;

  constructor(private readonly deps: PasswordServiceDeps) {}

  hash(password: string): Promise<string> {
    return bcrypt.hash(password, this.deps.rounds);
  }

  /**
   * The active account with this e-mail and password, or null. An unknown address costs
   * the same bcrypt comparison as a wrong password, so timing does not tell them apart.
   */
  async verifyCredentials(email: string, password: string): Promise<Actor | null> {
    const user = await this.userWithHash(this.deps.dataSource.manager, { email });
    const hash = user?.passwordHash ?? (await this.fallbackHash());
    const matches = await bcrypt.compare(password, hash);
    if (!user || !matches || user.deactivatedAt || !user.passwordHash) return null;
    return toActor(user);
  }

  /** Sends a reset link if an active account has this address; says nothing either way. */
  async requestReset(email: string, ip: string | null): Promise<void> {
    const user = await this.userWithHash(this.deps.dataSource.manager, { email });
    if (!user || user.deactivatedAt) return;
    const now = this.deps.clock.now();
    const link = newLinkToken();
    const expiresAt = new Date(now.getTime() + RESET_LINK_LIFETIME_MS);
    await this.deps.dataSource.transaction(async (manager) => {
      // Only the newest link works: older unused ones are spent now.
      await manager.query('UPDATE password_reset SET used_at = $2 WHERE user_id = $1 AND used_at IS NULL', [user.id, now]);
      await manager.getRepository(PasswordReset).insert({ userId: user.id, tokenHash: link.tokenHash, createdAt: now, expiresAt });
    });
    await this.deps.audit.record({ action: 'password-reset-requested', organizationId: user.organizationId, targetType: 'user', targetId: user.id, ip });
    await this.deps.mail.sendPasswordReset(user.email, { token: link.token, displayName: user.displayName, expiresAt, timeZone: user.timeZone });
  }

  /** Spends a reset link (once, before it expires) to set a new password; signs the account out everywhere. */
  async resetWithToken(token: string, password: string, ip: string | null): Promise<void> {
    const now = this.deps.clock.now();
    const user = await this.deps.dataSource.transaction(async (manager) => {
      const [row] = returnedRows<{ user_id: string }>(
        await manager.query(
          `UPDATE password_reset SET used_at = $2
            WHERE token_hash = $1 AND used_at IS NULL AND expires_at > $2
          RETURNING user_id`,
          [hashToken(token), now],
        ),
      );
      const owner = row ? await manager.getRepository(User).findOneBy({ id: row.user_id }) : null;
      if (!owner || owner.deactivatedAt) throw badRequest(INVALID_RESET_LINK);
      assertPasswordAcceptable(password, owner.email);
      await manager.getRepository(User).update(owner.id, { passwordHash: await this.hash(password) });
      return owner;
    });
    await revokeSessions(this.deps.dataSource, user.id);
    await this.deps.audit.record({ action: 'password-reset', organizationId: user.organizationId, actor: null, targetType: 'user', targetId: user.id, ip });
    this.notifyPasswordChanged(user.email, user.displayName);
  }

  /** From the profile page: needs the current password; other sessions are signed out. */
  async changePassword(actor: Actor, currentPassword: string, newPassword: string, keepSessionId: string, ip: string | null): Promise<void> {
    const user = await this.userWithHash(this.deps.dataSource.manager, { id: actor.id });
    if (!user?.passwordHash || !(await bcrypt.compare(currentPassword, user.passwordHash))) {
      throw badRequest('invalid input', [{ path: 'currentPassword', message: 'your current password is not correct' }]);
    }
    assertPasswordAcceptable(newPassword, user.email, 'newPassword');
    if (await bcrypt.compare(newPassword, user.passwordHash)) {
      throw badRequest('invalid input', [{ path: 'newPassword', message: 'choose a password different from the current one' }]);
    }
    await this.deps.dataSource.getRepository(User).update(user.id, { passwordHash: await this.hash(newPassword) });
    await revokeSessions(this.deps.dataSource, user.id, keepSessionId);
    await this.deps.audit.record({ action: 'password-changed', actor, targetType: 'user', targetId: user.id, ip });
    this.notifyPasswordChanged(user.email, user.displayName);
  }

  /** Checks the current password (e-mail change); throws the same field error as a password change. */
  async assertCurrentPassword(actor: Actor, currentPassword: string): Promise<void> {
    const user = await this.userWithHash(this.deps.dataSource.manager, { id: actor.id });
    if (!user?.passwordHash || !(await bcrypt.compare(currentPassword, user.passwordHash))) {
      throw badRequest('invalid input', [{ path: 'currentPassword', message: 'your current password is not correct' }]);
    }
  }

  private notifyPasswordChanged(email: string, displayName: string): void {
    this.deps.mail.sendPasswordChanged(email, displayName).catch((error: unknown) => {
      if (!(error instanceof HttpError && error.status === 503)) this.deps.logger.warn({ err: error }, 'password-changed notice not sent');
    });
  }

  private userWithHash(manager: EntityManager, where: { email: string } | { id: string }): Promise<User | null> {
    const query = manager.getRepository(User).createQueryBuilder('user').addSelect('user.passwordHash');
    if ('email' in where) return query.where('lower(user.email) = :email', { email: where.email.toLowerCase() }).getOne();
    return query.where('user.id = :id', { id: where.id }).getOne();
  }

  private fallbackHash(): Promise<string> {
    this.dummyHash ??= bcrypt.hash('no account has this password', this.deps.rounds);
    return this.dummyHash;
  }
}
