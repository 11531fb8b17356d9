import { DEFAULT_SETTINGS } from '../../server/detection/settings';
import { DetectionSettingsService } from '../../server/services/detection-settings';
import type { DetectionSettingsView } from '../../shared/api/settings';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C, fToC } from '../../shared/temperature';
import type { Browser } from '../auth/support/browser';
import { createWorld, upload, type World } from './support/inventory-world';
import { traceCsv } from './support/logger-fixtures';

describe('detection settings per appliance style', () => {
  let world: World;
  let manager: Browser;
  const styleOf = (view: DetectionSettingsView, style: string) => view.styles.find((s) => s.style === style)!;

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('shows every editable setting with its default and the reason for it', async () => {
    const res = await manager.get('/api/settings/detection');
    expect(res.status).toBe(200);
    const view: DetectionSettingsView = res.body;
    const fresh = view.fields.find((f) => f.key === 'freshFoodLimitC')!;
    // 40 °F = 4.444… °C (U.S. FDA, "Refrigerator Thermometers: Cold Facts about Food Safety"; NIST SP 811 B.8 for the conversion).
    expect(fresh.defaultValue).toBeCloseTo(4.444, 3);
    expect(fresh.max).toBe(FRESH_FOOD_LIMIT_C);
    expect(fresh.reason).toContain('FDA');
    expect(view.fields.find((f) => f.key === 'freezerLimitC')!.max).toBe(FREEZER_LIMIT_C);
    expect(view.fields.every((f) => f.defaultValue === (DEFAULT_SETTINGS as unknown as Record<string, number>)[f.key])).toBeTrue();
    expect(view.styles.map((s) => s.style)).toEqual(['top-freezer', 'bottom-freezer', 'side-by-side', 'fresh-food-only', 'upright-freezer', 'chest-freezer']);
    expect(styleOf(view, 'chest-freezer').probes).toEqual(['freezer']);
  });

  it('stores overrides for one style, reports who changed them, and resets to the defaults', async () => {
    const put = await manager.send('put', '/api/settings/detection/side-by-side', { freshOverTempGraceMinutes: 45, freshFoodLimitC: fToC(38) });
    expect(put.status).toBe(200);
    const sideBySide = styleOf(put.body, 'side-by-side');
    expect(sideBySide.overrides).toEqual({ freshOverTempGraceMinutes: 45, freshFoodLimitC: fToC(38) });
    expect(sideBySide.updatedBy).toBe('Spec managerOrg1');
    expect(styleOf(put.body, 'fresh-food-only').overrides).toEqual({});
    const service = new DetectionSettingsService(world.db.dataSource);
    const effective = await service.effective(world.fixtures.org1.id, 'side-by-side');
    expect(effective.freshOverTempGraceMinutes).toBe(45);
    expect(effective.freezerOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freezerOverTempGraceMinutes);
    expect((await service.effective(world.fixtures.org2.id, 'side-by-side')).freshOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freshOverTempGraceMinutes);
    const reset = await manager.delete('/api/settings/detection/side-by-side');
    expect(styleOf(reset.body, 'side-by-side')).toEqual(jasmine.objectContaining({ overrides: {}, updatedAt: null }));
  });

  it('never lets a limit be looser than the FDA food-safety limits, nor a grace period pass the USDA two hours', async () => {
    // U.S. FDA: fresh food at or below 40 °F, freezer at or below 0 °F ("Refrigerator Thermometers: Cold Facts about Food Safety").
    const looseFresh = await manager.send('put', '/api/settings/detection/top-freezer', { freshFoodLimitC: fToC(41) });
    expect(looseFresh.status).toBe(400);
    expect(looseFresh.body.details[0].message).toBe('Fresh-food limit: at most 4.44 °C');
    expect((await manager.send('put', '/api/settings/detection/top-freezer', { freezerLimitC: fToC(5) })).status).toBe(400);
    expect((await manager.send('put', '/api/settings/detection/top-freezer', { freshFoodLimitC: FRESH_FOOD_LIMIT_C, freezerLimitC: FREEZER_LIMIT_C })).status).toBe(200);
    // USDA FSIS "Danger Zone": perishables above 40 °F for more than 2 hours are discarded.
    expect((await manager.send('put', '/api/settings/detection/top-freezer', { freshOverTempGraceMinutes: 121 })).status).toBe(400);
    expect((await manager.send('put', '/api/settings/detection/top-freezer', { silentAfterMinutes: 30.5 })).status).toBe(400);
    expect((await manager.send('put', '/api/settings/detection/top-freezer', { cusumDecisionSigma: 3 })).status).toBe(400);
  });

  it('refuses settings of a compartment the style does not have', async () => {
    const res = await manager.send('put', '/api/settings/detection/chest-freezer', { freshOverTempGraceMinutes: 30 });
    expect(res.status).toBe(400);
    expect(res.body.error).toBe('freshOverTempGraceMinutes does not apply to a chest freezer');
    expect((await manager.send('put', '/api/settings/detection/wine-cooler', {})).status).toBe(400);
  });

  it("analyses logger files with the organization's settings for the style", async () => {
    const healthy = traceCsv({ days: 3, intervalMinutes: 5, seed: 11 });
    const before = await upload(manager, '/api/logger-files', { name: 'healthy.csv', content: healthy.text }, { style: 'bottom-freezer' });
    expect(before.body.analysis.findings.filter((f: { kind: string }) => f.kind === 'over-temperature')).toEqual([]);
    // A fresh-food limit of 32 °F puts this healthy cabinet (about 37 °F) over its limit all the time.
    await manager.send('put', '/api/settings/detection/bottom-freezer', { freshFoodLimitC: 0 });
    const after = await upload(manager, '/api/logger-files', { name: 'healthy.csv', content: healthy.text }, { style: 'bottom-freezer' });
    expect(after.body.analysis.findings.map((f: { kind: string; compartment: string }) => `${f.kind}/${f.compartment}`)).toContain('over-temperature/fresh_food');
    await manager.delete('/api/settings/detection/bottom-freezer');
  });

  it("keeps each organization's settings to itself and to managers", async () => {
    await manager.send('put', '/api/settings/detection/upright-freezer', { freezerOverTempGraceMinutes: 120 });
    const theirs = await (await world.signedIn('adminOrg2')).get('/api/settings/detection');
    expect(styleOf(theirs.body, 'upright-freezer').overrides).toEqual({});
    expect((await (await world.signedIn('tenantA')).get('/api/settings/detection')).status).toBe(403);
    expect((await (await world.signedIn('contractorWithJob')).send('put', '/api/settings/detection/upright-freezer', {})).status).toBe(403);
  });
});
