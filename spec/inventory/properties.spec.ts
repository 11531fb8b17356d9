import type { PropertyView } from '../../shared/api/inventory';
import type { Browser } from '../auth/support/browser';
import { count, createWorld, NEW_PROPERTY, type World } from './support/inventory-world';

describe('inventory: properties', () => {
  let world: World;
  let manager: Browser;
  let serial = 0;
  /** A property of org 1 with a name no other spec uses (specs run in random order). */
  const addProperty = async (prefix = 'Spec') => {
    const res = await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: `${prefix} House ${++serial}` });
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
    return res.body as PropertyView;
  };

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('creates a property with its address and time zone, and lists it with its counts', async () => {
    const created = await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, timeZone: 'america/chicago' });
    expect(created.status).toBe(201);
    // The time zone is stored as the IANA name the runtime spells, whatever the case given.
    expect(created.body).toEqual(jasmine.objectContaining({ name: 'Alder Court', city: 'Springfield', country: 'US', timeZone: 'America/Chicago', unitCount: 0, archivedAt: null }));
    const list = await manager.get('/api/inventory/properties?q=Alder');
    expect(list.body.items.map((p: PropertyView) => p.id)).toEqual([created.body.id]);
    const cedar = (await manager.get('/api/inventory/properties?q=Cedar%20Row&status=all')).body.items[0];
    expect(cedar).toEqual(jasmine.objectContaining({ unitCount: 2, applianceCount: 1, sensorCount: 0 }));
  });

  it('refuses an unknown time zone, a bad country code and a second active property of the same name', async () => {
    const badZone = await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: 'Elsewhere', timeZone: 'Mars/Olympus' });
    expect(badZone.status).toBe(400);
    expect(badZone.body.details).toContain(jasmine.objectContaining({ path: 'timeZone' }));
    const badCountry = await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: 'Elsewhere', country: 'USA' });
    expect(badCountry.body.details).toContain(jasmine.objectContaining({ path: 'country' }));
    const first = await addProperty('Twin');
    const twin = await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: first.name.toUpperCase() });
    expect(twin.status).toBe(409);
    expect(twin.body.error).toContain('already exists');
  });

  it('edits only the fields given, and searches by name, street or city', async () => {
    const property = await addProperty('Editable');
    await manager.patch(`/api/inventory/properties/${property.id}`, { country: 'CA', addressLine1: '9 Sample Lane' });
    const changed = await manager.patch(`/api/inventory/properties/${property.id}`, { addressLine2: 'Building B', timeZone: 'America/New_York' });
    expect(changed.status).toBe(200);
    expect(changed.body).toEqual(jasmine.objectContaining({ addressLine2: 'Building B', timeZone: 'America/New_York', addressLine1: '9 Sample Lane', country: 'CA' }));
    const byStreet = await manager.get('/api/inventory/properties?q=Sample%20Lane');
    expect(byStreet.body.items.map((p: PropertyView) => p.id)).toEqual([property.id]);
    const empty = await manager.patch(`/api/inventory/properties/${property.id}`, {});
    expect(empty.status).toBe(400);
  });

  it('pages and sorts on the server', async () => {
    const names = ['Zz Paging Birch', 'Zz Paging Dogwood', 'Zz Paging Elm'];
    for (const name of names) expect((await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name })).status).toBe(201);
    const first = await manager.get('/api/inventory/properties?q=Zz%20Paging&sort=name&direction=desc&pageSize=2&page=0');
    const second = await manager.get('/api/inventory/properties?q=Zz%20Paging&sort=name&direction=desc&pageSize=2&page=1');
    expect(first.body.items.map((p: PropertyView) => p.name)).toEqual(['Zz Paging Elm', 'Zz Paging Dogwood']);
    expect(second.body.items.map((p: PropertyView) => p.name)).toEqual(['Zz Paging Birch']);
    expect(first.body).toEqual(jasmine.objectContaining({ total: 3, page: 0, pageSize: 2 }));
    expect((await manager.get('/api/inventory/properties?pageSize=1000')).status).toBe(400);
    expect((await manager.get('/api/inventory/properties?sort=color')).status).toBe(400);
  });

  it('archives a property with everything under it, and restores exactly what was archived with it', async () => {
    const property = await addProperty('Archivable');
    const unit = (label: string) => manager.post(`/api/inventory/properties/${property.id}/units`, { label });
    const unitOne = (await unit('1')).body.id;
    const unitTwo = (await unit('2')).body.id;
    const appliance = await manager.post('/api/inventory/appliances', { unitId: unitOne, style: 'top-freezer' });
    const paired = await manager.post(`/api/inventory/appliances/${appliance.body.id}/sensor`, {});
    // Unit 2 was archived on its own before: restoring the property must leave it archived.
    expect((await manager.post(`/api/inventory/units/${unitTwo}/archive`)).status).toBe(200);

    const archived = await manager.post(`/api/inventory/properties/${property.id}/archive`);
    expect(archived.status).toBe(200);
    expect(archived.body.archivedAt).not.toBeNull();
    expect(await count(world, `SELECT 1 FROM unit WHERE property_id = $1 AND archived_at IS NULL`, [property.id])).toBe(0);
    expect(await count(world, `SELECT 1 FROM appliance WHERE id = $1 AND archived_at IS NOT NULL`, [appliance.body.id])).toBe(1);
    expect(await count(world, `SELECT 1 FROM sensor WHERE id = $1 AND archived_at IS NOT NULL`, [paired.body.sensor.id])).toBe(1);
    expect((await manager.get('/api/inventory/properties?q=Archivable')).body.total).toBe(0);
    expect((await manager.get('/api/inventory/properties?q=Archivable&status=archived')).body.items.map((p: PropertyView) => p.id)).toEqual([property.id]);
    expect((await manager.post(`/api/inventory/properties/${property.id}/units`, { label: '3' })).status).toBe(409);

    const restored = await manager.post(`/api/inventory/properties/${property.id}/restore`);
    expect(restored.status).toBe(200);
    expect(restored.body).toEqual(jasmine.objectContaining({ archivedAt: null, unitCount: 1, applianceCount: 1, sensorCount: 1 }));
    expect(await count(world, `SELECT 1 FROM unit WHERE id = $1 AND archived_at IS NOT NULL`, [unitTwo])).toBe(1);
  });

  it("answers another organization's property as missing, and tenants and contractors not at all", async () => {
    const { org2 } = world.fixtures;
    const mine = await addProperty('Private');
    const outsider = await world.signedIn('adminOrg2');
    expect((await outsider.get('/api/inventory/properties')).body.items.map((p: PropertyView) => p.name)).toEqual(['Quarry Lane']);
    for (const res of [
      await outsider.get(`/api/inventory/properties/${mine.id}`),
      await outsider.patch(`/api/inventory/properties/${mine.id}`, { name: 'Taken Over' }),
      await outsider.post(`/api/inventory/properties/${mine.id}/archive`),
      await outsider.post(`/api/inventory/properties/${mine.id}/units`, { label: '9Z' }),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('property not found');
    }
    expect((await manager.get(`/api/inventory/properties/${org2.propertyId}`)).status).toBe(404);
    expect((await (await world.signedIn('tenantA')).get('/api/inventory/properties')).status).toBe(403);
    expect((await (await world.signedIn('contractorWithJob')).post('/api/inventory/properties', NEW_PROPERTY)).status).toBe(403);
    expect((await world.browser().get('/api/inventory/properties')).status).toBe(401);
  });
});
