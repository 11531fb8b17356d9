import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { InvitationPreview, SessionResponse } from '../../../../shared/api/auth';

/** The sign-in, reset and invitation endpoints: one typed method each. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  /** Who is signed in; also hands out the CSRF cookie the other calls need. */
  session(): Observable<SessionResponse> {
    return this.http.get<SessionResponse>('/api/auth/session');
  }

  signIn(email: string, password: string): Observable<SessionResponse> {
    return this.http.post<SessionResponse>('/api/auth/sign-in', { email, password });
  }

  signOut(): Observable<void> {
    return this.http.post<void>('/api/auth/sign-out', {});
  }

  forgotPassword(email: string): Observable<{ message: string }> {
    return this.http.post<{ message: string }>('/api/auth/forgot-password', { email });
  }

  resetPassword(token: string, password: string): Observable<void> {
    return this.http.post<void>('/api/auth/reset-password', { token, password });
  }

  previewInvitation(token: string): Observable<InvitationPreview> {
    return this.http.post<InvitationPreview>('/api/invitations/preview', { token });
  }

  acceptInvitation(token: string, password: string, displayName: string): Observable<{ email: string }> {
    return this.http.post<{ email: string }>('/api/invitations/accept', { token, password, displayName });
  }
}
