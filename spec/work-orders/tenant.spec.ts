/**
 * The tenant's side: a report on an appliance with an open request joins it (one request
 * per appliance problem); the tenant of another unit sees none of it; the status page
 * speaks the health words and carries food-safety guidance after USDA FSIS.
 */
import sharp from 'sharp';
import { foodSafetyGuidance } from '../../server/work-orders/food-safety';
import type { TenantReportInput } from '../../shared/api/tenant';
import { DANGER_ZONE_DISCARD_MINUTES } from '../../shared/temperature';
import type { Browser } from '../auth/support/browser';
import type { TestDevice } from '../telemetry/support/telemetry-fixture';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

function report(browser: Browser, body: TenantReportInput, photos: { content: Buffer; name: string }[] = []) {
  let call = browser.agent.post('/api/tenant/reports').set('X-XSRF-TOKEN', browser.csrfToken).field('report', JSON.stringify(body));
  for (const photo of photos) call = call.attach('photos', photo.content, { filename: photo.name, contentType: 'image/jpeg' });
  return call;
}

describe('tenant reports and status', () => {
  let world: WorkOrderWorld;
  let applianceA: TestDevice;
  let applianceB: TestDevice;
  const window = { from: '2026-12-03T16:00:00Z', to: '2026-12-03T20:00:00Z' };

  let opened: { id: string };
  let filed: { status: number; body: { attached: boolean; request: { id: string; priority: string; symptoms: string[]; reports: { photoIds: string[] }[] } } };

  // One story for the whole file: the manager opens a request, tenant A reports with a photo, the job is dispatched.
  beforeAll(async () => {
    world = await createWorkOrderWorld();
    applianceA = await world.device(0);
    applianceB = await world.device(1);
    const manager = await world.signedIn(world.people.manager);
    opened = (await manager.post('/api/service-requests', { applianceId: applianceA.applianceId, priority: 'routine', title: 'Warming trend' })).body;
    const tenant = await world.signedIn(world.people.tenantA);
    const photo = await sharp({ create: { width: 30, height: 30, channels: 3, background: '#eeeeee' } }).jpeg().toBuffer();
    filed = await report(tenant, { symptoms: ['fridge-not-cold', 'noise'], description: 'Milk went sour overnight', accessWindows: [window], petPresent: true }, [{ content: photo, name: 'fridge.jpg' }]);
    await manager.post(`/api/service-requests/${opened.id}/dispatch`, {});
  }, 30_000);
  afterAll(async () => world.close());

  it('adds a report to the open request of the appliance instead of opening a second one', async () => {
    expect(filed.status).toBe(200);
    expect(filed.body.attached).toBeTrue();
    expect(filed.body.request.id).toBe(opened.id);
    // "Fridge not cold" puts food at risk: the request becomes urgent.
    expect(filed.body.request.priority).toBe('urgent');
    expect(filed.body.request.symptoms).toEqual(['fridge-not-cold', 'noise']);
    expect(filed.body.request.reports.length).toBe(1);
    expect(filed.body.request.reports[0].photoIds.length).toBe(1);
    const [count] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM service_request WHERE appliance_id = $1`, [applianceA.applianceId]);
    expect(count.n).toBe(1);

    const confirmation = (await world.mailTo(world.people.tenantA.email)).find((m) => m.subject.startsWith('We received your report'));
    expect(confirmation?.text).toContain('already open');
    const toManager = await world.mailTo(world.people.manager.email);
    expect(toManager.some((m) => m.subject.startsWith('Tenant report added'))).toBeTrue();

    // The contractor's dispatch carries the tenant's access window and the pet.
    const dispatch = (await world.mailTo('dispatch@frostline.example.com')).find((m) => m.subject.includes('Warming trend'));
    expect(dispatch?.text).toContain('A pet lives in the unit.');
    expect(dispatch?.text).toContain('Access: Dec 3, 2026');
    expect(dispatch?.text).toContain('The tenant reports: The fridge is not cold; Strange or loud noise.');
  });

  it("keeps a unit's requests, reports and photos from the tenant of another unit", async () => {
    const tenantA = await world.signedIn(world.people.tenantA);
    const tenantB = await world.signedIn(world.people.tenantB);
    const mine = (await tenantA.get(`/api/service-requests/${opened.id}`)).body;
    expect(mine.applianceId).toBe(applianceA.applianceId);
    expect((await tenantA.get('/api/service-requests')).body.items.map((r: { id: string }) => r.id)).toContain(opened.id);
    expect((await tenantB.get(`/api/service-requests/${mine.id}`)).status).toBe(404);
    expect((await tenantB.get('/api/service-requests')).body.items.map((r: { id: string }) => r.id)).not.toContain(mine.id);
    const photoUrl = `/api/attachments/${mine.reports[0].photoIds[0]}`;
    expect((await tenantA.agent.get(photoUrl)).status).toBe(200);
    expect((await tenantB.agent.get(photoUrl)).status).toBe(404);
    expect((await (await world.signedIn(world.people.manager)).agent.get(photoUrl)).status).toBe(200);
    // The contractor on the job sees the tenant's photo; one without a job does not.
    expect((await (await world.signedIn(world.people.primaryTech)).agent.get(photoUrl)).status).toBe(200);
    expect((await (await world.signedIn(world.people.idleTech)).agent.get(photoUrl)).status).toBe(404);
    // Nor can tenant B report on A's appliance.
    expect((await report(tenantB, { applianceId: applianceA.applianceId, symptoms: ['noise'] })).status).toBe(404);
  });

  it('opens a new routine request for a report on an appliance without one, and validates the form', async () => {
    const tenantB = await world.signedIn(world.people.tenantB);
    expect((await report(tenantB, { symptoms: [] })).status).toBe(400);
    expect((await report(tenantB, { symptoms: ['other'] })).status).toBe(400);
    const res = await report(tenantB, { symptoms: ['ice-build-up'], description: 'Frost on the back wall' });
    expect(res.status).toBe(201);
    expect(res.body.attached).toBeFalse();
    expect(res.body.request.source).toBe('tenant');
    expect(res.body.request.priority).toBe('routine');
    expect(res.body.request.progress).toBe('received');
    expect(res.body.request.applianceId).toBe(applianceB.applianceId);
  });

  it('shows the tenant their appliance in the health words with guidance', async () => {
    const tenantA = await world.signedIn(world.people.tenantA);
    const home = await tenantA.get('/api/tenant/home');
    expect(home.status).toBe(200);
    expect(home.body.unit.id).toBe(world.place.units[0]);
    const [appliance] = home.body.appliances;
    expect(appliance.id).toBe(applianceA.applianceId);
    // No reading yet: the sensor is silent.
    expect(appliance.health).toBe('silent');
    expect(appliance.openRequest.progress).toBe('dispatched');
    expect(appliance.guidance.sources.join(' ')).toContain('local health authority');
    expect((await (await world.signedIn(world.people.manager)).get('/api/tenant/home')).status).toBe(403);
  });

  describe('food-safety guidance', () => {
    it('says to discard perishables only after more than 2 hours above 40 °F', () => {
      // USDA FSIS, "Danger Zone (40 °F – 140 °F)": perishables above 40 °F for more than 2 hours are discarded.
      expect(DANGER_ZONE_DISCARD_MINUTES).toBe(120);
      expect(foodSafetyGuidance('warm', 119).headline).not.toContain('thrown away');
      expect(foodSafetyGuidance('warm', 121).headline).toContain('thrown away');
      expect(foodSafetyGuidance('warm', 121).headline).toContain('2 hours 1 minute');
    });

    it('tells to keep doors closed: about 4 hours for a closed fridge, about 48 for a full freezer', () => {
      // USDA FSIS, "Keeping Food Safe During an Emergency".
      const advice = foodSafetyGuidance('no-cooling', 0).advice.join(' ');
      expect(advice).toContain('about 4 hours');
      expect(advice).toContain('about 48 hours');
      expect(advice).toContain('1 hour if the room is above 90 °F');
    });

    it('gives no discard advice while the appliance is cold', () => {
      const cold = foodSafetyGuidance('cold', 0);
      expect(cold.atRisk).toBeFalse();
      expect(cold.advice).toEqual([]);
    });
  });
});
