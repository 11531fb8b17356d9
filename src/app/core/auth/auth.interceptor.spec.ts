import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';
import { apiErrorInterceptor } from '../http/api-error.interceptor';
import { authInterceptor } from './auth.interceptor';
import { safeReturnUrl } from './return-url';
import { Session } from './session';

describe('authInterceptor', () => {
  let http: HttpClient;
  let backend: HttpTestingController;
  let session: Session;
  let router: Router;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([authInterceptor, apiErrorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpClient);
    backend = TestBed.inject(HttpTestingController);
    session = TestBed.inject(Session);
    router = TestBed.inject(Router);
    session.set({ id: 'u1', email: 'pat@example.com', displayName: 'Pat', role: 'manager', isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null });
  });

  afterEach(() => backend.verify());

  it('sends credentials with API calls', () => {
    void firstValueFrom(http.get('/api/profile'));
    const call = backend.expectOne('/api/profile');
    expect(call.request.withCredentials).toBeTrue();
    call.flush({});
  });

  it('leaves other URLs alone', () => {
    void firstValueFrom(http.get('/assets/thing.json'));
    const call = backend.expectOne('/assets/thing.json');
    expect(call.request.withCredentials).toBeFalse();
    call.flush({});
  });

  it('forgets the user and goes to sign-in with the return URL when a session ends', async () => {
    spyOnProperty(router, 'url').and.returnValue('/work-orders/42?tab=parts');
    const navigate = spyOn(router, 'navigate').and.resolveTo(true);
    const failed = firstValueFrom(http.get('/api/work-orders/42')).then(
      () => ({ status: 200, message: '' }),
      (error: { status: number; message: string }) => error,
    );
    backend.expectOne('/api/work-orders/42').flush({ error: 'sign-in required' }, { status: 401, statusText: 'Unauthorized' });
    const error = await failed;
    expect(error.status).toBe(401);
    expect(error.message).toBe('sign-in required');
    expect(session.user()).toBeNull();
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/work-orders/42?tab=parts' } });
  });

  it('lets a failed sign-in through as a form error, without navigating', async () => {
    const navigate = spyOn(router, 'navigate');
    const failed = firstValueFrom(http.post('/api/auth/sign-in', {})).catch((error: unknown) => error);
    backend.expectOne('/api/auth/sign-in').flush({ error: 'The e-mail address or password is not correct.' }, { status: 401, statusText: 'Unauthorized' });
    await failed;
    expect(navigate).not.toHaveBeenCalled();
    expect(session.user()).not.toBeNull();
  });

  it('does not treat 403 or 404 as a lost session', async () => {
    const navigate = spyOn(router, 'navigate');
    const failed = firstValueFrom(http.get('/api/users')).catch((error: unknown) => error);
    backend.expectOne('/api/users').flush({ error: 'your account may not do this' }, { status: 403, statusText: 'Forbidden' });
    await failed;
    expect(navigate).not.toHaveBeenCalled();
  });
});

describe('safeReturnUrl', () => {
  it('keeps paths on this site and refuses the rest', () => {
    expect(safeReturnUrl('/fleet?property=2')).toBe('/fleet?property=2');
    expect(safeReturnUrl('//evil.example.com/x')).toBeNull();
    expect(safeReturnUrl('/\\evil.example.com')).toBeNull();
    expect(safeReturnUrl('https://evil.example.com')).toBeNull();
    expect(safeReturnUrl('/sign-in?returnUrl=%2Ffleet')).toBeNull();
    expect(safeReturnUrl(undefined)).toBeNull();
  });
});
