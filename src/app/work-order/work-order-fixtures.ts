/**
 * Invented work orders and the test setup for the job list and work-order page specs.
 * Only specs import this file.
 */
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding, type Routes } from '@angular/router';
import type { IncidentView } from '../../../shared/api/monitor';
import type { SessionUser } from '../../../shared/api/session';
import type { WorkOrderSummary, WorkOrderView } from '../../../shared/api/work-orders';
import { CAUSES, SAFETY_CAUTIONS } from '../../../shared/causes';
import type { Role } from '../../../shared/domain';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { EVENT_SOURCE_FACTORY } from '../core/live/live-events';

/** An EventSource the spec drives by hand. */
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

export function person(role: Role): SessionUser {
  const name = role === 'contractor' ? 'Robin Tech' : 'Dana Manager';
  return { id: `${role}-1`, email: `${role}@example.com`, displayName: name, role, isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null };
}

export function configureJobSpec(role: Role, routes: Routes = []): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [
      provideRouter(routes, withComponentInputBinding()),
      provideHttpClient(withInterceptors([apiErrorInterceptor])),
      provideHttpClientTesting(),
      { provide: EVENT_SOURCE_FACTORY, useValue: () => new FakeEventSource() as unknown as EventSource },
    ],
  });
  TestBed.inject(Session).set(person(role));
  return TestBed.inject(HttpTestingController);
}

export function jobSummary(n: number, extra: Partial<WorkOrderSummary> = {}): WorkOrderSummary {
  return {
    id: `w${n}`,
    serviceRequestId: `r${n}`,
    state: 'dispatched',
    priority: 'routine',
    title: `Fridge warming in unit ${n}B`,
    contractor: { id: 'c1', name: 'Frostline Repair' },
    property: { id: 'p1', name: 'Birch Court', address: '12 Example Lane, Millbrook, OR', timeZone: 'America/Los_Angeles' },
    unit: { id: `u${n}`, label: `${n}B` },
    applianceId: `a${n}`,
    dispatchedAt: '2026-03-02T15:00:00.000Z',
    dueAt: '2026-03-03T15:00:00.000Z',
    overdue: false,
    scheduledStartAt: null,
    scheduledEndAt: null,
    suspectedCause: null,
    accessWindows: [],
    petPresent: false,
    ...extra,
  };
}

export function incident(extra: Partial<IncidentView> = {}): IncidentView {
  return {
    id: 'i1', level: 'appliance', lane: 'repair', kind: 'warming-trend', kinds: ['warming-trend'], organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1',
    startedAt: '2026-03-02T08:00:00.000Z', openedAt: '2026-03-02T09:00:00.000Z', closedAt: null, severity: 'urgent', topCause: 'evaporator-fan',
    probableCauses: [{ code: 'defrost-system', confidence: 0.2 }, { code: 'evaporator-fan', confidence: 0.7 }], minutesAbove4c: 95, propertyIncidentId: null, applianceIds: [],
    ...extra,
  };
}

export function job(extra: Partial<WorkOrderView> = {}): WorkOrderView {
  const open = incident();
  return {
    ...jobSummary(1, { suspectedCause: 'evaporator-fan', accessWindows: [{ from: '2026-03-03T17:00:00Z', to: '2026-03-03T21:00:00Z' }], petPresent: true }),
    dispatchMethod: 'coverage-primary',
    acceptedAt: null,
    completedAt: null,
    verifiedAt: null,
    verificationDueAt: null,
    reopenedCount: 0,
    escalatedAt: null,
    causeFound: null,
    causeNote: null,
    findings: '',
    notes: '',
    appliance: { id: 'a1', style: 'top-freezer', model: 'TF-18', serial: 'SN-0042' },
    diagnosis: {
      incident: open,
      topCause: 'evaporator-fan',
      cause: CAUSES['evaporator-fan'],
      severity: 'urgent',
      historyFromMs: Date.parse(open.startedAt) - 12 * 3_600_000,
      historyToMs: Date.parse('2026-03-02T16:00:00Z'),
    },
    cautions: SAFETY_CAUTIONS,
    symptoms: ['fridge-not-cold'],
    visits: [],
    parts: [],
    labour: [],
    totals: { parts: { cents: 0, currency: 'USD' }, labour: { cents: 0, currency: 'USD' }, total: { cents: 0, currency: 'USD' } },
    costStatus: 'none',
    costNote: null,
    attachments: [],
    events: [{ at: '2026-03-02T15:00:00.000Z', actor: null, type: 'dispatched', fromState: null, toState: 'dispatched', detail: {} }],
    ...extra,
  };
}

/** Lets promise chains and timers of zero length run, then renders. */
export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let round = 0; round < 3; round++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
  fixture.detectChanges();
}
