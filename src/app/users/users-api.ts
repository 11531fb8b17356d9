import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ChangeUserRequest, InvitationSummary, InviteRequest, Page, UnitOption, UserQueryInput, UserSummary } from '../../../shared/api/users';

function toParams(query: UserQueryInput): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) if (value !== undefined && value !== null && value !== '') params = params.set(key, String(value));
  return params;
}

/** `/api/users` and `/api/invitations`: an administrator's user management. */
@Injectable({ providedIn: 'root' })
export class UsersApi {
  private readonly http = inject(HttpClient);

  list(query: UserQueryInput): Observable<Page<UserSummary>> {
    return this.http.get<Page<UserSummary>>('/api/users', { params: toParams(query) });
  }

  change(userId: string, change: ChangeUserRequest): Observable<UserSummary> {
    return this.http.patch<UserSummary>(`/api/users/${encodeURIComponent(userId)}`, change);
  }

  deactivate(userId: string): Observable<UserSummary> {
    return this.http.post<UserSummary>(`/api/users/${encodeURIComponent(userId)}/deactivate`, {});
  }

  reactivate(userId: string): Observable<UserSummary> {
    return this.http.post<UserSummary>(`/api/users/${encodeURIComponent(userId)}/reactivate`, {});
  }

  invitations(): Observable<InvitationSummary[]> {
    return this.http.get<InvitationSummary[]>('/api/invitations');
  }

  invite(invitation: InviteRequest): Observable<InvitationSummary> {
    return this.http.post<InvitationSummary>('/api/invitations', invitation);
  }

  withdraw(invitationId: string): Observable<void> {
    return this.http.delete<void>(`/api/invitations/${encodeURIComponent(invitationId)}`);
  }

  unitOptions(): Observable<UnitOption[]> {
    return this.http.get<UnitOption[]>('/api/invitations/unit-options');
  }
}
