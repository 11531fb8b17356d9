import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import type { SessionUser } from '../../../../shared/api/session';
import { apiErrorInterceptor } from '../http/api-error.interceptor';
import { Session } from './session';

const tenant: SessionUser = { id: 't1', email: 'sam@example.com', displayName: 'Sam', role: 'tenant', isAdmin: false, organizationId: 'o1', unitId: 'u1', temperatureUnit: 'C', timeZone: null };

describe('Session', () => {
  let session: Session;
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    session = TestBed.inject(Session);
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it('loads who is signed in from /api/auth/session', async () => {
    const loading = session.load();
    backend.expectOne('/api/auth/session').flush({ user: tenant });
    await loading;
    expect(session.user()).toEqual(tenant);
    expect(session.homePath()).toBe('/home');
    expect(session.hasRole('tenant')).toBeTrue();
    expect(session.isAdmin()).toBeFalse();
  });

  it('stays signed out when the server cannot be reached', async () => {
    const loading = session.load();
    backend.expectOne('/api/auth/session').error(new ProgressEvent('error'), { status: 0 });
    await loading;
    expect(session.signedIn()).toBeFalse();
    expect(session.homePath()).toBe('/sign-in');
  });

  it("signs in, or rejects with the server's message", async () => {
    const refused = session.signIn('sam@example.com', 'wrong').catch((error: Error) => error.message);
    backend.expectOne('/api/auth/sign-in').flush({ error: 'Too many failed sign-ins for this account. Wait 15 minutes, or reset your password.' }, { status: 429, statusText: 'Too Many Requests' });
    expect(await refused).toContain('Too many failed sign-ins');
    expect(session.signedIn()).toBeFalse();

    const signingIn = session.signIn('sam@example.com', 'right one');
    const call = backend.expectOne('/api/auth/sign-in');
    expect(call.request.body).toEqual({ email: 'sam@example.com', password: 'right one' });
    call.flush({ user: tenant });
    expect(await signingIn).toEqual(tenant);
    expect(session.user()?.unitId).toBe('u1');
  });

  it('signs out on the server, fetches a fresh anonymous session, and goes to sign-in', async () => {
    session.set(tenant);
    const navigate = spyOn(TestBed.inject(Router), 'navigateByUrl').and.resolveTo(true);
    const signingOut = session.signOut();
    backend.expectOne('/api/auth/sign-out').flush(null, { status: 204, statusText: 'No Content' });
    await Promise.resolve();
    await new Promise((resolve) => setTimeout(resolve));
    backend.expectOne('/api/auth/session').flush({ user: null });
    await signingOut;
    expect(session.user()).toBeNull();
    expect(navigate).toHaveBeenCalledWith('/sign-in');
  });
});
