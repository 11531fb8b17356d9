/** The demo scenario's plan: the promised shape, from the seed alone. */
import { APPLIANCE_STYLES } from '../../shared/domain';
import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import { OTHER_TENANTS, PROPERTY_BLUEPRINTS } from '../../seeds/scenario/catalogue';
import { scenarioFleetFile, storylineFleetFaults } from '../../seeds/scenario/faults';
import { PAST_TROUBLE } from '../../seeds/scenario/past-repairs';
import { applianceByKey, appliancesOf, DEFAULT_SCENARIO_SEED, planScenario, type ScenarioPlan } from '../../seeds/scenario/plan';
import { STORYLINE } from '../../seeds/scenario/storyline';

const NOW_MS = Date.UTC(2026, 11, 1, 15, 0);
const isFridge = (style: string) => style !== 'upright-freezer' && style !== 'chest-freezer';

describe('demo scenario plan', () => {
  const plan: ScenarioPlan = planScenario(DEFAULT_SCENARIO_SEED, NOW_MS);
  const appliances = appliancesOf(plan);

  it('is the same plan for the same seed and "now", and another plan for another seed', () => {
    expect(JSON.stringify(planScenario(DEFAULT_SCENARIO_SEED, NOW_MS))).toBe(JSON.stringify(plan));
    const other = appliancesOf(planScenario(DEFAULT_SCENARIO_SEED + 1, NOW_MS));
    expect(other.map((a) => a.deviceId)).not.toEqual(appliances.map((a) => a.deviceId));
    // The storyline's appliances keep their calibrated profile whatever the seed.
    expect(other.find((a) => a.key === 'p1/304/1')?.profile).toEqual(applianceByKey(plan, 'p1/304/1').profile);
  });

  it('has three or four properties: a 40-unit mid-rise, a row of townhouses and a small older building', () => {
    expect(plan.properties.length).toBeGreaterThanOrEqual(3);
    expect(plan.properties.length).toBeLessThanOrEqual(4);
    const byKind = (kind: string) => plan.properties.find((property) => property.kind === kind);
    expect(byKind('mid-rise')?.units.length).toBe(40);
    expect(byKind('townhouses')?.units.length).toBeGreaterThanOrEqual(4);
    const older = byKind('older-walk-up');
    expect(older?.units.length).toBeGreaterThan(0);
    expect(older!.units.length).toBeLessThan(12);
    for (const property of plan.properties) expect(property.units.every((unit) => unit.appliances.length > 0)).withContext(property.name).toBeTrue();
  });

  it('ages the older building: refrigerators past 13 years and freezers past 11', () => {
    // Expected service life: refrigerator 13 years, freezer 11 (NAHB / Bank of America Home
    // Equity, Study of Life Expectancy of Home Components, 2007).
    const older = plan.properties.find((property) => property.kind === 'older-walk-up')!;
    const there = older.units.flatMap((unit) => unit.appliances);
    expect(there.filter((a) => isFridge(a.style) && a.ageYears > 13).length).toBeGreaterThanOrEqual(2);
    expect(there.filter((a) => !isFridge(a.style) && a.ageYears > 11).length).toBeGreaterThanOrEqual(1);
    const midRise = plan.properties.find((property) => property.kind === 'mid-rise')!;
    expect(Math.max(...midRise.units.flatMap((unit) => unit.appliances.map((a) => a.ageYears)))).toBeLessThan(10);
  });

  it('varies styles, models and ages; every appliance has its own sensor and serial', () => {
    expect(new Set(appliances.map((a) => a.style)).size).toBe(APPLIANCE_STYLES.length);
    expect(new Set(appliances.map((a) => a.model)).size).toBeGreaterThan(8);
    expect(new Set(appliances.map((a) => a.deviceId)).size).toBe(appliances.length);
    expect(new Set(appliances.map((a) => a.serial)).size).toBe(appliances.length);
    for (const appliance of appliances) {
      expect(appliance.deviceId).toMatch(/^cw-[0-9a-f]{12}$/);
      expect(Date.parse(appliance.installedOn)).toBeLessThan(appliance.monitoredFromMs);
    }
  });

  it('has at least several weeks of history for every appliance, about 90 days for the older properties', () => {
    const days = appliances.map((a) => (NOW_MS - a.monitoredFromMs) / 86_400_000);
    expect(Math.min(...days)).toBeGreaterThanOrEqual(21);
    expect(Math.max(...days)).toBeGreaterThanOrEqual(89);
  });

  it('keeps people invented: example.com addresses, 555 numbers, tenants in units of the plan', () => {
    for (const tenant of plan.tenants) {
      expect(tenant.email).toMatch(/@example\.com$/);
      expect(tenant.phone).toMatch(/^555-01\d\d$/);
      expect(plan.properties.some((p) => p.units.some((u) => `${p.key}/${u.label}` === tenant.unitKey))).withContext(tenant.unitKey).toBeTrue();
    }
    expect(plan.tenants.length).toBe(OTHER_TENANTS.length);
    for (const property of PROPERTY_BLUEPRINTS) expect(property.addressLine1).not.toMatch(/\d{5}/);
  });

  it('puts the demo tenant where the evaporator fan fails, at a property whose primary is the demo contractor', () => {
    const fan = STORYLINE.find((step) => step.fault === 'evaporator-fan')!;
    expect(fan.applianceKey?.startsWith(`${plan.demoTenantUnitKey}/`)).toBeTrue();
    const property = plan.properties.find((p) => plan.demoTenantUnitKey.startsWith(`${p.key}/`))!;
    // DEMO_CONTRACTORS[0] is the demo technician's company (seeds/steps/work-orders.ts).
    expect(property.primaryContractor).toBe(0);
    expect(DEMO_ACCOUNTS.find((account) => account.role === 'tenant')?.email).toBe('jun.okafor@example.com');
  });

  it('names only appliances of the plan in the past trouble and the storyline, and gives every fault a device or property', () => {
    for (const trouble of PAST_TROUBLE) expect(() => applianceByKey(plan, trouble.applianceKey)).not.toThrow();
    const faults = storylineFleetFaults(plan);
    expect(faults.length).toBe(STORYLINE.length);
    for (const fault of faults) expect(Boolean(fault.deviceId) !== Boolean(fault.propertyKey)).withContext(fault.fault).toBeTrue();
    const fleet = scenarioFleetFile(plan, {}, {});
    expect(fleet.devices.length).toBe(appliances.length);
    expect(fleet.properties.map((p) => p.key)).toEqual(plan.properties.map((p) => p.key));
  });
});
