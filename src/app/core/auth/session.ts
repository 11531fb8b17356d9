import { Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { SessionUser } from '../../../../shared/api/session';
import type { Role } from '../../../../shared/domain';
import { AuthApi } from './auth-api';

/** Where each role lands after sign-in. */
const HOME_BY_ROLE: Record<Role, string> = {
  manager: '/fleet',
  contractor: '/jobs',
  tenant: '/home',
};

/**
 * The signed-in user, as signals for the view. Loaded once at start-up, which also gives
 * the browser its CSRF cookie; the server remains the judge of every request.
 */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly api = inject(AuthApi);
  private readonly router = inject(Router);
  private readonly current = signal<SessionUser | null>(null);

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  readonly role = computed(() => this.current()?.role ?? null);
  readonly isAdmin = computed(() => this.current()?.isAdmin === true);

  /** Reads the session from the server; an unreachable server leaves the visitor signed out. */
  async load(): Promise<void> {
    try {
      const body = await firstValueFrom(this.api.session());
      this.current.set(body.user);
    } catch {
      this.current.set(null);
    }
  }

  /** Signs in; rejects with the server's message (wrong credentials, too many attempts). */
  async signIn(email: string, password: string): Promise<SessionUser> {
    const body = await firstValueFrom(this.api.signIn(email, password));
    if (!body.user) throw new Error('The server did not sign you in.');
    this.current.set(body.user);
    return body.user;
  }

  set(user: SessionUser | null): void {
    this.current.set(user);
  }

  /** Merges changed profile fields (name, units, time zone) into the session. */
  update(changes: Partial<SessionUser>): void {
    this.current.update((user) => (user ? { ...user, ...changes } : user));
  }

  /** Ends the session on the server, then forgets it here even if the server was unreachable. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.api.signOut());
    } finally {
      this.current.set(null);
      await this.load(); // a fresh anonymous session and CSRF cookie for the next sign-in
      await this.router.navigateByUrl('/sign-in');
    }
  }

  hasRole(...roles: Role[]): boolean {
    const role = this.role();
    return role !== null && roles.includes(role);
  }

  homePath(): string {
    const role = this.role();
    return role ? HOME_BY_ROLE[role] : '/sign-in';
  }
}
