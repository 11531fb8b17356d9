import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Profile, UpdateProfileRequest } from '../../../shared/api/auth';

/** `/api/profile`: the signed-in person's own account. */
@Injectable({ providedIn: 'root' })
export class ProfileApi {
  private readonly http = inject(HttpClient);

  get(): Observable<Profile> {
    return this.http.get<Profile>('/api/profile');
  }

  update(changes: UpdateProfileRequest): Observable<Profile> {
    return this.http.patch<Profile>('/api/profile', changes);
  }

  changePassword(currentPassword: string, newPassword: string): Observable<void> {
    return this.http.post<void>('/api/profile/password', { currentPassword, newPassword });
  }

  changeEmail(email: string, currentPassword: string): Observable<Profile> {
    return this.http.post<Profile>('/api/profile/email', { email, currentPassword });
  }
}
