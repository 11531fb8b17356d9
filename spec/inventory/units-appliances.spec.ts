import type { ApplianceView, PropertyView, UnitView } from '../../shared/api/inventory';
import type { Browser } from '../auth/support/browser';
import { count, createWorld, NEW_PROPERTY, type World } from './support/inventory-world';

describe('inventory: units and appliances', () => {
  let world: World;
  let manager: Browser;
  let serial = 0;
  const addProperty = async () => (await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: `Unit Spec House ${++serial}` })).body as PropertyView;
  const addUnit = async (propertyId: string, label: string, floor?: number) => {
    const res = await manager.post(`/api/inventory/properties/${propertyId}/units`, { label, floor });
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
    return res.body as UnitView;
  };
  const addAppliance = async (unitId: string, extra: Record<string, unknown> = {}) => {
    const res = await manager.post('/api/inventory/appliances', { unitId, style: 'bottom-freezer', ...extra });
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
    return res.body as ApplianceView;
  };

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('lists units as people read door labels (2B before 10A), with their appliances', async () => {
    const property = await addProperty();
    for (const label of ['10A', '2B', 'Penthouse', '2A', '1']) await addUnit(property.id, label);
    const two = (await manager.get(`/api/inventory/properties/${property.id}/units?q=2B`)).body.items[0] as UnitView;
    await addAppliance(two.id, { model: 'Model FX-20', serial: 'SN-2B-1' });
    const page = await manager.get(`/api/inventory/properties/${property.id}/units?sort=label`);
    expect(page.body.items.map((u: UnitView) => u.label)).toEqual(['1', '2A', '2B', '10A', 'Penthouse']);
    const withAppliance = page.body.items.find((u: UnitView) => u.label === '2B');
    expect(withAppliance.appliances.map((a: ApplianceView) => [a.model, a.serial, a.propertyName])).toEqual([['Model FX-20', 'SN-2B-1', property.name]]);
    const descending = await manager.get(`/api/inventory/properties/${property.id}/units?sort=label&direction=desc&pageSize=2`);
    expect(descending.body.items.map((u: UnitView) => u.label)).toEqual(['Penthouse', '10A']);
    expect(descending.body.total).toBe(5);
  });

  it('refuses a unit label twice in one property, and edits label and floor', async () => {
    const property = await addProperty();
    const unit = await addUnit(property.id, '4C', 4);
    const twin = await manager.post(`/api/inventory/properties/${property.id}/units`, { label: '4C' });
    expect(twin.status).toBe(409);
    expect(twin.body.error).toContain('"4C" already exists');
    const changed = await manager.patch(`/api/inventory/units/${unit.id}`, { label: '4D', floor: null });
    expect(changed.body).toEqual(jasmine.objectContaining({ label: '4D', floor: null }));
    expect((await manager.patch(`/api/inventory/units/${unit.id}`, { floor: 2.5 })).status).toBe(400);
  });

  it('archives a unit with its appliances and restores them; an archived unit takes no new appliance', async () => {
    const property = await addProperty();
    const unit = await addUnit(property.id, '7');
    const appliance = await addAppliance(unit.id);
    const archived = await manager.post(`/api/inventory/units/${unit.id}/archive`);
    expect(archived.body.archivedAt).not.toBeNull();
    expect(archived.body.appliances.map((a: ApplianceView) => a.archivedAt === null)).toEqual([false]);
    expect((await manager.post('/api/inventory/appliances', { unitId: unit.id, style: 'top-freezer' })).status).toBe(409);
    expect((await manager.post(`/api/inventory/appliances/${appliance.id}/restore`)).body.error).toContain('restore the unit first');
    const restored = await manager.post(`/api/inventory/units/${unit.id}/restore`);
    expect(restored.body.appliances.map((a: ApplianceView) => a.archivedAt)).toEqual([null]);
  });

  it('creates an appliance with its style, model, serial and dates, and checks the dates', async () => {
    const property = await addProperty();
    const unit = await addUnit(property.id, '3');
    const appliance = await addAppliance(unit.id, { style: 'chest-freezer', model: 'CF-7', serial: 'X1', installedOn: '2021-05-02', warrantyEndsOn: '2022-05-02' });
    expect(appliance).toEqual(jasmine.objectContaining({ style: 'chest-freezer', installedOn: '2021-05-02', warrantyEndsOn: '2022-05-02', unitLabel: '3', sensor: null }));
    const reversed = await manager.post('/api/inventory/appliances', { unitId: unit.id, style: 'top-freezer', installedOn: '2022-01-01', warrantyEndsOn: '2021-01-01' });
    expect(reversed.status).toBe(400);
    expect(reversed.body.details).toContain(jasmine.objectContaining({ path: 'warrantyEndsOn' }));
    expect((await manager.post('/api/inventory/appliances', { unitId: unit.id, style: 'wine-cooler' })).status).toBe(400);
    expect((await manager.post('/api/inventory/appliances', { unitId: unit.id, style: 'top-freezer', installedOn: '2021-02-30' })).status).toBe(400);
    const future = await manager.post('/api/inventory/appliances', { unitId: unit.id, style: 'top-freezer', installedOn: '2999-01-01' });
    expect(future.body.error).toBe('the install date is in the future');
    // The combined dates are checked on a change too: moving the install date past the warranty end.
    const late = await manager.patch(`/api/inventory/appliances/${appliance.id}`, { installedOn: '2023-01-01' });
    expect(late.status).toBe(400);
    const moved = await manager.patch(`/api/inventory/appliances/${appliance.id}`, { model: 'CF-8', warrantyEndsOn: null });
    expect(moved.body).toEqual(jasmine.objectContaining({ model: 'CF-8', warrantyEndsOn: null, installedOn: '2021-05-02', serial: 'X1' }));
  });

  it('lists appliances across properties with filters, search and sorting', async () => {
    const property = await addProperty();
    const unit = await addUnit(property.id, '12');
    await addAppliance(unit.id, { style: 'upright-freezer', model: 'Findable UF', installedOn: '2019-01-01' });
    await addAppliance(unit.id, { style: 'fresh-food-only', model: 'Findable FF', installedOn: '2020-01-01' });
    const byProperty = await manager.get(`/api/inventory/appliances?propertyId=${property.id}&sort=installedOn&direction=desc`);
    expect(byProperty.body.items.map((a: ApplianceView) => a.model)).toEqual(['Findable FF', 'Findable UF']);
    const byStyle = await manager.get(`/api/inventory/appliances?propertyId=${property.id}&style=upright-freezer`);
    expect(byStyle.body.items.map((a: ApplianceView) => a.model)).toEqual(['Findable UF']);
    const bySearch = await manager.get('/api/inventory/appliances?q=findable%20ff');
    expect(bySearch.body.items.map((a: ApplianceView) => a.model)).toEqual(['Findable FF']);
  });

  it("keeps each organization's units and appliances to itself", async () => {
    const { org1, org2 } = world.fixtures;
    const outsider = await world.signedIn('adminOrg2');
    expect((await outsider.get(`/api/inventory/units/${org1.unitA}`)).status).toBe(404);
    expect((await outsider.get(`/api/inventory/appliances/${org1.applianceA}`)).status).toBe(404);
    expect((await outsider.patch(`/api/inventory/appliances/${org1.applianceA}`, { model: 'X' })).status).toBe(404);
    expect((await outsider.get(`/api/inventory/properties/${org1.propertyId}/units`)).status).toBe(404);
    // Moving one's own appliance into another organization's unit reads as a missing unit.
    const moved = await outsider.patch(`/api/inventory/appliances/${org2.applianceC}`, { unitId: org1.unitA });
    expect(moved.status).toBe(404);
    expect(moved.body.error).toBe('unit not found');
    expect(await count(world, `SELECT 1 FROM appliance WHERE id = $1 AND unit_id = $2`, [org2.applianceC, org2.unitC])).toBe(1);
    expect((await outsider.get('/api/inventory/appliances')).body.items.map((a: ApplianceView) => a.id)).toEqual([org2.applianceC]);
    expect((await (await world.signedIn('tenantA')).get(`/api/inventory/units/${org1.unitA}`)).status).toBe(403);
  });
});
