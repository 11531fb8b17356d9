/**
 * Test helpers of the manager's table and request specs: providers with a fake live
 * feed, a settle helper and invented records. Only specs import this file.
 */
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding, type Routes } from '@angular/router';
import type { IncidentListItem } from '../../../../shared/api/monitor';
import type { ServiceRequestView } from '../../../../shared/api/service-requests';
import type { SessionUser } from '../../../../shared/api/session';
import type { Page } from '../../../../shared/api/users';
import type { WorkOrderSummary } from '../../../../shared/api/work-orders';
import { Session } from '../../core/auth/session';
import { apiErrorInterceptor } from '../../core/http/api-error.interceptor';
import { EVENT_SOURCE_FACTORY } from '../../core/live/live-events';
import { SAVE_FILE } from './csv-download';

export class FakeEventSource {
  static last: FakeEventSource | null = null;
  onmessage: ((event: MessageEvent<string>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  constructor(readonly url: string) {
    FakeEventSource.last = this;
  }
  close(): void {}
  send(data: unknown): void {
    this.onmessage?.(new MessageEvent('message', { data: JSON.stringify(data) }));
  }
}

export interface SavedFile {
  blob: Blob;
  fileName: string;
}

export function configureTableSpec(routes: Routes, user: Partial<SessionUser> = {}): { http: HttpTestingController; saved: SavedFile[] } {
  const saved: SavedFile[] = [];
  localStorage.clear();
  TestBed.configureTestingModule({
    providers: [
      provideRouter(routes, withComponentInputBinding()),
      provideHttpClient(withInterceptors([apiErrorInterceptor])),
      provideHttpClientTesting(),
      { provide: EVENT_SOURCE_FACTORY, useValue: (url: string) => new FakeEventSource(url) as unknown as EventSource },
      { provide: SAVE_FILE, useValue: (blob: Blob, fileName: string) => saved.push({ blob, fileName }) },
    ],
  });
  TestBed.inject(Session).set({
    id: 'manager-1',
    email: 'dana@example.com',
    displayName: 'Dana Manager',
    role: 'manager',
    isAdmin: false,
    organizationId: 'org-1',
    unitId: null,
    temperatureUnit: 'F',
    timeZone: 'America/Chicago',
    ...user,
  });
  return { http: TestBed.inject(HttpTestingController), saved };
}

export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let i = 0; i < 3; i++) await new Promise((resolve) => setTimeout(resolve));
  fixture.detectChanges();
  await fixture.whenStable();
}

export function page<T>(items: T[], total = items.length, pageIndex = 0, pageSize = 25): Page<T> {
  return { items, total, page: pageIndex, pageSize };
}

const PLACE = { propertyName: 'Linden Court', timeZone: 'America/Denver', unitLabel: '2B', applianceLabel: 'top-freezer RT18' };

export function incident(n: number, extra: Partial<IncidentListItem> = {}): IncidentListItem {
  return {
    id: `i${n}`,
    level: 'appliance',
    lane: 'repair',
    kind: 'no-cooling',
    kinds: ['no-cooling'],
    organizationId: 'org-1',
    propertyId: 'p1',
    unitId: 'u1',
    applianceId: `a${n}`,
    startedAt: '2026-11-02T15:00:00.000Z',
    openedAt: '2026-11-02T15:30:00.000Z',
    closedAt: null,
    severity: 'critical',
    topCause: 'compressor-start',
    probableCauses: [{ code: 'compressor-start', confidence: 0.7 }],
    minutesAbove4c: 180,
    propertyIncidentId: null,
    applianceIds: [],
    place: { ...PLACE },
    ...extra,
  };
}

export function request(n: number, extra: Partial<ServiceRequestView> = {}): ServiceRequestView {
  return {
    id: `r${n}`,
    level: 'appliance',
    source: 'monitor',
    status: 'open',
    priority: 'urgent',
    title: `Fridge not cooling ${n}`,
    description: '',
    symptoms: ['warm inside'],
    propertyId: 'p1',
    unitId: 'u1',
    applianceId: `a${n}`,
    openedAt: '2026-11-02T16:00:00.000Z',
    closedAt: null,
    closeReason: null,
    mergedIntoId: null,
    firstVisitFix: null,
    incident: null,
    progress: 'received',
    workOrder: null,
    place: { ...PLACE },
    reports: [],
    ...extra,
  };
}

export function workOrder(n: number, extra: Partial<WorkOrderSummary> = {}): WorkOrderSummary {
  return {
    id: `w${n}`,
    serviceRequestId: `r${n}`,
    state: 'dispatched',
    priority: 'urgent',
    title: `Fridge not cooling ${n}`,
    contractor: { id: 'c1', name: 'Frostline Repair' },
    property: { id: 'p1', name: 'Linden Court', address: '1 Example Way', timeZone: 'America/Denver' },
    unit: { id: 'u1', label: '2B' },
    applianceId: `a${n}`,
    dispatchedAt: '2026-11-02T16:00:00.000Z',
    dueAt: '2026-11-02T20:00:00.000Z',
    overdue: false,
    scheduledStartAt: null,
    scheduledEndAt: null,
    suspectedCause: null,
    accessWindows: [],
    petPresent: false,
    ...extra,
  };
}
