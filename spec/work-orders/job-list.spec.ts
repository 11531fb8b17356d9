/**
 * What the contractor's job list carries for each job so the technician can plan the day
 * without opening it: the property's time zone, the tenant's access windows and pet, and
 * the engine's suspected cause when an incident opened the request.
 */
import type { TenantReportInput } from '../../shared/api/tenant';
import type { WorkOrderSummary } from '../../shared/api/work-orders';
import type { Browser } from '../auth/support/browser';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

function report(browser: Browser, body: TenantReportInput) {
  return browser.agent.post('/api/tenant/reports').set('X-XSRF-TOKEN', browser.csrfToken).field('report', JSON.stringify(body));
}

describe('the contractor job list', () => {
  let world: WorkOrderWorld;
  let withReport: string;
  let fromIncident: string;
  const window = { from: '2026-12-03T16:00:00Z', to: '2026-12-03T20:00:00Z' };

  beforeAll(async () => {
    world = await createWorkOrderWorld();
    const reported = await world.device(0);
    const watched = await world.device(1);
    const manager = await world.signedIn(world.people.manager);
    const first = (await manager.post('/api/service-requests', { applianceId: reported.applianceId, title: 'Warm fridge' })).body;
    const filed = await report(await world.signedIn(world.people.tenantA), { symptoms: ['fridge-not-cold'], accessWindows: [window], petPresent: true });
    expect(filed.status).withContext(JSON.stringify(filed.body)).toBe(200);
    withReport = (await manager.post(`/api/service-requests/${first.id}/dispatch`, {})).body.workOrder.id;

    const second = (await manager.post('/api/service-requests', { applianceId: watched.applianceId, title: 'Freezer creeping up' })).body;
    const [incident] = await world.db.dataSource.query(
      `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, severity, top_cause, probable_causes)
       VALUES ($1, $2, $3, $4, 'appliance', 'spec-job-list', 'repair', 'warming-trend', ARRAY['warming-trend'], now(), now(), 'watch', 'evaporator-fan', $5) RETURNING id`,
      [world.place.organizationId, world.place.propertyId, world.place.units[1], watched.applianceId, JSON.stringify([{ code: 'evaporator-fan', confidence: 0.7 }])],
    );
    await world.db.dataSource.query(`UPDATE service_request SET incident_id = $1 WHERE id = $2`, [incident.id, second.id]);
    fromIncident = (await manager.post(`/api/service-requests/${second.id}/dispatch`, {})).body.workOrder.id;
  }, 30_000);
  afterAll(async () => world.close());

  it('gives each job its time zone, access windows, pet note and suspected cause', async () => {
    const tech = await world.signedIn(world.people.primaryTech);
    const list = (await tech.get('/api/work-orders')).body.items as WorkOrderSummary[];
    const reported = list.find((item) => item.id === withReport)!;
    const watched = list.find((item) => item.id === fromIncident)!;
    expect(reported.property.timeZone).toBe('America/Los_Angeles');
    expect(reported.accessWindows).toEqual([window]);
    expect(reported.petPresent).toBeTrue();
    expect(reported.suspectedCause).toBeNull();
    expect(watched.accessWindows).toEqual([]);
    expect(watched.petPresent).toBeFalse();
    expect(watched.suspectedCause).toBe('evaporator-fan');

    // The page of one job says the same.
    const one = (await tech.get(`/api/work-orders/${withReport}`)).body;
    expect(one.accessWindows).toEqual([window]);
    expect(one.petPresent).toBeTrue();
    expect(one.property.timeZone).toBe('America/Los_Angeles');
  });
});
