import type { ApplianceView, PropertyView, SensorCredentials, SensorView, UnitView } from '../../shared/api/inventory';
import { DEVICE_ID_PATTERN } from '../../shared/telemetry';
import { verifyDeviceSecret } from '../../server/telemetry/device-secret';
import type { Browser } from '../auth/support/browser';
import { createWorld, NEW_PROPERTY, type World } from './support/inventory-world';

describe('inventory: sensors and pairing', () => {
  let world: World;
  let manager: Browser;
  let serial = 0;

  /** A fresh appliance of org 1 (specs run in random order, so each makes its own). */
  const addAppliance = async (style = 'top-freezer'): Promise<ApplianceView> => {
    const property: PropertyView = (await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: `Sensor Spec House ${++serial}` })).body;
    const unit: UnitView = (await manager.post(`/api/inventory/properties/${property.id}/units`, { label: '1' })).body;
    return (await manager.post('/api/inventory/appliances', { unitId: unit.id, style })).body;
  };
  const storedHash = async (sensorId: string): Promise<string> => (await world.db.dataSource.query(`SELECT secret_hash FROM sensor WHERE id = $1`, [sensorId]))[0].secret_hash;

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('pairs a sensor: answers its device id and a one-time secret that only the stored hash can confirm', async () => {
    const appliance = await addAppliance();
    const res = await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, { intervalSeconds: 60 });
    expect(res.status).toBe(201);
    expect(res.headers['cache-control']).toBe('no-store');
    const paired: SensorCredentials = res.body;
    expect(paired.deviceId).toMatch(DEVICE_ID_PATTERN);
    expect(paired.sensor).toEqual(jasmine.objectContaining({ deviceId: paired.deviceId, applianceId: appliance.id, intervalSeconds: 60, archivedAt: null }));
    // 32 random bytes in base64url: 43 characters (RFC 4648 §5, no padding).
    expect(paired.secret).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const hash = await storedHash(paired.sensor.id);
    expect(hash).not.toContain(paired.secret);
    expect(await verifyDeviceSecret(paired.secret, hash)).toBeTrue();
    // Change the first character: the last one of unpadded base64url carries spare bits a
    // decoder ignores (RFC 4648 §3.5), and it may already be the replacement.
    const wrong = `${paired.secret[0] === 'A' ? 'B' : 'A'}${paired.secret.slice(1)}`;
    expect(await verifyDeviceSecret(wrong, hash)).toBeFalse();
    // The secret is never shown again.
    const again = await manager.get(`/api/inventory/sensors/${paired.sensor.id}`);
    expect(JSON.stringify(again.body)).not.toContain(paired.secret);
    expect((await manager.get(`/api/inventory/appliances/${appliance.id}`)).body.sensor).toEqual(jasmine.objectContaining({ deviceId: paired.deviceId }));
  });

  it('keeps one sensor per appliance unless the manager replaces it, and device ids unique', async () => {
    const appliance = await addAppliance();
    const first: SensorCredentials = (await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, { deviceId: 'spec-device-0001' })).body;
    expect(first.deviceId).toBe('spec-device-0001');
    const second = await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, {});
    expect(second.status).toBe(409);
    expect(second.body.error).toContain('spec-device-0001');
    const other = await addAppliance();
    expect((await manager.post(`/api/inventory/appliances/${other.id}/sensor`, { deviceId: 'spec-device-0001' })).status).toBe(409);
    expect((await manager.post(`/api/inventory/appliances/${other.id}/sensor`, { deviceId: 'has space' })).status).toBe(400);
    const replaced = await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, { replace: true });
    expect(replaced.status).toBe(201);
    expect((await manager.get(`/api/inventory/sensors/${first.sensor.id}`)).body.archivedAt).not.toBeNull();
    // The retired sensor cannot come back while its appliance has the new one.
    expect((await manager.post(`/api/inventory/sensors/${first.sensor.id}/restore`)).status).toBe(409);
  });

  it('issues a new secret that replaces the old one at once', async () => {
    const appliance = await addAppliance();
    const paired: SensorCredentials = (await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, {})).body;
    const renewed = await manager.post(`/api/inventory/sensors/${paired.sensor.id}/secret`);
    expect(renewed.status).toBe(200);
    expect(renewed.body.deviceId).toBe(paired.deviceId);
    expect(renewed.body.secret).not.toBe(paired.secret);
    const hash = await storedHash(paired.sensor.id);
    expect(await verifyDeviceSecret(renewed.body.secret, hash)).toBeTrue();
    expect(await verifyDeviceSecret(paired.secret, hash)).toBeFalse();
  });

  it('moves a sensor to another appliance, changes its interval, retires and restores it', async () => {
    const from = await addAppliance();
    const to = await addAppliance('upright-freezer');
    const paired: SensorCredentials = (await manager.post(`/api/inventory/appliances/${from.id}/sensor`, {})).body;
    const moved = await manager.patch(`/api/inventory/sensors/${paired.sensor.id}`, { applianceId: to.id, intervalSeconds: 120 });
    expect(moved.body).toEqual(jasmine.objectContaining({ applianceId: to.id, intervalSeconds: 120, style: 'upright-freezer' }));
    expect((await manager.get(`/api/inventory/appliances/${from.id}`)).body.sensor).toBeNull();
    expect((await manager.patch(`/api/inventory/sensors/${paired.sensor.id}`, { intervalSeconds: 5 })).status).toBe(400);
    const archived = await manager.post(`/api/inventory/sensors/${paired.sensor.id}/archive`);
    expect(archived.body.archivedAt).not.toBeNull();
    expect((await manager.patch(`/api/inventory/sensors/${paired.sensor.id}`, { intervalSeconds: 60 })).status).toBe(409);
    expect((await manager.post(`/api/inventory/sensors/${paired.sensor.id}/secret`)).status).toBe(409);
    const listed = await manager.get(`/api/inventory/sensors?status=archived&q=${paired.deviceId}`);
    expect(listed.body.items.map((s: SensorView) => s.id)).toEqual([paired.sensor.id]);
    expect((await manager.post(`/api/inventory/sensors/${paired.sensor.id}/restore`)).body.archivedAt).toBeNull();
  });

  it('archiving an appliance retires its sensor, and restoring it brings the sensor back', async () => {
    const appliance = await addAppliance();
    const paired: SensorCredentials = (await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, {})).body;
    expect((await manager.post(`/api/inventory/appliances/${appliance.id}/archive`)).body.sensor).toBeNull();
    expect((await manager.get(`/api/inventory/sensors/${paired.sensor.id}`)).body.archivedAt).not.toBeNull();
    expect((await manager.post(`/api/inventory/appliances/${appliance.id}/sensor`, {})).status).toBe(409);
    const restored = await manager.post(`/api/inventory/appliances/${appliance.id}/restore`);
    expect(restored.body.sensor).toEqual(jasmine.objectContaining({ id: paired.sensor.id }));
  });

  it("never pairs to, lists or moves into another organization's appliances", async () => {
    const { org1, org2 } = world.fixtures;
    const outsider = await world.signedIn('adminOrg2');
    expect((await outsider.post(`/api/inventory/appliances/${org1.applianceA}/sensor`, {})).status).toBe(404);
    const theirs: SensorCredentials = (await outsider.post(`/api/inventory/appliances/${org2.applianceC}/sensor`, { replace: true })).body;
    expect((await manager.get(`/api/inventory/sensors/${theirs.sensor.id}`)).status).toBe(404);
    expect((await manager.post(`/api/inventory/sensors/${theirs.sensor.id}/secret`)).status).toBe(404);
    const mine = await addAppliance();
    expect((await outsider.patch(`/api/inventory/sensors/${theirs.sensor.id}`, { applianceId: mine.id })).status).toBe(404);
    const myList = await manager.get('/api/inventory/sensors?status=all&pageSize=200');
    expect(myList.body.items.map((s: SensorView) => s.id)).not.toContain(theirs.sensor.id);
    expect((await (await world.signedIn('tenantA')).post(`/api/inventory/appliances/${org1.applianceA}/sensor`, {})).status).toBe(403);
  });
});
