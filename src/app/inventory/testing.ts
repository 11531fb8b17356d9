/**
 * Test helpers of the inventory, logger-file and settings specs: providers and invented
 * records. Only specs import this file.
 */
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, type Routes } from '@angular/router';
import type { ApplianceView, Page, PropertyView, SensorView, UnitView } from '../../../shared/api/inventory';
import type { SessionUser } from '../../../shared/api/session';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';

export function configureSpec(options: { routes?: Routes; user?: Partial<SessionUser> } = {}): HttpTestingController {
  TestBed.configureTestingModule({
    providers: [provideRouter(options.routes ?? []), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()],
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
    timeZone: 'UTC',
    ...options.user,
  });
  return TestBed.inject(HttpTestingController);
}

export function page<T>(items: T[], total = items.length, pageIndex = 0, pageSize = 25): Page<T> {
  return { items, total, page: pageIndex, pageSize };
}

export function property(n: number, extra: Partial<PropertyView> = {}): PropertyView {
  return {
    id: `p${n}`,
    name: `Linden Court ${n}`,
    addressLine1: `${n} Example Road`,
    addressLine2: null,
    city: 'Springfield',
    region: 'IL',
    postalCode: '62701',
    country: 'US',
    timeZone: 'America/Chicago',
    archivedAt: null,
    createdAt: '2026-01-01T00:00:00.000Z',
    unitCount: 3,
    applianceCount: 2,
    sensorCount: 1,
    ...extra,
  };
}

export function appliance(n: number, extra: Partial<ApplianceView> = {}): ApplianceView {
  return {
    id: `a${n}`,
    unitId: `u${n}`,
    unitLabel: `${n}A`,
    propertyId: 'p1',
    propertyName: 'Linden Court 1',
    style: 'top-freezer',
    model: `TF-${n}`,
    serial: `SN-${n}`,
    installedOn: '2021-04-12',
    warrantyEndsOn: null,
    archivedAt: null,
    createdAt: '2026-01-01T00:00:00.000Z',
    sensor: null,
    ...extra,
  };
}

export function unit(n: number, appliances: ApplianceView[] = [], extra: Partial<UnitView> = {}): UnitView {
  return { id: `u${n}`, propertyId: 'p1', label: `${n}A`, floor: n, archivedAt: null, createdAt: '2026-01-01T00:00:00.000Z', appliances, ...extra };
}

export function sensor(n: number, extra: Partial<SensorView> = {}): SensorView {
  return {
    id: `s${n}`,
    deviceId: `cw-00000000000${n}`,
    applianceId: `a${n}`,
    intervalSeconds: 300,
    lastSeenAt: null,
    lastHeardAt: null,
    style: 'top-freezer',
    unitLabel: `${n}A`,
    propertyName: 'Linden Court 1',
    archivedAt: null,
    createdAt: '2026-01-01T00:00:00.000Z',
    ...extra,
  };
}

/** Lets promise chains started by a click or a flushed response run, then renders. */
export async function settle(fixture: { whenStable(): Promise<unknown>; detectChanges(): void }): Promise<void> {
  for (let round = 0; round < 3; round++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
  fixture.detectChanges();
}
