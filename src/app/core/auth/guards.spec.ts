import { provideHttpClient } from '@angular/common/http';
import { TestBed } from '@angular/core/testing';
import { type Route, Router, UrlSegment, UrlTree, provideRouter } from '@angular/router';
import type { SessionUser } from '../../../../shared/api/session';
import { adminGuard, roleGuard, signedInGuard, signedOutGuard } from './guards';
import { Session } from './session';

const manager: SessionUser = {
  id: 'm1',
  email: 'manager@example.com',
  displayName: 'Pat Manager',
  role: 'manager',
  isAdmin: false,
  organizationId: 'o1',
  unitId: null,
  temperatureUnit: 'F',
  timeZone: null,
};

describe('roleGuard', () => {
  let session: Session;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient()] });
    session = TestBed.inject(Session);
    router = TestBed.inject(Router);
  });

  const run = (segments: string[], ...roles: Parameters<typeof roleGuard>) =>
    TestBed.runInInjectionContext(() => roleGuard(...roles)({} as Route, segments.map((path) => new UrlSegment(path, {}))));

  it('lets a person with the role through', () => {
    session.set(manager);
    expect(run(['fleet'], 'manager')).toBeTrue();
  });

  it('sends a signed-out visitor to sign-in with the page as the return URL', () => {
    session.set(null);
    const result = run(['work-orders', '42'], 'manager') as UrlTree;
    expect(router.serializeUrl(result)).toBe('/sign-in?returnUrl=%2Fwork-orders%2F42');
  });

  it('sends a signed-in person without the role to their own start page', () => {
    session.set({ ...manager, role: 'tenant', unitId: 'u1' });
    const result = run(['fleet'], 'manager') as UrlTree;
    expect(router.serializeUrl(result)).toBe('/home');
  });
});

describe('signedInGuard, adminGuard, signedOutGuard', () => {
  let session: Session;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient()] });
    session = TestBed.inject(Session);
    router = TestBed.inject(Router);
  });

  const run = (guard: typeof signedInGuard, segments: string[]) => TestBed.runInInjectionContext(() => guard({} as Route, segments.map((path) => new UrlSegment(path, {}))));
  const url = (result: unknown) => router.serializeUrl(result as UrlTree);

  it('lets anyone signed in reach the profile, and sends others to sign-in', () => {
    session.set({ ...manager, role: 'contractor' });
    expect(run(signedInGuard, ['profile'])).toBeTrue();
    session.set(null);
    expect(url(run(signedInGuard, ['profile']))).toBe('/sign-in?returnUrl=%2Fprofile');
  });

  it('lets only an administrator manage users', () => {
    session.set({ ...manager, isAdmin: true });
    expect(run(adminGuard, ['users'])).toBeTrue();
    session.set(manager);
    expect(url(run(adminGuard, ['users']))).toBe('/fleet');
    session.set({ ...manager, role: 'tenant', isAdmin: true, unitId: 'u1' });
    expect(url(run(adminGuard, ['users']))).toBe('/home');
    session.set(null);
    expect(url(run(adminGuard, ['users']))).toBe('/sign-in?returnUrl=%2Fusers');
  });

  it('sends someone already signed in from the sign-in page to their start page', () => {
    session.set(null);
    expect(run(signedOutGuard, ['sign-in'])).toBeTrue();
    session.set({ ...manager, role: 'contractor' });
    expect(url(run(signedOutGuard, ['sign-in']))).toBe('/jobs');
  });
});
