import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { ActivatedRoute, Router, provideRouter } from '@angular/router';
import type { InvitationPreview } from '../../../shared/api/auth';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { AcceptInvitationPage } from './accept-invitation-page';
import { inputLabelled, settle } from '../../testing/form-fields';

const preview: InvitationPreview = {
  email: 'new.tenant@example.com',
  displayName: 'Robin Tenant',
  role: 'tenant',
  organizationName: 'Maplewood Homes',
  unitLabel: '2C',
  propertyName: 'Cedar Row',
  expiresAt: '2026-03-09T15:00:00.000Z',
};

describe('AcceptInvitationPage', () => {
  let backend: HttpTestingController;
  let navigateByUrl: jasmine.Spy;

  function setUp(fragment: string | null) {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: ActivatedRoute, useValue: { snapshot: { fragment } } },
      ],
    });
    backend = TestBed.inject(HttpTestingController);
    navigateByUrl = spyOn(TestBed.inject(Router), 'navigateByUrl').and.resolveTo(true);
    const fixture = TestBed.createComponent(AcceptInvitationPage);
    fixture.detectChanges();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => backend.verify());

  it('shows the invitation, creates the account and signs the new tenant in', async () => {
    const { fixture, loader, element } = setUp('invite-token-123456');
    const previewCall = backend.expectOne('/api/invitations/preview');
    expect(previewCall.request.body).toEqual({ token: 'invite-token-123456' });
    previewCall.flush(preview);
    await settle(fixture);
    expect(element.querySelector('.invitation-summary')?.textContent).toContain('Maplewood Homes invited new.tenant@example.com as a tenant of unit 2C at Cedar Row.');
    expect(await (await inputLabelled(loader, 'Your name')).getValue()).toBe('Robin Tenant');

    await (await inputLabelled(loader, 'Password')).setValue('my own passphrase');
    await (await inputLabelled(loader, 'Password again')).setValue('my own passphrase');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Create my account' }))).click();
    const accept = backend.expectOne('/api/invitations/accept');
    expect(accept.request.body).toEqual({ token: 'invite-token-123456', password: 'my own passphrase', displayName: 'Robin Tenant' });
    accept.flush({ email: preview.email }, { status: 201, statusText: 'Created' });
    await settle(fixture);
    const signIn = backend.expectOne('/api/auth/sign-in');
    expect(signIn.request.body).toEqual({ email: preview.email, password: 'my own passphrase' });
    signIn.flush({ user: { id: 'n1', email: preview.email, displayName: 'Robin Tenant', role: 'tenant', isAdmin: false, organizationId: 'o1', unitId: 'u2', temperatureUnit: 'F', timeZone: null } });
    await settle(fixture);
    expect(navigateByUrl).toHaveBeenCalledWith('/home');
  });

  it('explains a link that no longer works', async () => {
    const { fixture, element } = setUp('spent-token-1234567');
    backend.expectOne('/api/invitations/preview').flush({ error: 'This invitation link does not work any more.' }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('This invitation link does not work any more.');
    expect(element.querySelector('form')).toBeNull();
  });

  it("shows the server's reason when the password is refused", async () => {
    const { fixture, loader, element } = setUp('invite-token-123456');
    backend.expectOne('/api/invitations/preview').flush(preview);
    await settle(fixture);
    await (await inputLabelled(loader, 'Password')).setValue('password1234');
    await (await inputLabelled(loader, 'Password again')).setValue('password1234');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Create my account' }))).click();
    backend
      .expectOne('/api/invitations/accept')
      .flush({ error: 'invalid input', details: [{ path: 'password', message: 'this password is too common; choose another' }] }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('this password is too common');
  });
});
