/** Invented records for the tenant page's specs. Only specs import this file. */
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import type { SessionUser } from '../../../shared/api/session';
import type { FoodSafetyGuidance, TenantApplianceView, TenantHomeView } from '../../../shared/api/tenant';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { EVENT_SOURCE_FACTORY } from '../core/live/live-events';

export class FakeEventSource {
  static last: FakeEventSource | null = null;
  onmessage: ((event: MessageEvent<string>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  constructor() {
    FakeEventSource.last = this;
  }
  close(): void {}
  send(data: unknown): void {
    this.onmessage?.(new MessageEvent('message', { data: JSON.stringify(data) }));
  }
}

export const tenant: SessionUser = {
  id: 't1',
  email: 'robin@example.com',
  displayName: 'Robin Tenant',
  role: 'tenant',
  isAdmin: false,
  organizationId: 'o1',
  unitId: 'u1',
  temperatureUnit: 'F',
  timeZone: 'UTC',
};

export function configureHomeSpec(user: Partial<SessionUser> = {}): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [
      provideRouter([]),
      provideHttpClient(withInterceptors([apiErrorInterceptor])),
      provideHttpClientTesting(),
      { provide: EVENT_SOURCE_FACTORY, useValue: () => new FakeEventSource() as unknown as EventSource },
    ],
  });
  TestBed.inject(Session).set({ ...tenant, ...user });
  return TestBed.inject(HttpTestingController);
}

export const calmGuidance: FoodSafetyGuidance = { atRisk: false, minutesAbove4c: 0, headline: 'Cold: it is keeping your food at a safe temperature.', advice: [], sources: ['USDA FSIS.', 'Your local health authority has the final word on food safety.'] };

export function warmGuidance(minutesAbove4c: number): FoodSafetyGuidance {
  return {
    atRisk: true,
    minutesAbove4c,
    headline: `The fridge has been above 40 °F (4 °C) for a while.`,
    advice: ['Keep the doors closed as much as you can: a full freezer about 48 hours (about 24 hours half full).', 'Throw away perishable food that has been above 40 °F (4 °C) for more than 2 hours.'],
    sources: ['USDA Food Safety and Inspection Service (FSIS): "Keep Your Food Safe During Emergencies", "Refrigeration and Food Safety".', 'Your local health authority has the final word on food safety.'],
  };
}

export function request(extra: Partial<ServiceRequestView> = {}): ServiceRequestView {
  return {
    id: 'r1',
    level: 'appliance',
    source: 'monitor',
    status: 'open',
    priority: 'urgent',
    title: 'Fridge warming',
    description: '',
    symptoms: [],
    propertyId: 'p1',
    unitId: 'u1',
    applianceId: 'a1',
    openedAt: '2026-03-02T08:00:00.000Z',
    closedAt: null,
    closeReason: null,
    mergedIntoId: null,
    firstVisitFix: null,
    incident: null,
    progress: 'dispatched',
    workOrder: { id: 'w1', state: 'dispatched', contractorName: 'Brightcoil Repairs', scheduledStartAt: null, scheduledEndAt: null, dueAt: '2026-03-02T12:00:00.000Z' },
    reports: [],
    place: { propertyName: 'Maple Yard', timeZone: 'UTC', unitLabel: '4B', applianceLabel: 'top-freezer RT18' },
    ...extra,
  };
}

export function appliance(extra: Partial<TenantApplianceView> = {}): TenantApplianceView {
  return {
    id: 'a1',
    style: 'top-freezer',
    health: 'cold',
    healthText: 'Cold: it is keeping your food at a safe temperature.',
    freshFoodC: 3,
    freezerC: -18,
    lastReadingAt: '2026-03-02T09:50:00.000Z',
    guidance: calmGuidance,
    openRequest: null,
    ...extra,
  };
}

export function homeView(appliances: TenantApplianceView[] = [appliance()]): TenantHomeView {
  return { unit: { id: 'u1', label: '4B', propertyName: 'Maple Yard' }, appliances };
}

export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let round = 0; round < 3; round++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
  fixture.detectChanges();
}
