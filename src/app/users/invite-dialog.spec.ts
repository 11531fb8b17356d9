import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatDialogRef } from '@angular/material/dialog';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { inputLabelled, settle } from '../../testing/form-fields';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { InviteDialog } from './invite-dialog';

describe('InviteDialog', () => {
  let backend: HttpTestingController;
  let close: jasmine.Spy;

  beforeEach(() => {
    close = jasmine.createSpy('close');
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting(), { provide: MatDialogRef, useValue: { close } }],
    });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(InviteDialog);
    fixture.detectChanges();
    backend.expectOne('/api/invitations/unit-options').flush([
      { id: 'unit-a', label: '1A', propertyName: 'Cedar Row' },
      { id: 'unit-b', label: '1B', propertyName: 'Cedar Row' },
    ]);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  const roleSelect = (loader: Awaited<ReturnType<typeof render>>['loader']) => loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="role"]' }));

  it('invites a tenant to a chosen unit', async () => {
    const { fixture, loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue('robin@example.com');
    await (await inputLabelled(loader, 'Name')).setValue('Robin Tenant');
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="unitId"]' }))).clickOptions({ text: 'Cedar Row · 1B' });
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    const call = backend.expectOne('/api/invitations');
    expect(call.request.body).toEqual({ email: 'robin@example.com', displayName: 'Robin Tenant', role: 'tenant', unitId: 'unit-b', isAdmin: false });
    call.flush({ id: 'i9', email: 'robin@example.com', status: 'pending' }, { status: 201, statusText: 'Created' });
    await settle(fixture);
    expect(close).toHaveBeenCalledWith(jasmine.objectContaining({ id: 'i9' }));
  });

  it('needs a unit for a tenant before sending', async () => {
    const { fixture, loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue('robin@example.com');
    await (await inputLabelled(loader, 'Name')).setValue('Robin Tenant');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    await settle(fixture);
    backend.expectNone('/api/invitations');
    const unitField = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Unit' }));
    expect(await unitField.getTextErrors()).toEqual(['Choose the unit the tenant lives in']);
  });

  it('offers the admin flag for a manager and sends no unit', async () => {
    const { fixture, loader } = await render();
    await (await inputLabelled(loader, 'E-mail address')).setValue('lee@example.com');
    await (await inputLabelled(loader, 'Name')).setValue('Lee Manager');
    await (await roleSelect(loader)).clickOptions({ text: /^Manager/ });
    await (await loader.getHarness(MatCheckboxHarness)).check();
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Send the invitation' }))).click();
    const call = backend.expectOne('/api/invitations');
    expect(call.request.body).toEqual({ email: 'lee@example.com', displayName: 'Lee Manager', role: 'manager', unitId: null, isAdmin: true });
    call.flush({ error: 'An account with this e-mail address already exists.' }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('already exists');
    expect(close).not.toHaveBeenCalled();
  });
});
