/**
 * Scope by assignment: a contractor reaches the unit, appliance and telemetry of a job
 * dispatched to their company while the job runs, and nothing else; out of reach reads
 * as missing (404). The telemetry history is the web app's route, given WorkOrderScope.
 */
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';
import type { TestDevice } from '../telemetry/support/telemetry-fixture';

describe('contractor scope by work-order assignment', () => {
  let world: WorkOrderWorld;
  let onJob: TestDevice;
  let elsewhere: TestDevice;
  let requestId: string;
  let workOrderId: string;

  beforeAll(async () => {
    world = await createWorkOrderWorld();
    onJob = await world.device(0);
    elsewhere = await world.device(1);
    const manager = await world.signedIn(world.people.manager);
    requestId = (await manager.post('/api/service-requests', { applianceId: onJob.applianceId, title: 'Fan noise' })).body.id;
    workOrderId = (await manager.post(`/api/service-requests/${requestId}/dispatch`, {})).body.workOrder.id;
  }, 30_000);
  afterAll(async () => world.close());

  const history = (applianceId: string) => `/api/appliances/${applianceId}/history?from=${encodeURIComponent(new Date(Date.now() - 86_400_000).toISOString())}&to=${encodeURIComponent(new Date().toISOString())}`;

  it('lets the contractor on the job read its appliance, unit, request and telemetry, and nothing else', async () => {
    const scope = world.workOrders.services.scope;
    const actor = { id: world.people.primaryTech.id, role: 'contractor' as const };
    const asActor = { ...actor, email: '', displayName: '', isAdmin: false, organizationId: world.place.organizationId, unitId: null, temperatureUnit: 'F' as const, timeZone: null };
    expect(await scope.canReadAppliance(asActor, onJob.applianceId)).toBeTrue();
    expect(await scope.canReadUnit(asActor, world.place.units[0])).toBeTrue();
    expect(await scope.canReadAppliance(asActor, elsewhere.applianceId)).toBeFalse();
    expect(await scope.canReadUnit(asActor, world.place.units[1])).toBeFalse();
    expect(await scope.canReadProperty(asActor, world.place.propertyId)).toBeFalse();

    const tech = await world.signedIn(world.people.primaryTech);
    expect((await tech.get(history(onJob.applianceId))).status).toBe(200);
    expect((await tech.get(history(elsewhere.applianceId))).status).toBe(404);
    expect((await tech.get(`/api/service-requests/${requestId}`)).status).toBe(200);
    expect((await tech.get('/api/work-orders')).body.items.map((item: { id: string }) => item.id)).toEqual([workOrderId]);

    for (const other of [world.people.idleTech, world.people.backupTech]) {
      const browser = await world.signedIn(other);
      expect((await browser.get(history(onJob.applianceId))).status).withContext(other.email).toBe(404);
      expect((await browser.get(`/api/work-orders/${workOrderId}`)).status).withContext(other.email).toBe(404);
      expect((await browser.get(`/api/service-requests/${requestId}`)).status).withContext(other.email).toBe(404);
      expect((await browser.get('/api/work-orders')).body.items).withContext(other.email).toEqual([]);
    }
  });

  // Its own world: jasmine runs specs in random order, and this one cancels the job.
  describe('when the job ends', () => {
    let ended: WorkOrderWorld;
    let device: TestDevice;
    let endedRequestId: string;
    let endedWorkOrderId: string;

    beforeAll(async () => {
      ended = await createWorkOrderWorld();
      device = await ended.device(0);
      const manager = await ended.signedIn(ended.people.manager);
      endedRequestId = (await manager.post('/api/service-requests', { applianceId: device.applianceId, title: 'Fan noise' })).body.id;
      endedWorkOrderId = (await manager.post(`/api/service-requests/${endedRequestId}/dispatch`, {})).body.workOrder.id;
    }, 30_000);
    afterAll(async () => ended.close());

    it('ends the reach', async () => {
      const manager = await ended.signedIn(ended.people.manager);
      const tech = await ended.signedIn(ended.people.primaryTech);
      expect((await tech.get(history(device.applianceId))).status).toBe(200);
      expect((await manager.post(`/api/service-requests/${endedRequestId}/cancel`, { reason: 'Tenant moved out' })).status).toBe(200);
      expect((await tech.get(history(device.applianceId))).status).toBe(404);
      // The job itself stays readable to the company that had it, as a record.
      expect((await tech.get(`/api/work-orders/${endedWorkOrderId}`)).body.state).toBe('cancelled');
    });
  });
});
