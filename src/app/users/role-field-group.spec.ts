import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { ChangeDetectionStrategy, Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { FormControl, FormGroup, ReactiveFormsModule } from '@angular/forms';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { Role } from '../../../shared/domain';
import { settle } from '../../testing/form-fields';
import { RoleFieldGroup } from './role-field-group';

@Component({
  imports: [ReactiveFormsModule, RoleFieldGroup],
  template: `<form [formGroup]="form"><cw-role-field-group /></form>`,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
class Host {
  readonly form = new FormGroup({
    role: new FormControl<Role>('contractor', { nonNullable: true }),
    unitId: new FormControl<string | null>(null),
    isAdmin: new FormControl(false, { nonNullable: true }),
  });
}

describe('RoleFieldGroup', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    backend = TestBed.inject(HttpTestingController);
  });

  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(Host);
    fixture.detectChanges();
    backend.expectOne('/api/invitations/unit-options').flush([{ id: 'unit-a', label: '1A', propertyName: 'Cedar Row' }]);
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const roleSelect = await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="role"]' }));
    return { form: fixture.componentInstance.form, loader, roleSelect };
  }

  it('shows neither unit nor administrator for a contractor', async () => {
    const { loader } = await render();
    expect(await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Unit' }))).toEqual([]);
    expect(await loader.getAllHarnesses(MatCheckboxHarness)).toEqual([]);
  });

  it('asks a tenant for the unit, from the unit options, into the parent form', async () => {
    const { form, loader, roleSelect } = await render();
    await roleSelect.clickOptions({ text: /^Tenant/ });
    expect(form.controls.role.value).toBe('tenant');
    await (await loader.getHarness(MatSelectHarness.with({ selector: '[formControlName="unitId"]' }))).clickOptions({ text: 'Cedar Row · 1A' });
    expect(form.controls.unitId.value).toBe('unit-a');
    expect(await loader.getAllHarnesses(MatCheckboxHarness)).toEqual([]);
  });

  it('offers a manager the administrator flag, bound to the parent form', async () => {
    const { form, loader, roleSelect } = await render();
    await roleSelect.clickOptions({ text: /^Manager/ });
    await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Administrator: also manages users' }))).check();
    expect(form.controls.isAdmin.value).toBeTrue();
    expect(await loader.getAllHarnesses(MatFormFieldHarness.with({ floatingLabelText: 'Unit' }))).toEqual([]);
  });
});
