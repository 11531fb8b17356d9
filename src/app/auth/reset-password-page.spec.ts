import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { ActivatedRoute, provideRouter } from '@angular/router';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { ResetPasswordPage } from './reset-password-page';
import { inputLabelled, settle } from '../../testing/form-fields';

describe('ResetPasswordPage', () => {
  let backend: HttpTestingController;

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
    const fixture = TestBed.createComponent(ResetPasswordPage);
    fixture.detectChanges();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  afterEach(() => backend.verify());

  it('sends the token from the link fragment with the new password', async () => {
    const { fixture, loader, element } = setUp('tok_en-123');
    await (await inputLabelled(loader, 'New password')).setValue('a long new passphrase');
    await (await inputLabelled(loader, 'New password again')).setValue('a long new passphrase');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Set the password' }))).click();
    const call = backend.expectOne('/api/auth/reset-password');
    expect(call.request.body).toEqual({ token: 'tok_en-123', password: 'a long new passphrase' });
    call.flush(null, { status: 204, statusText: 'No Content' });
    await settle(fixture);
    expect(element.querySelector('[role="status"]')?.textContent).toContain('Your password is set');
  });

  it('checks the length rules and that both entries match before sending', async () => {
    const { loader, element, fixture } = setUp('tok_en-123');
    await (await inputLabelled(loader, 'New password')).setValue('short');
    await (await inputLabelled(loader, 'New password again')).setValue('different');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Set the password' }))).click();
    await settle(fixture);
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'New password' }));
    expect(await field.getTextErrors()).toEqual(['use at least 12 characters']);
    expect(element.textContent).toContain('The two passwords differ.');
    backend.expectNone('/api/auth/reset-password');
  });

  it('explains a spent or expired link and offers a new one', async () => {
    const { fixture, loader, element } = setUp('old-token-value');
    await (await inputLabelled(loader, 'New password')).setValue('a long new passphrase');
    await (await inputLabelled(loader, 'New password again')).setValue('a long new passphrase');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Set the password' }))).click();
    backend.expectOne('/api/auth/reset-password').flush({ error: 'This reset link does not work any more.' }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('This reset link does not work any more.');
    expect(element.querySelector('a[href="/forgot-password"]')).not.toBeNull();
  });

  it('says what to do when opened without a link', () => {
    const { element } = setUp(null);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('needs the link from the reset e-mail');
  });
});
