import { HttpClient } from '@angular/common/http';
import { Injectable, computed, inject, signal } from '@angular/core';
import { Router } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import type { Role } from '../../../../shared/domain';
import type { SessionUser } from '../../../../shared/api/session';

/** Where each role lands after sign-in. */
const HOME_BY_ROLE: Record<Role, string> = {
  manager: '/fleet',
  contractor: '/jobs',
  tenant: '/home',
};

/** The signed-in user, as signals for the view; loaded once at start-up. */
@Injectable({ providedIn: 'root' })
export class Session {
  private readonly http = inject(HttpClient);
  private readonly router = inject(Router);
  private readonly current = signal<SessionUser | null>(null);

  readonly user = this.current.asReadonly();
  readonly signedIn = computed(() => this.current() !== null);
  readonly role = computed(() => this.current()?.role ?? null);

  /** Reads the session from the server; a signed-out visitor (401) is not an error. */
  async load(): Promise<void> {
    try {
      const body = await firstValueFrom(this.http.get<{ user: SessionUser }>('/api/auth/me'));
      this.current.set(body.user);
    } catch {
      this.current.set(null);
    }
  }

  set(user: SessionUser | null): void {
    this.current.set(user);
  }

  /** Ends the session on the server, then forgets it here even if the server was unreachable. */
  async signOut(): Promise<void> {
    try {
      await firstValueFrom(this.http.post('/api/auth/sign-out', {}));
    } finally {
      this.current.set(null);
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
