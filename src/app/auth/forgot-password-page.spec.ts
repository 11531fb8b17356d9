import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { ForgotPasswordPage } from './forgot-password-page';
import { inputLabelled, settle } from '../../testing/form-fields';

describe('ForgotPasswordPage', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  it("asks for a link and shows the server's answer", async () => {
    const fixture = TestBed.createComponent(ForgotPasswordPage);
    fixture.detectChanges();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await inputLabelled(loader, 'E-mail address')).setValue('sam@example.com');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send the link' }))).click();
    const call = backend.expectOne('/api/auth/forgot-password');
    expect(call.request.body).toEqual({ email: 'sam@example.com' });
    call.flush({ message: 'If an account uses this address, a link to choose a new password is on its way.' }, { status: 202, statusText: 'Accepted' });
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="status"]')?.textContent).toContain('If an account uses this address');
  });

  it('shows a rate-limit refusal as it is', async () => {
    const fixture = TestBed.createComponent(ForgotPasswordPage);
    fixture.detectChanges();
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await inputLabelled(loader, 'E-mail address')).setValue('sam@example.com');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send the link' }))).click();
    backend.expectOne('/api/auth/forgot-password').flush({ error: 'Too many reset requests for this address. Check your inbox, or wait 60 minutes.' }, { status: 429, statusText: 'Too Many Requests' });
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Too many reset requests');
  });
});
