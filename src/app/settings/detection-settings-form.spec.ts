import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { APPLIANCE_STYLES, probesOf } from '../../../shared/domain';
import { DETECTION_SETTING_FIELDS, type DetectionOverrides, type DetectionSettingsView } from '../../../shared/api/settings';
import { FRESH_FOOD_LIMIT_C, FREEZER_LIMIT_C, fToC } from '../../../shared/temperature';
import { configureSpec, settle } from '../inventory/testing';
import { DetectionSettingsForm } from './detection-settings-form';

const DEFAULTS: Record<string, number> = {
  freshFoodLimitC: FRESH_FOOD_LIMIT_C,
  freshOverTempGraceMinutes: 60,
  freshMinRiseC: 1.5,
  freezerLimitC: FREEZER_LIMIT_C,
  freezerOverTempGraceMinutes: 90,
  freezerMinRiseC: 2,
  sustainMinutes: 45,
  silentAfterMinutes: 60,
};

function view(overrides: Partial<Record<string, DetectionOverrides>> = {}): DetectionSettingsView {
  return {
    fields: DETECTION_SETTING_FIELDS.map((field) => ({ ...field, defaultValue: DEFAULTS[field.key], reason: `reason for ${field.key}` })),
    styles: APPLIANCE_STYLES.map((style) => ({ style, probes: [...probesOf(style)], overrides: overrides[style] ?? {}, updatedAt: overrides[style] ? '2026-03-01T00:00:00.000Z' : null, updatedBy: overrides[style] ? 'Dana Manager' : null })),
  };
}

describe('DetectionSettingsForm', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec({ user: { temperatureUnit: 'F' } })));
  afterEach(() => backend.verify());

  async function render(initial: DetectionSettingsView) {
    const fixture = TestBed.createComponent(DetectionSettingsForm);
    fixture.detectChanges();
    backend.expectOne('/api/settings/detection').flush(initial);
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const input = async (label: string) => (await (await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: label }))).getControl(MatInputHarness))!;
    return { fixture, loader, input };
  }

  it('shows the food-safety limits in °F with their defaults', async () => {
    const { input, loader } = await render(view({ 'top-freezer': { freshOverTempGraceMinutes: 45 } }));
    // 4.444… °C and −17.777… °C are 40 °F and 0 °F (U.S. FDA; NIST SP 811, B.8).
    expect(await (await input('Fresh-food limit')).getValue()).toBe('40');
    expect(await (await input('Freezer limit')).getValue()).toBe('0');
    expect(await (await input('Fresh-food grace period')).getValue()).toBe('45');
    const grace = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Fresh-food grace period' }));
    expect(await grace.getTextHints()).toEqual(['Default 60 min · changed']);
  });

  it('saves only what differs from the default, converted back to °C', async () => {
    const { fixture, input, loader } = await render(view());
    await (await input('Fresh-food limit')).setValue('38');
    await (await input('Freezer grace period')).setValue('120');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save for top freezers/ }))).click();
    const call = backend.expectOne('/api/settings/detection/top-freezer');
    expect(call.request.method).toBe('PUT');
    expect(call.request.body).toEqual({ freshFoodLimitC: fToC(38), freezerOverTempGraceMinutes: 120 });
    call.flush(view({ 'top-freezer': call.request.body }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Settings for top freezers are saved.');
  });

  it('refuses a fresh-food limit looser than 40 °F before asking the server', async () => {
    const { fixture, input, loader } = await render(view());
    await (await input('Fresh-food limit')).setValue('41');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Save for/ }))).click();
    await settle(fixture);
    backend.expectNone('/api/settings/detection/top-freezer');
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('From 32 to 40 °F.');
  });

  it('offers only the freezer settings for a chest freezer, and resets a style to the defaults', async () => {
    const { fixture, loader } = await render(view({ 'chest-freezer': { freezerOverTempGraceMinutes: 200 } }));
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Chest freezer' });
    await settle(fixture);
    const labels = await Promise.all((await loader.getAllHarnesses(MatFormFieldHarness)).map((field) => field.getLabel()));
    expect(labels).toEqual(['Appliance style', 'Freezer limit', 'Freezer grace period', 'Freezer warming threshold', 'Warming must last', 'Silent after']);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Use the defaults' }))).click();
    const call = backend.expectOne('/api/settings/detection/chest-freezer');
    expect(call.request.method).toBe('DELETE');
    call.flush(view());
    await settle(fixture);
  });
});
