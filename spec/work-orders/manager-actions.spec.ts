/**
 * What managers and contractors do by hand: contractors and coverage, settings, opening,
 * dispatching, reprioritising, cancelling and merging requests, declines passed to the
 * backup, the order of a job's steps, costs, and muting non-urgent e-mail.
 */
import { DEFAULT_ORG_SETTINGS } from '../../server/work-orders/org-settings';
import type { Browser } from '../auth/support/browser';
import { MINUTE_MS } from '../monitor/support/monitor-rig';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

describe('managing requests and work orders', () => {
  let world: WorkOrderWorld;
  let manager: Browser;

  beforeAll(async () => {
    world = await createWorkOrderWorld({ units: 4 });
    manager = await world.signedIn(world.people.manager);
  }, 30_000);
  afterAll(async () => world.close());

  async function openRequest(unitIndex: number, priority: 'urgent' | 'routine' = 'routine'): Promise<string> {
    const device = await world.device(unitIndex);
    const res = await manager.post('/api/service-requests', { applianceId: device.applianceId, priority, title: 'Check the cooling' });
    expect(res.status).toBe(201);
    return res.body.id;
  }

  it('keeps contractors and the coverage table per organization', async () => {
    const created = await manager.post('/api/contractors', { name: 'Glacier Fix (spec)', email: 'hello@glacierfix.example.com', phone: '555-0150' });
    expect(created.status).toBe(201);
    expect((await manager.post('/api/contractors', { name: 'glacier fix (spec)', email: 'x@example.com' })).status).toBe(409);
    expect((await manager.post(`/api/contractors/${created.body.id}/members`, { userId: world.people.idleTech.id })).body.members.length).toBe(1);
    expect((await manager.post(`/api/contractors/${created.body.id}/members`, { userId: world.people.tenantA.id })).status).toBe(400);

    const slot = { propertyId: world.place.propertyId, applianceStyle: 'chest-freezer', rank: 'primary', contractorId: created.body.id };
    const table = await manager.send('put', '/api/coverage', slot);
    expect(table.status).toBe(200);
    expect(table.body.some((row: { applianceStyle: string | null; contractorId: string }) => row.applianceStyle === 'chest-freezer' && row.contractorId === created.body.id)).toBeTrue();
    expect((await manager.send('put', '/api/coverage', { ...slot, rank: 'backup' })).status).toBe(400);
    // The style's own row wins over the property-wide one.
    const chest = await world.device(3, 'chest-freezer');
    const coverage = world.workOrders.services.coverage;
    expect((await coverage.covering(world.db.dataSource, world.place.propertyId, 'chest-freezer', 'primary'))?.contractorId).toBe(created.body.id);
    expect((await coverage.covering(world.db.dataSource, world.place.propertyId, 'top-freezer', 'primary'))?.contractorId).toBe(world.contractors.primary);
    expect(chest.applianceId).toBeDefined();
    expect((await manager.send('put', '/api/coverage', { ...slot, contractorId: null })).status).toBe(200);
    expect((await coverage.covering(world.db.dataSource, world.place.propertyId, 'chest-freezer', 'primary'))?.contractorId).toBe(world.contractors.primary);

    const outsider = await world.signedIn(world.people.outsider);
    expect((await outsider.get('/api/contractors')).body).toEqual([]);
    expect((await outsider.patch(`/api/contractors/${created.body.id}`, { name: 'Taken over' })).status).toBe(404);
    expect((await outsider.send('put', '/api/coverage', slot)).status).toBe(404);
    expect((await (await world.signedIn(world.people.tenantA)).get('/api/contractors')).status).toBe(403);
  });

  it('uses the organization settings for due times, and refuses nonsense settings', async () => {
    const view = await manager.get('/api/org-settings');
    expect(view.body.defaults).toEqual(DEFAULT_ORG_SETTINGS);
    expect(view.body.reasons.responseMinutes).toContain('USDA FSIS');
    expect((await manager.patch('/api/org-settings', { escalateAfterMinutes: 0 })).status).toBe(400);
    expect((await manager.patch('/api/org-settings', { responseMinutes: { urgent: 120 } })).body.settings.responseMinutes).toEqual({ urgent: 120, routine: DEFAULT_ORG_SETTINGS.responseMinutes.routine });
    try {
      const requestId = await openRequest(0, 'urgent');
      const dispatched = await manager.post(`/api/service-requests/${requestId}/dispatch`, {});
      expect(Date.parse(dispatched.body.workOrder.dueAt) - world.clock.currentMs).toBe(120 * MINUTE_MS);
      // Reprioritised to routine, the job's due time follows from its dispatch.
      const routine = await manager.patch(`/api/service-requests/${requestId}`, { priority: 'routine' });
      expect(Date.parse(routine.body.workOrder.dueAt) - world.clock.currentMs).toBe(DEFAULT_ORG_SETTINGS.responseMinutes.routine * MINUTE_MS);
      await manager.post(`/api/service-requests/${requestId}/cancel`, { reason: 'spec done' });
    } finally {
      await manager.patch('/api/org-settings', { responseMinutes: DEFAULT_ORG_SETTINGS.responseMinutes });
    }
    expect((await (await world.signedIn(world.people.primaryTech)).get('/api/org-settings')).status).toBe(403);
  });

  it('allows one open request per appliance', async () => {
    const requestId = await openRequest(1);
    const [row] = await world.db.dataSource.query(`SELECT appliance_id FROM service_request WHERE id = $1`, [requestId]);
    const second = await manager.post('/api/service-requests', { applianceId: row.appliance_id, title: 'Again' });
    expect(second.status).toBe(409);
    expect(second.body.error).toContain(requestId);
    await manager.post(`/api/service-requests/${requestId}/cancel`, { reason: 'spec done' });
  });

  it('passes a declined job to the backup contractor and tells the manager', async () => {
    const requestId = await openRequest(2, 'urgent');
    const first = (await manager.post(`/api/service-requests/${requestId}/dispatch`, {})).body.workOrder.id;
    const primary = await world.signedIn(world.people.primaryTech);
    expect((await primary.post(`/api/work-orders/${first}/decline`, { reason: 'No technician free today' })).status).toBe(200);
    const request = (await manager.get(`/api/service-requests/${requestId}`)).body;
    expect(request.workOrder.id).not.toBe(first);
    expect(request.workOrder.contractorName).toBe('Coldbay Service (spec)');
    expect((await world.mailTo(world.people.manager.email)).some((m) => m.subject.startsWith('Declined:') && m.text.includes('No technician free today'))).toBeTrue();
    const backup = await world.signedIn(world.people.backupTech);
    expect((await backup.post(`/api/work-orders/${request.workOrder.id}/decline`, { reason: 'Too far' })).status).toBe(200);
    // Nobody left to pass it to: the request waits for the manager.
    expect((await manager.get(`/api/service-requests/${requestId}`)).body.progress).toBe('received');
    await manager.post(`/api/service-requests/${requestId}/cancel`, { reason: 'spec done' });
  });

  it('takes a job through its steps in order, records who did what, and lets the manager decide the cost', async () => {
    const requestId = await openRequest(0);
    const id = (await manager.post(`/api/service-requests/${requestId}/dispatch`, {})).body.workOrder.id;
    const tech = await world.signedIn(world.people.primaryTech);
    const complete = { causeFound: 'door-seal', findings: 'Gasket torn at the hinge side; replaced.' };
    expect((await tech.post(`/api/work-orders/${id}/complete`, complete)).status).toBe(409);
    expect((await tech.post(`/api/work-orders/${id}/accept`)).status).toBe(200);
    expect((await tech.post(`/api/work-orders/${id}/accept`)).status).toBe(409);
    expect((await manager.post(`/api/work-orders/${id}/accept`)).status).toBe(403);
    expect((await (await world.signedIn(world.people.idleTech)).post(`/api/work-orders/${id}/arrive`, {})).status).toBe(404);
    expect((await manager.post(`/api/work-orders/${id}/cost/approve`, {})).status).toBe(409);
    const schedule = await tech.post(`/api/work-orders/${id}/schedule`, { startAt: '2026-12-05T17:00:00Z', endAt: '2026-12-05T19:00:00Z' });
    expect(schedule.body.scheduledStartAt).toBe('2026-12-05T17:00:00.000Z');
    expect((await world.mailTo(world.people.tenantA.email)).some((m) => m.subject.startsWith('Repair visit scheduled'))).toBeTrue();
    expect((await tech.post(`/api/work-orders/${id}/arrive`, { notes: 'Tenant home' })).status).toBe(200);
    expect((await tech.post(`/api/work-orders/${id}/parts`, { name: 'Door gasket', quantity: 1, unitCostCents: 4999, currency: 'EUR' })).status).toBe(409);
    expect((await tech.post(`/api/work-orders/${id}/parts`, { name: 'Door gasket', quantity: 2, unitCostCents: 4999 })).status).toBe(201);
    expect((await tech.post(`/api/work-orders/${id}/complete`, { causeFound: 'other', findings: 'x' })).status).toBe(400);
    const done = await tech.post(`/api/work-orders/${id}/complete`, complete);
    expect(done.body.state).toBe('completed');
    expect(done.body.visits.length).toBe(1);
    expect(done.body.visits[0].leftAt).not.toBeNull();
    expect(done.body.totals.total).toEqual({ cents: 9998, currency: 'USD' });
    expect(done.body.costStatus).toBe('pending');
    expect(done.body.events.map((e: { type: string; actor: { displayName: string } | null }) => [e.type, e.actor?.displayName ?? 'system'])).toEqual([
      ['dispatched', 'Spec manager'],
      ['accepted', 'Spec primaryTech'],
      ['scheduled', 'Spec primaryTech'],
      ['on-site', 'Spec primaryTech'],
      ['part-recorded', 'Spec primaryTech'],
      ['completed', 'Spec primaryTech'],
    ]);
    expect((await manager.post(`/api/work-orders/${id}/cost/dispute`, {})).status).toBe(400);
    const disputed = await manager.post(`/api/work-orders/${id}/cost/dispute`, { note: 'One gasket was enough' });
    expect(disputed.body.costStatus).toBe('disputed');
    expect((await tech.post(`/api/work-orders/${id}/cost/approve`, {})).status).toBe(403);
    expect((await manager.post(`/api/work-orders/${id}/cost/approve`, { note: 'Agreed after the call' })).body.costStatus).toBe('approved');
    // No sensor data after the repair: the manager confirms it by hand.
    const verified = await manager.post(`/api/work-orders/${id}/verify`, { note: 'Tenant confirms it seals' });
    expect(verified.body.state).toBe('verified');
    const closed = (await manager.get(`/api/service-requests/${requestId}`)).body;
    expect([closed.status, closed.firstVisitFix, closed.progress]).toEqual(['closed', true, 'verified']);
  });

  it('cancels a request with its job and tells the contractor; merges one into another of the property', async () => {
    const cancelled = await openRequest(1);
    const job = (await manager.post(`/api/service-requests/${cancelled}/dispatch`, {})).body.workOrder.id;
    expect((await manager.post(`/api/service-requests/${cancelled}/cancel`, {})).status).toBe(400);
    const res = await manager.post(`/api/service-requests/${cancelled}/cancel`, { reason: 'Tenant replaced the fridge themselves' });
    expect(res.body.status).toBe('cancelled');
    expect((await manager.get(`/api/work-orders/${job}`)).body.state).toBe('cancelled');
    expect((await world.mailTo('dispatch@frostline.example.com')).some((m) => m.subject.startsWith('Cancelled:') && m.text.includes('replaced the fridge'))).toBeTrue();
    expect((await manager.post(`/api/service-requests/${cancelled}/cancel`, { reason: 'twice' })).status).toBe(409);

    const source = await openRequest(2, 'urgent');
    const target = await openRequest(3);
    const merged = await manager.post(`/api/service-requests/${source}/merge`, { intoRequestId: target });
    expect(merged.body.id).toBe(target);
    expect(merged.body.priority).toBe('urgent');
    const gone = (await manager.get(`/api/service-requests/${source}`)).body;
    expect([gone.status, gone.mergedIntoId]).toEqual(['merged', target]);
  });

  it('lets each person mute non-urgent e-mail, while urgent messages still arrive', async () => {
    expect((await manager.send('put', '/api/notification-preferences', { muteNonUrgent: true })).body).toEqual({ muteNonUrgent: true });
    try {
      const before = (await world.mailTo(world.people.manager.email)).length;
      const tenant = await world.signedIn(world.people.tenantB);
      const { applianceId } = await world.device(1);
      const post = (symptom: string) =>
        tenant.agent.post('/api/tenant/reports').set('X-XSRF-TOKEN', tenant.csrfToken).field('report', JSON.stringify({ applianceId, symptoms: [symptom], description: 'spec' }));
      expect((await post('noise')).status).toBe(201);
      expect((await world.mailTo(world.people.manager.email)).length).toBe(before);
      expect((await post('freezer-not-cold')).status).toBe(200);
      const after = await world.mailTo(world.people.manager.email);
      expect(after.length).toBe(before + 1);
      expect(after[after.length - 1].subject).toContain('Tenant report added');
    } finally {
      await manager.send('put', '/api/notification-preferences', { muteNonUrgent: false });
    }
  });
});
