import type { ApplianceDetail, ServiceHistoryEntry } from '../../shared/api/appliances';
import { DetectionEngine } from '../../server/detection/engine';
import type { EngineState } from '../../server/detection/state';
import { FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';
import { defaultProfile, generateTrace } from '../../simulator/model';
import type { Browser } from '../auth/support/browser';
import { SETUP_TIMEOUT_MS, SPEC_NOW, createFleetWorld, type FleetWorld } from './support/fleet-world';

const HOUR_MS = 3_600_000;
const DAY_MS = 24 * HOUR_MS;

/** The engine's memory after three healthy days of the simulator's default top-freezer. */
function learnedState(endMs: number): EngineState {
  const samples = generateTrace({ profile: defaultProfile('top-freezer'), seed: 7, startMs: endMs - 3 * DAY_MS, durationMs: 3 * DAY_MS, intervalMs: 5 * 60_000, faults: [] });
  const engine = new DetectionEngine('top-freezer');
  for (const sample of samples) engine.push(sample);
  return engine.snapshot();
}

describe('GET /api/appliances/:id', () => {
  let world: FleetWorld;
  let manager: Browser;
  let history: ServiceHistoryEntry[] | null = null;
  const ids: Record<string, string> = {};

  beforeAll(async () => {
    world = await createFleetWorld({
      webApp: {
        serviceHistory: { forAppliance: async (applianceId) => (applianceId === ids.appliance ? history : null) },
        repairRule: { forOrganization: async () => ({ repairShareOfNewPrice: 0.5, pastLifeShare: 0.5, newUnitPriceCents: { refrigerator: 120_000 }, currency: 'USD' }) },
      },
    });
    const { seed } = world;
    ids.org = await seed.organization('Harbor Flats (spec)');
    ids.property = await seed.property(ids.org, 'Birch Court', 'America/New_York');
    ids.unit = await seed.unit(ids.property, '4B', 4);
    ids.appliance = await seed.appliance(ids.unit, 'top-freezer', { installedOn: '2018-03-02', warrantyEndsOn: '2019-03-02', model: 'TF-18 (demo)', serial: 'SN-0042' });
    await seed.sensor(ids.appliance, 'cw-birch-4b');
    await seed.monitor(ids.appliance, 'top-freezer', {
      health: 'drifting',
      sinceIso: '2026-03-02T09:00:00Z',
      lastReadingIso: '2026-03-02T14:55:00Z',
      freshFoodC: 3.6,
      freezerC: -16.2,
      engineState: learnedState(Date.parse('2026-03-02T14:55:00Z')),
    });
    const place = { organizationId: ids.org, propertyId: ids.property, unitId: ids.unit, applianceId: ids.appliance };
    ids.closed = await seed.incident({ ...place, kind: 'over-temperature', severity: 'urgent', openedAtIso: '2025-11-02T10:00:00Z', closedAtIso: '2025-11-03T10:00:00Z' });
    ids.open = await seed.incident({
      ...place,
      kind: 'warming-trend',
      severity: 'watch',
      openedAtIso: '2026-03-02T09:00:00Z',
      causes: [
        { code: 'condenser-airflow', confidence: 0.55 },
        { code: 'door-seal', confidence: 0.2 },
      ],
    });
    const finding = { ...place, incidentId: ids.open, compartment: 'fresh_food' };
    await seed.finding({ ...finding, kind: 'warming-trend', startedAtIso: '2026-03-02T05:00:00Z', detectedAtIso: '2026-03-02T09:00:00Z', forecastCrossingAtIso: '2026-03-02T21:00:00Z', summary: 'fresh food warming 0.2 °C/h' });
    await seed.finding({ ...finding, kind: 'sensor-fault', startedAtIso: '2026-03-02T06:00:00Z', detectedAtIso: '2026-03-02T06:30:00Z', endedAtIso: '2026-03-02T07:00:00Z' });
    const otherOrg = await seed.organization('Elsewhere (spec)');
    ids.otherAppliance = await seed.appliance(await seed.unit(await seed.property(otherOrg, 'Far Tower'), '1A'));
    manager = await world.signIn((await seed.person('manager', ids.org)).email);
  }, SETUP_TIMEOUT_MS);
  afterAll(async () => world.close(), SETUP_TIMEOUT_MS);

  async function detail(): Promise<ApplianceDetail> {
    const res = await manager.get(`/api/appliances/${ids.appliance}`);
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(200);
    return res.body;
  }

  it('describes the appliance, its place with the property’s time zone, and its sensor', async () => {
    const body = await detail();
    expect([body.style, body.model, body.serial, body.installedOn, body.warrantyEndsOn]).toEqual(['top-freezer', 'TF-18 (demo)', 'SN-0042', '2018-03-02', '2019-03-02']);
    expect(body.underWarranty).toBeFalse();
    expect(body.place).toEqual(jasmine.objectContaining({ propertyName: 'Birch Court', unitLabel: '4B', timeZone: 'America/New_York', address: '12 Example Avenue, Riverton IL 60000' }));
    expect(body.sensors.map((s) => s.deviceId)).toEqual(['cw-birch-4b']);
    // The id the appliance page links the sensor's page with.
    const [sensor] = await world.db.dataSource.query(`SELECT id FROM sensor WHERE device_id = 'cw-birch-4b'`);
    expect(body.sensors[0].id).toBe(sensor.id);
  });

  it('puts the age against the expected life of a refrigerator', async () => {
    const { life } = await detail();
    // A refrigerator is expected to last about 13 years (NAHB / Bank of America Home Equity,
    // Study of Life Expectancy of Home Components, 2007); 2018-03-02 to 2026-03-02 is 8.0 years.
    expect(life).toEqual(jasmine.objectContaining({ lifeClass: 'refrigerator', expectedYears: 13, ageYears: 8 }));
    expect(life.lifeFraction).toBeCloseTo(8 / 13, 2);
  });

  it('gives the repair-or-replace rule of thumb from the setting and the service history', async () => {
    history = null;
    let hint = (await detail()).repairOrReplace;
    // Past mid-life (8 of 13 years), a new refrigerator at $1,200: replace at $600 or more (common practice, a setting).
    expect(hint.verdict).toBe('weigh');
    expect(hint.replaceAtCents).toBe(60_000);
    expect(hint.summary).toContain('$600');
    history = [
      { workOrderId: 'a', state: 'verified', contractorName: 'Spec Repair', dispatchedAt: '2025-11-02T12:00:00Z', completedAt: '2025-11-03T09:00:00Z', causeFound: 'evaporator-fan', findings: '', parts: [{ name: 'Evaporator fan motor', quantity: 1, unitCostCents: 9_000 }], labourMinutes: 90, totalCents: 42_000, currency: 'USD' },
      { workOrderId: 'b', state: 'verified', contractorName: 'Spec Repair', dispatchedAt: '2026-01-10T12:00:00Z', completedAt: '2026-01-11T09:00:00Z', causeFound: 'door-seal', findings: '', parts: [], labourMinutes: 60, totalCents: 20_000, currency: 'USD' },
      { workOrderId: 'c', state: 'verified', contractorName: 'Spec Repair', dispatchedAt: '2024-01-10T12:00:00Z', completedAt: '2024-01-11T09:00:00Z', causeFound: 'sensor', findings: '', parts: [], labourMinutes: 30, totalCents: 99_000, currency: 'USD' },
    ];
    const body = await detail();
    hint = body.repairOrReplace;
    // Only the two repairs of the last 12 months count: $420 + $200 = $620 ≥ $600.
    expect(hint.repairsLastYearCents).toBe(62_000);
    expect(hint.verdict).toBe('replace');
    expect(body.serviceHistory?.length).toBe(3);
  });

  it('reports the current health and what the engine learned of this appliance’s normal', async () => {
    const body = await detail();
    expect(body.now).toEqual({ health: 'drifting', since: '2026-03-02T09:00:00.000Z', lastReadingAt: '2026-03-02T14:55:00.000Z', freshFoodC: jasmine.any(Number), freezerC: jasmine.any(Number) });
    expect(body.normal?.ready).toBeTrue();
    // The simulator's default top-freezer holds 2.5 °C and −18 °C and defrosts every 10 h for 30 min (simulator/model/profile.ts).
    expect(body.normal?.probes.fresh_food?.baselineC).toBeGreaterThan(1);
    expect(body.normal?.probes.fresh_food?.baselineC).toBeLessThan(FRESH_FOOD_LIMIT_C);
    expect(body.normal?.probes.freezer?.baselineC).toBeLessThan(FREEZER_LIMIT_C + 2);
    expect(body.defrosts.length).toBeGreaterThanOrEqual(3);
    expect(body.defrosts.every((d) => d.probe === 'freezer')).toBeTrue();
    const gapsH = body.defrosts.slice(1).map((d, i) => (Date.parse(d.at) - Date.parse(body.defrosts[i].at)) / HOUR_MS);
    for (const gap of gapsH) expect(gap).toBeCloseTo(10, 0);
  });

  it('gives the open incident’s diagnosis, its findings as a timeline, and the warming forecast', async () => {
    const body = await detail();
    expect(body.openIncident?.id).toBe(ids.open);
    expect(body.openIncident?.probableCauses).toEqual([
      { code: 'condenser-airflow', confidence: 0.55 },
      { code: 'door-seal', confidence: 0.2 },
    ]);
    expect(body.openIncident?.findings.map((f) => [f.kind, f.detectedAt])).toEqual([
      ['sensor-fault', '2026-03-02T06:30:00.000Z'],
      ['warming-trend', '2026-03-02T09:00:00.000Z'],
    ]);
    expect(body.forecast).toEqual({ probe: 'fresh_food', fromAt: '2026-03-02T14:55:00.000Z', fromC: jasmine.any(Number), crossingAt: '2026-03-02T21:00:00.000Z', limitC: FRESH_FOOD_LIMIT_C });
    expect(body.incidents.map((i) => i.id)).toEqual([ids.open, ids.closed]);
  });

  it('answers 404 for another organization’s appliance or an unknown one, 400 for a malformed id, 403 for a tenant', async () => {
    expect((await manager.get(`/api/appliances/${ids.otherAppliance}`)).status).toBe(404);
    expect((await manager.get('/api/appliances/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await manager.get('/api/appliances/not-an-id')).status).toBe(400);
    const tenant = await world.signIn((await world.seed.person('tenant', ids.org, ids.unit)).email);
    expect((await tenant.get(`/api/appliances/${ids.appliance}`)).status).toBe(403);
  });

  it('serves the history API for the chart with the appliance’s probes, to its tenant too', async () => {
    const from = new Date(Date.parse(SPEC_NOW) - 6 * HOUR_MS).toISOString();
    const res = await manager.get(`/api/appliances/${ids.appliance}/history?from=${from}&to=${SPEC_NOW}`);
    expect(res.status).toBe(200);
    expect(Object.keys(res.body.probes).sort()).toEqual(['freezer', 'fresh_food']);
    const tenant = await world.signIn((await world.seed.person('tenant', ids.org, ids.unit)).email);
    expect((await tenant.get(`/api/appliances/${ids.appliance}/history`)).status).toBe(200);
    expect((await tenant.get(`/api/appliances/${ids.otherAppliance}/history`)).status).toBe(404);
  });
});
