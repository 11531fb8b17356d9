import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { provideRouter } from '@angular/router';
import type { Profile } from '../../../shared/api/auth';
import { inputLabelled, settle } from '../../testing/form-fields';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { ProfilePage } from './profile-page';

const profile: Profile = {
  id: 't1',
  email: 'sam@example.com',
  displayName: 'Sam Tenant',
  role: 'tenant',
  isAdmin: false,
  organizationId: 'o1',
  unitId: 'u1',
  temperatureUnit: 'F',
  timeZone: null,
  phone: '555-0101',
  organizationName: 'Maplewood Homes',
  unit: { id: 'u1', label: '2C', propertyName: 'Cedar Row' },
};

describe('ProfilePage', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
    TestBed.inject(Session).set({ ...profile });
  });

  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(ProfilePage);
    fixture.detectChanges();
    backend.expectOne('/api/profile').flush(profile);
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const inSection = (name: string): Promise<HarnessLoader> => loader.getChildLoader(`[data-section="${name}"]`);
    return { fixture, loader, inSection, element: fixture.nativeElement as HTMLElement };
  }

  it("shows the tenant's own unit and organization", async () => {
    const { element } = await render();
    expect(element.querySelector('[data-section="details"] mat-card-subtitle')?.textContent).toContain('Tenant · Maplewood Homes · unit 2C, Cedar Row');
  });

  it('saves name, phone, temperature unit and time zone, and updates the session', async () => {
    const { fixture, inSection } = await render();
    const details = await inSection('details');
    await (await inputLabelled(details, 'Name')).setValue('Sam T. Renter');
    await (await details.getHarness(MatButtonToggleHarness.with({ text: '°C' }))).check();
    await (await details.getHarness(MatSelectHarness)).clickOptions({ text: 'America/Denver' });
    await (await details.getHarness(MatButtonHarness.with({ text: 'Save details' }))).click();
    const call = backend.expectOne('/api/profile');
    expect(call.request.method).toBe('PATCH');
    expect(call.request.body).toEqual({ displayName: 'Sam T. Renter', phone: '555-0101', temperatureUnit: 'C', timeZone: 'America/Denver' });
    call.flush({ ...profile, displayName: 'Sam T. Renter', temperatureUnit: 'C', timeZone: 'America/Denver' });
    await settle(fixture);
    const session = TestBed.inject(Session).user();
    expect(session?.temperatureUnit).toBe('C');
    expect(session?.displayName).toBe('Sam T. Renter');
  });

  it('changes the password with the current one, showing a wrong current password under its field', async () => {
    const { fixture, inSection, element } = await render();
    const section = await inSection('password');
    await (await inputLabelled(section, 'Current password')).setValue('not it');
    await (await inputLabelled(section, 'New password')).setValue('a fresh passphrase');
    await (await inputLabelled(section, 'New password again')).setValue('a fresh passphrase');
    await (await section.getHarness(MatButtonHarness.with({ text: 'Change password' }))).click();
    const call = backend.expectOne('/api/profile/password');
    expect(call.request.body).toEqual({ currentPassword: 'not it', newPassword: 'a fresh passphrase' });
    call.flush({ error: 'invalid input', details: [{ path: 'currentPassword', message: 'your current password is not correct' }] }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    const passwordCard = element.querySelector('[data-section="password"]') as HTMLElement;
    expect(passwordCard.textContent).toContain('your current password is not correct');
    // Field errors stay with their own form.
    expect(element.querySelector('[data-section="email"]')?.textContent).not.toContain('your current password is not correct');
  });

  it('changes the e-mail address', async () => {
    const { fixture, inSection } = await render();
    const section = await inSection('email');
    await (await inputLabelled(section, 'New e-mail address')).setValue('sam.new@example.com');
    await (await inputLabelled(section, 'Current password')).setValue('my passphrase here');
    await (await section.getHarness(MatButtonHarness.with({ text: 'Change e-mail address' }))).click();
    const call = backend.expectOne('/api/profile/email');
    expect(call.request.body).toEqual({ email: 'sam.new@example.com', currentPassword: 'my passphrase here' });
    call.flush({ ...profile, email: 'sam.new@example.com' });
    await settle(fixture);
    expect(TestBed.inject(Session).user()?.email).toBe('sam.new@example.com');
  });
});
