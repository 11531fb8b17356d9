/**
 * The live monitor judges each appliance with its organization's detection settings
 * (DetectionSettingsService.effective) and picks up a manager's change at the next batch.
 * The service runs over a small in-memory stand-in for its table, so the chain from the
 * PUT/DELETE handlers' service calls to the monitor's cache is the real code.
 */
import type { DataSource } from 'typeorm';
import type { Actor } from '../../server/auth/actor';
import { DEFAULT_SETTINGS, settingsFor } from '../../server/detection/settings';
import { MonitoredAppliance, type ApplianceRef } from '../../server/monitor/monitored-appliance';
import { EffectiveSettingsCache } from '../../server/monitor/settings-cache';
import { DetectionSettingsService } from '../../server/services/detection-settings';
import type { ApplianceStyle } from '../../shared/domain';
import { HOUR_MS, MINUTE_MS } from './support/monitor-rig';

interface Row {
  organizationId: string;
  style: ApplianceStyle;
  overrides: unknown;
}

/** Just what the service touches: save/delete/findOneBy on its one table, and the view query. */
function memoryDataSource(): { dataSource: DataSource; reads: () => number } {
  const rows = new Map<string, Row>();
  let reads = 0;
  const key = (r: Pick<Row, 'organizationId' | 'style'>) => `${r.organizationId}|${r.style}`;
  const repository = {
    save: async (row: Row) => void rows.set(key(row), row),
    delete: async (where: Row) => void rows.delete(key(where)),
    findOneBy: async (where: Row) => {
      reads++;
      return rows.get(key(where)) ?? null;
    },
  };
  const dataSource = { getRepository: () => repository, query: async () => [] } as unknown as DataSource;
  return { dataSource, reads: () => reads };
}

const manager = (organizationId: string) => ({ id: `manager-${organizationId}`, role: 'manager', organizationId }) as unknown as Actor;

describe('detection settings in the live monitor', () => {
  let clockMs: number;
  let store: ReturnType<typeof memoryDataSource>;
  let service: DetectionSettingsService;
  let cache: EffectiveSettingsCache;

  beforeEach(() => {
    clockMs = Date.UTC(2025, 5, 1);
    store = memoryDataSource();
    service = new DetectionSettingsService(store.dataSource);
    cache = new EffectiveSettingsCache(service, () => clockMs);
  });
  afterEach(() => cache.close());

  it('reads the organization\'s overrides for the style once and keeps them', async () => {
    await service.replace(manager('org-a'), 'top-freezer', { freshOverTempGraceMinutes: 30 });
    const first = await cache.get('org-a', 'top-freezer');
    const again = await cache.get('org-a', 'top-freezer');
    expect(first.freshOverTempGraceMinutes).toBe(30);
    expect(again).toBe(first);
    expect(store.reads()).toBe(1);
    // Another organization, or another style, keeps the documented defaults.
    expect((await cache.get('org-b', 'top-freezer')).freshOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freshOverTempGraceMinutes);
    expect((await cache.get('org-a', 'chest-freezer')).freshOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freshOverTempGraceMinutes);
  });

  it('drops the cached settings when a manager replaces or resets that style', async () => {
    expect((await cache.get('org-a', 'side-by-side')).freezerOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freezerOverTempGraceMinutes);
    const untouched = await cache.get('org-a', 'top-freezer');
    await service.replace(manager('org-a'), 'side-by-side', { freezerOverTempGraceMinutes: 45 });
    expect((await cache.get('org-a', 'side-by-side')).freezerOverTempGraceMinutes).toBe(45);
    expect(await cache.get('org-a', 'top-freezer')).toBe(untouched);
    await service.reset(manager('org-a'), 'side-by-side');
    expect((await cache.get('org-a', 'side-by-side')).freezerOverTempGraceMinutes).toBe(DEFAULT_SETTINGS.freezerOverTempGraceMinutes);
  });

  it('re-reads an entry past its age, for changes made by another server process', async () => {
    const first = await cache.get('org-a', 'top-freezer');
    clockMs += 4 * MINUTE_MS;
    expect(await cache.get('org-a', 'top-freezer')).toBe(first);
    clockMs += 2 * MINUTE_MS;
    expect(await cache.get('org-a', 'top-freezer')).not.toBe(first);
    expect(store.reads()).toBe(2);
  });

  it('stops listening once closed', async () => {
    const invalidate = spyOn(cache, 'invalidate').and.callThrough();
    await service.replace(manager('org-a'), 'top-freezer', { sustainMinutes: 60 });
    expect(invalidate).toHaveBeenCalledOnceWith('org-a', 'top-freezer');
    cache.close();
    await service.reset(manager('org-a'), 'top-freezer');
    expect(invalidate).toHaveBeenCalledTimes(1);
  });
});

describe('an appliance under watch switching settings', () => {
  const ref: ApplianceRef = { applianceId: 'a-1', unitId: 'u-1', propertyId: 'p-1', organizationId: 'org-a', style: 'fresh-food-only', intervalSeconds: 300 };
  const startMs = Date.UTC(2025, 5, 1);

  /** A steady fresh-food section at 3.5 °C with a small compressor ripple, every 5 minutes. */
  function steady(fromHour: number, toHour: number) {
    const readings = [];
    for (let t = startMs + fromHour * HOUR_MS; t < startMs + toHour * HOUR_MS; t += 5 * MINUTE_MS) {
      readings.push({ atMs: t, freshFoodC: 3.5 + 0.3 * Math.sin(t / (7 * MINUTE_MS)), freezerC: null, freshFoodFlag: null, freezerFlag: null, doorOpen: null });
    }
    return readings;
  }

  it('keeps what it learned and judges the next readings by the new limit', () => {
    const appliance = new MonitoredAppliance(ref, null, startMs, settingsFor('fresh-food-only'));
    appliance.feed(steady(0, 30));
    expect(appliance.engine.learned().ready).toBeTrue();
    expect(appliance.engine.openFindings()).toEqual([]);
    const baseline = appliance.engine.baselineC('fresh_food');
    // A manager lowers the fresh-food limit to 3 °C (allowed: at most the FDA's 40 °F).
    const stricter = settingsFor('fresh-food-only', { freshFoodLimitC: 3 });
    expect(appliance.useSettings(stricter)).toBeTrue();
    expect(appliance.useSettings(stricter)).toBeFalse();
    expect(appliance.engine.baselineC('fresh_food')).toBe(baseline);
    const { engineEvents } = appliance.feed(steady(30, 33));
    const over = engineEvents.find((e) => e.type === 'opened' && e.finding.kind === 'over-temperature');
    expect(over).toBeDefined();
    // Above the new limit beyond its grace period (60 min by default) after the switch.
    expect(over!.atMs - (startMs + 30 * HOUR_MS)).toBeGreaterThanOrEqual(DEFAULT_SETTINGS.freshOverTempGraceMinutes * MINUTE_MS);
  });
});
