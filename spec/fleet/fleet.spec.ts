import type { FleetAppliance, FleetOverview } from '../../shared/api/fleet';
import { Browser } from '../auth/support/browser';
import { SETUP_TIMEOUT_MS, createFleetWorld, type FleetWorld } from './support/fleet-world';

/**
 * GET /api/fleet against a small hand-made organization: two properties, a second
 * organization that must never show, and every health word.
 */
describe('GET /api/fleet', () => {
  let world: FleetWorld;
  let manager: Browser;
  const ids: Record<string, string> = {};
  const devices: Record<string, string> = {};

  beforeAll(async () => {
    world = await createFleetWorld();
    const { seed } = world;
    const org = await seed.organization('Harbor Flats (spec)');
    const other = await seed.organization('Elsewhere Lettings (spec)');
    ids.org = org;
    ids.birch = await seed.property(org, 'Birch Court', 'America/New_York');
    ids.alder = await seed.property(org, 'Alder House', 'America/Denver');
    ids.otherProperty = await seed.property(other, 'Far Away Tower');
    // Alder House: units 1A (fridge, warm, old), 2B (chest freezer + fridge), 10C (no monitor row yet)
    ids.u1A = await seed.unit(ids.alder, '1A', 1);
    ids.u2B = await seed.unit(ids.alder, '2B', 2);
    ids.u10C = await seed.unit(ids.alder, '10C', 10);
    ids.a1A = await seed.appliance(ids.u1A, 'top-freezer', { installedOn: '2012-01-15' });
    ids.a2Bfreezer = await seed.appliance(ids.u2B, 'chest-freezer', { installedOn: '2014-06-01' });
    ids.a2Bfridge = await seed.appliance(ids.u2B, 'bottom-freezer', { installedOn: '2023-03-01' });
    ids.a10C = await seed.appliance(ids.u10C, 'fresh-food-only');
    // Birch Court: 3D drifting, 4E no-cooling, an archived unit
    ids.u3D = await seed.unit(ids.birch, '3D', 3);
    ids.u4E = await seed.unit(ids.birch, '4E', 4);
    ids.archivedUnit = await seed.unit(ids.birch, '9Z', 9);
    await world.db.dataSource.query(`UPDATE unit SET archived_at = now() WHERE id = $1`, [ids.archivedUnit]);
    ids.a3D = await seed.appliance(ids.u3D, 'side-by-side', { installedOn: '2019-09-09' });
    ids.a4E = await seed.appliance(ids.u4E, 'upright-freezer', { installedOn: '2020-02-02' });
    ids.aArchivedUnit = await seed.appliance(ids.archivedUnit, 'top-freezer');
    ids.aOther = await seed.appliance(await seed.unit(ids.otherProperty, '1A'), 'top-freezer');

    devices.a1A = await seed.sensor(ids.a1A, 'cw-alder-1a');
    devices.a2Bfreezer = await seed.sensor(ids.a2Bfreezer, 'cw-Alder_2B%x');
    devices.a3D = await seed.sensor(ids.a3D, 'cw-birch-3d');
    await seed.monitor(ids.a1A, 'top-freezer', { health: 'warm', freshFoodC: 7.5, freezerC: -15 });
    await seed.monitor(ids.a2Bfreezer, 'chest-freezer', { health: 'cold', freezerC: -19 });
    await seed.monitor(ids.a2Bfridge, 'bottom-freezer', { health: 'cold', freshFoodC: 3, freezerC: -18.5 });
    await seed.monitor(ids.a3D, 'side-by-side', { health: 'drifting', freshFoodC: 3.9, freezerC: -17 });
    await seed.monitor(ids.a4E, 'upright-freezer', { health: 'no-cooling', freezerC: 4 });

    const place = { organizationId: org, propertyId: ids.alder, unitId: ids.u1A, applianceId: ids.a1A };
    ids.watchIncident = await seed.incident({ ...place, severity: 'watch', kind: 'warming-trend', openedAtIso: '2026-03-01T10:00:00Z' });
    ids.urgentIncident = await seed.incident({ ...place, severity: 'urgent', kind: 'over-temperature', openedAtIso: '2026-03-02T08:00:00Z', causes: [{ code: 'evaporator-fan', confidence: 0.7 }] });
    await seed.incident({ ...place, severity: 'critical', openedAtIso: '2026-02-01T08:00:00Z', closedAtIso: '2026-02-02T08:00:00Z' });
    ids.powerLoss = await seed.incident({ organizationId: org, propertyId: ids.birch, kind: 'power-loss', severity: 'urgent', openedAtIso: '2026-03-02T12:00:00Z' });

    const person = await seed.person('manager', org, null, 'Fleet Manager');
    manager = await world.signIn(person.email);
  }, SETUP_TIMEOUT_MS);
  afterAll(async () => world.close(), SETUP_TIMEOUT_MS);

  async function fleet(query = ''): Promise<FleetOverview> {
    const res = await manager.get(`/api/fleet${query}`);
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(200);
    return res.body;
  }

  const shownIds = (overview: FleetOverview) => overview.properties.flatMap((p) => p.units.flatMap((u) => u.appliances.map((a) => a.id)));
  const applianceIn = (overview: FleetOverview, id: string): FleetAppliance | undefined =>
    overview.properties.flatMap((p) => p.units.flatMap((u) => u.appliances)).find((a) => a.id === id);

  it('bands every active property of the organization with its units in floor order, and nothing of another organization', async () => {
    const overview = await fleet();
    expect(overview.properties.map((p) => p.name)).toEqual(['Alder House', 'Birch Court']);
    expect(overview.properties[0].units.map((u) => u.label)).toEqual(['1A', '2B', '10C']);
    expect(overview.properties[0].units[1].appliances.map((a) => a.style)).toEqual(['chest-freezer', 'bottom-freezer']);
    expect(overview.properties[0].timeZone).toBe('America/Denver');
    expect(shownIds(overview)).not.toContain(ids.aOther);
    expect(shownIds(overview)).not.toContain(ids.aArchivedUnit);
    expect(overview.total).toBe(6);
    expect(overview.propertyOptions.map((p) => p.name)).toEqual(['Alder House', 'Birch Court']);
  });

  it('counts each health word, and shows an appliance the monitor has never heard from as silent', async () => {
    const overview = await fleet();
    expect(overview.counts).toEqual({ cold: 2, drifting: 1, warm: 1, 'no-cooling': 1, silent: 1 });
    expect(applianceIn(overview, ids.a10C)?.health).toBe('silent');
    expect(overview.properties[0].counts).toEqual({ cold: 2, drifting: 0, warm: 1, 'no-cooling': 0, silent: 1 });
  });

  it('gives each tile its temperatures rounded to 0.1 °C, its age, and whether it is past its expected life', async () => {
    const overview = await fleet();
    const tile = applianceIn(overview, ids.a1A)!;
    expect([tile.freshFoodC, tile.freezerC]).toEqual([7.5, -15]);
    expect(applianceIn(overview, ids.a3D)!.freshFoodC).toBe(3.9); // stored as a PostgreSQL real: 3.9000000953…
    // 2012-01-15 to 2026-03-02 is 14.13 years.
    expect(tile.ageYears).toBe(14.1);
    // Refrigerator 13 years, freezer 11 (NAHB / Bank of America Home Equity, Study of Life Expectancy of Home Components, 2007):
    // the 14.1-year-old refrigerator and the 11.75-year-old chest freezer are past it, the 6-year-old upright freezer is not.
    expect(tile.pastExpectedLife).toBeTrue();
    expect(applianceIn(overview, ids.a2Bfreezer)!.pastExpectedLife).toBeTrue();
    expect(applianceIn(overview, ids.a4E)!.pastExpectedLife).toBeFalse();
    expect(applianceIn(overview, ids.a10C)!.ageYears).toBeNull();
    expect(applianceIn(overview, ids.a10C)!.pastExpectedLife).toBeFalse();
  });

  it('summarises the worst open incident per appliance and lists property-level incidents on their band', async () => {
    const overview = await fleet();
    const tile = applianceIn(overview, ids.a1A)!;
    expect(tile.openIncident).toEqual({ id: ids.urgentIncident, kind: 'over-temperature', severity: 'urgent', topCause: 'evaporator-fan', openedAt: '2026-03-02T08:00:00.000Z', openCount: 2 });
    expect(applianceIn(overview, ids.a3D)!.openIncident).toBeNull();
    const birch = overview.properties.find((p) => p.id === ids.birch)!;
    expect(birch.propertyIncidents.map((i) => [i.id, i.kind])).toEqual([[ids.powerLoss, 'power-loss']]);
  });

  it('filters by health but keeps the counts of every health word for the other filters', async () => {
    const overview = await fleet('?health=warm,no-cooling');
    expect(shownIds(overview).sort()).toEqual([ids.a1A, ids.a4E].sort());
    expect(overview.total).toBe(2);
    expect(overview.counts).toEqual({ cold: 2, drifting: 1, warm: 1, 'no-cooling': 1, silent: 1 });
    const repeated = await fleet('?health=warm&health=no-cooling');
    expect(shownIds(repeated).sort()).toEqual(shownIds(overview).sort());
  });

  it('filters by property and style, and the counts follow those filters', async () => {
    const byProperty = await fleet(`?property=${ids.birch}`);
    expect(shownIds(byProperty).sort()).toEqual([ids.a3D, ids.a4E].sort());
    expect(byProperty.counts).toEqual({ cold: 0, drifting: 1, warm: 0, 'no-cooling': 1, silent: 0 });
    const freezers = await fleet('?style=chest-freezer,upright-freezer');
    expect(shownIds(freezers).sort()).toEqual([ids.a2Bfreezer, ids.a4E].sort());
  });

  it('filters by age band, past expected life by the style’s own life', async () => {
    expect(shownIds(await fleet('?age=under-5')).sort()).toEqual([ids.a2Bfridge].sort());
    expect(shownIds(await fleet('?age=5-to-10')).sort()).toEqual([ids.a3D, ids.a4E].sort());
    expect(shownIds(await fleet('?age=over-10')).sort()).toEqual([ids.a1A, ids.a2Bfreezer].sort());
    // 1A is 14.1 years old (> 13 for a refrigerator); the chest freezer 11.75 (> 11 for a freezer).
    expect(shownIds(await fleet('?age=past-life')).sort()).toEqual([ids.a1A, ids.a2Bfreezer].sort());
    expect(shownIds(await fleet('?age=unknown'))).toEqual([ids.a10C]);
  });

  it('searches unit labels and sensor device ids, case-insensitively and with % and _ taken literally', async () => {
    expect(shownIds(await fleet('?q=10c'))).toEqual([ids.a10C]);
    expect(shownIds(await fleet('?q=BIRCH-3'))).toEqual([ids.a3D]);
    expect(shownIds(await fleet(`?q=${encodeURIComponent('2B%')}`))).toEqual([ids.a2Bfreezer]);
    expect(shownIds(await fleet(`?q=${encodeURIComponent('_')}`))).toEqual([ids.a2Bfreezer]);
    const none = await fleet('?q=nothing-like-this');
    expect(none.properties).toEqual([]);
    expect(none.total).toBe(0);
  });

  it('rejects an unknown health word, style or age band with 400', async () => {
    for (const query of ['?health=lukewarm', '?style=wine-cooler', '?age=ancient', '?property=not-a-uuid', '?sort=name']) {
      const res = await manager.get(`/api/fleet${query}`);
      expect(res.status).withContext(query).toBe(400);
    }
  });

  it('answers 401 signed out, 403 for tenants and contractors, and another organization’s manager sees only their own', async () => {
    const { seed } = world;
    const anonymous = new Browser(world.app);
    expect((await anonymous.get('/api/fleet')).status).toBe(401);
    const tenant = await seed.person('tenant', ids.org, ids.u1A, 'Tenant');
    expect((await (await world.signIn(tenant.email)).get('/api/fleet')).status).toBe(403);
    const contractor = await seed.person('contractor', ids.org, null, 'Contractor');
    expect((await (await world.signIn(contractor.email)).get('/api/fleet')).status).toBe(403);
    const [{ organization_id: otherOrg }] = await world.db.dataSource.query(`SELECT organization_id FROM property WHERE id = $1`, [ids.otherProperty]);
    const otherManager = await seed.person('manager', otherOrg, null, 'Other Manager');
    const theirs = (await (await world.signIn(otherManager.email)).get('/api/fleet')).body as FleetOverview;
    expect(shownIds(theirs)).toEqual([ids.aOther]);
    // Another organization's property id filters to nothing rather than leaking it.
    expect(shownIds((await manager.get(`/api/fleet?property=${ids.otherProperty}`)).body)).toEqual([]);
  });
});
