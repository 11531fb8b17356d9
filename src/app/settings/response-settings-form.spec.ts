import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { OrgSettings, OrgSettingsView } from '../../../shared/api/work-orders';
import { configureSpec, settle } from '../inventory/testing';
import { ResponseSettingsForm } from './response-settings-form';

const SETTINGS: OrgSettings = {
  autoOpenSeverity: 'watch',
  responseMinutes: { urgent: 240, routine: 4320 },
  escalateAfterMinutes: 30,
  verificationWindowMinutes: 480,
  verificationHoldMinutes: 60,
  dispatchHoldMinutes: 45,
  currency: 'USD',
};

function view(settings: OrgSettings = SETTINGS): OrgSettingsView {
  const reasons = Object.fromEntries(Object.keys(SETTINGS).map((key) => [key, `because of ${key}`])) as OrgSettingsView['reasons'];
  return { settings, defaults: SETTINGS, reasons };
}

describe('ResponseSettingsForm', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  it('shows response targets in hours and saves them back in minutes', async () => {
    const fixture = TestBed.createComponent(ResponseSettingsForm);
    fixture.detectChanges();
    backend.expectOne('/api/org-settings').flush(view());
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const input = async (label: string) => (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;
    expect(await (await input('Urgent jobs due within')).getValue()).toBe('4');
    expect(await (await input('Routine jobs due within')).getValue()).toBe('72');
    await (await input('Urgent jobs due within')).setValue('2.5');
    await (await input('Escalate an unaccepted urgent job after')).setValue('20');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Save response settings' }))).click();
    const call = backend.expectOne('/api/org-settings');
    expect(call.request.method).toBe('PATCH');
    expect(call.request.body).toEqual(jasmine.objectContaining({ responseMinutes: { urgent: 150, routine: 4320 }, escalateAfterMinutes: 20 }));
    call.flush(view({ ...SETTINGS, responseMinutes: { urgent: 150, routine: 4320 }, escalateAfterMinutes: 20 }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Response targets and escalation times are saved.');
  });
});
