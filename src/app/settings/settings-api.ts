import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { DetectionOverrides, DetectionSettingsView } from '../../../shared/api/settings';
import type { NotificationPreferenceView, OrgSettingsView, UpdateOrgSettingsRequest } from '../../../shared/api/work-orders';
import type { ApplianceStyle } from '../../../shared/domain';

/**
 * The settings page's endpoints: detection thresholds per appliance style
 * (`/api/settings/detection`), the organization's work-order settings (`/api/org-settings`)
 * and the signed-in person's e-mail choice (`/api/notification-preferences`).
 */
@Injectable({ providedIn: 'root' })
export class SettingsApi {
  private readonly http = inject(HttpClient);

  detection(): Observable<DetectionSettingsView> {
    return this.http.get<DetectionSettingsView>('/api/settings/detection');
  }

  replaceDetection(style: ApplianceStyle, overrides: DetectionOverrides): Observable<DetectionSettingsView> {
    return this.http.put<DetectionSettingsView>(`/api/settings/detection/${style}`, overrides);
  }

  resetDetection(style: ApplianceStyle): Observable<DetectionSettingsView> {
    return this.http.delete<DetectionSettingsView>(`/api/settings/detection/${style}`);
  }

  orgSettings(): Observable<OrgSettingsView> {
    return this.http.get<OrgSettingsView>('/api/org-settings');
  }

  updateOrgSettings(change: UpdateOrgSettingsRequest): Observable<OrgSettingsView> {
    return this.http.patch<OrgSettingsView>('/api/org-settings', change);
  }

  notificationPreference(): Observable<NotificationPreferenceView> {
    return this.http.get<NotificationPreferenceView>('/api/notification-preferences');
  }

  setNotificationPreference(preference: NotificationPreferenceView): Observable<NotificationPreferenceView> {
    return this.http.put<NotificationPreferenceView>('/api/notification-preferences', preference);
  }
}
