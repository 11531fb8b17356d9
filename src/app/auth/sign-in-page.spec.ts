import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { Router, provideRouter } from '@angular/router';
import { inputLabelled, settle } from '../../testing/form-fields';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { SignInPage } from './sign-in-page';

const manager = { id: 'm1', email: 'pat@example.com', displayName: 'Pat', role: 'manager', isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null };

describe('SignInPage', () => {
  let backend: HttpTestingController;
  let navigate: jasmine.Spy;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
    navigate = spyOn(TestBed.inject(Router), 'navigateByUrl').and.resolveTo(true);
  });

  afterEach(() => backend.verify());

  async function render(inputs: Record<string, string> = {}) {
    const fixture = TestBed.createComponent(SignInPage);
    for (const [name, value] of Object.entries(inputs)) fixture.componentRef.setInput(name, value);
    fixture.detectChanges();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  async function signIn(loader: HarnessLoader, email: string, password: string) {
    await (await inputLabelled(loader, 'E-mail address')).setValue(email);
    await (await inputLabelled(loader, 'Password')).setValue(password);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
  }

  it('signs in and goes to the page asked for', async () => {
    const { fixture, loader } = await render({ returnUrl: '/work-orders/42' });
    await signIn(loader, 'pat@example.com', 'correct horse battery');
    const call = backend.expectOne('/api/auth/sign-in');
    expect(call.request.body).toEqual({ email: 'pat@example.com', password: 'correct horse battery' });
    call.flush({ user: manager });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith('/work-orders/42');
  });

  it("goes to the role's start page when the return URL points elsewhere", async () => {
    const { fixture, loader } = await render({ returnUrl: '//evil.example.com/steal' });
    await signIn(loader, 'pat@example.com', 'correct horse battery');
    backend.expectOne('/api/auth/sign-in').flush({ user: manager });
    await settle(fixture);
    expect(navigate).toHaveBeenCalledWith('/fleet');
  });

  it("shows the server's message and clears the password when sign-in is refused", async () => {
    const { fixture, loader, element } = await render();
    await signIn(loader, 'pat@example.com', 'wrong');
    backend.expectOne('/api/auth/sign-in').flush({ error: 'The e-mail address or password is not correct.' }, { status: 401, statusText: 'Unauthorized' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The e-mail address or password is not correct.');
    expect(await (await inputLabelled(loader, 'Password')).getValue()).toBe('');
    expect(navigate).not.toHaveBeenCalled();
  });

  it('sends nothing while the form is incomplete', async () => {
    const { loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue('not an address');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Sign in' }))).click();
    backend.expectNone('/api/auth/sign-in');
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'E-mail address' }));
    expect(await field.getTextErrors()).toEqual(['Enter a valid e-mail address']);
  });

  it('fills in the address and welcomes someone who just accepted an invitation', async () => {
    const { loader, element } = await render({ email: 'new.tenant@example.com', welcome: '1' });
    expect(await (await inputLabelled(loader, 'E-mail address')).getValue()).toBe('new.tenant@example.com');
    expect(element.querySelector('[role="status"]')?.textContent).toContain('Your account is ready');
  });
});
