/**
 * The loop's timers on a clock the spec moves: an urgent job nobody accepts goes to the
 * backup contractor after the organization's escalation time; a job past its due time is
 * flagged overdue. The defaults are the organization settings' (server/work-orders/org-settings.ts).
 */
import { DEFAULT_ORG_SETTINGS } from '../../server/work-orders/org-settings';
import { MINUTE_MS } from '../monitor/support/monitor-rig';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

describe('work-order timers', () => {
  let world: WorkOrderWorld;

  beforeAll(async () => {
    world = await createWorkOrderWorld();
  }, 30_000);
  afterAll(async () => world.close());

  /** A manager opens a request for a new appliance and dispatches it by coverage. */
  async function dispatchedJob(priority: 'urgent' | 'routine', unitIndex = 0): Promise<{ requestId: string; workOrderId: string }> {
    const device = await world.device(unitIndex);
    const manager = await world.signedIn(world.people.manager);
    const opened = await manager.post('/api/service-requests', { applianceId: device.applianceId, priority, title: 'Fridge not keeping cold' });
    expect(opened.status).toBe(201);
    const dispatched = await manager.post(`/api/service-requests/${opened.body.id}/dispatch`, {});
    expect(dispatched.status).toBe(200);
    return { requestId: opened.body.id, workOrderId: dispatched.body.workOrder.id };
  }

  it('escalates an unaccepted urgent job to the backup contractor after the escalation time, once', async () => {
    const { workOrderId } = await dispatchedJob('urgent');
    const primary = await world.signedIn(world.people.primaryTech);
    const backup = await world.signedIn(world.people.backupTech);
    expect((await primary.get(`/api/work-orders/${workOrderId}`)).status).toBe(200);
    expect((await backup.get(`/api/work-orders/${workOrderId}`)).status).toBe(404);

    world.clock.advance((DEFAULT_ORG_SETTINGS.escalateAfterMinutes - 1) * MINUTE_MS);
    expect((await world.workOrders.services.sweeper.runOnce()).escalated).toBe(0);
    world.clock.advance(2 * MINUTE_MS);
    expect((await world.workOrders.services.sweeper.runOnce()).escalated).toBe(1);

    const view = await backup.get(`/api/work-orders/${workOrderId}`);
    expect(view.status).toBe(200);
    expect(view.body.contractor.id).toBe(world.contractors.backup);
    expect(view.body.dispatchMethod).toBe('coverage-backup');
    expect(view.body.events.map((e: { type: string }) => e.type)).toContain('escalated');
    // The primary no longer reaches the job.
    expect((await primary.get(`/api/work-orders/${workOrderId}`)).status).toBe(404);
    const toBackup = await world.mailTo('jobs@coldbay.example.com');
    expect(toBackup.some((m) => m.subject.startsWith('Urgent job passed to you'))).toBeTrue();
    expect(toBackup.some((m) => m.links.includes(`http://127.0.0.1:4280/work-orders/${workOrderId}`))).toBeTrue();
    const toManager = await world.mailTo(world.people.manager.email);
    expect(toManager.some((m) => m.subject.startsWith('Escalated to the backup contractor'))).toBeTrue();

    // An escalated job does not bounce on.
    world.clock.advance(2 * DEFAULT_ORG_SETTINGS.escalateAfterMinutes * MINUTE_MS);
    expect((await world.workOrders.services.sweeper.runOnce()).escalated).toBe(0);
  });

  it('never escalates a routine job or an accepted one', async () => {
    const routine = await dispatchedJob('routine', 1);
    const urgent = await dispatchedJob('urgent', 2);
    const primary = await world.signedIn(world.people.primaryTech);
    expect((await primary.post(`/api/work-orders/${urgent.workOrderId}/accept`)).status).toBe(200);
    world.clock.advance(3 * DEFAULT_ORG_SETTINGS.escalateAfterMinutes * MINUTE_MS);
    await world.workOrders.services.sweeper.runOnce();
    for (const id of [routine.workOrderId, urgent.workOrderId]) {
      const view = await primary.get(`/api/work-orders/${id}`);
      expect(view.body.contractor.id).toBe(world.contractors.primary);
      expect(view.body.escalatedAt).toBeNull();
    }
  });

  it('flags a job past its due time as overdue, from the response target of its priority', async () => {
    const { workOrderId } = await dispatchedJob('routine', 0);
    const primary = await world.signedIn(world.people.primaryTech);
    expect((await primary.post(`/api/work-orders/${workOrderId}/accept`)).status).toBe(200);
    const before = await primary.get(`/api/work-orders/${workOrderId}`);
    const dueMs = Date.parse(before.body.dueAt);
    expect(dueMs - Date.parse(before.body.dispatchedAt)).toBe(DEFAULT_ORG_SETTINGS.responseMinutes.routine * MINUTE_MS);
    expect(before.body.overdue).toBeFalse();

    world.clock.set(dueMs - MINUTE_MS);
    await world.workOrders.services.sweeper.runOnce();
    expect((await primary.get(`/api/work-orders/${workOrderId}`)).body.overdue).toBeFalse();
    world.clock.set(dueMs + MINUTE_MS);
    await world.workOrders.services.sweeper.runOnce();
    const after = await primary.get(`/api/work-orders/${workOrderId}`);
    expect(after.body.overdue).toBeTrue();
    expect(after.body.events.filter((e: { type: string }) => e.type === 'overdue').length).toBe(1);
    const overdueList = await (await world.signedIn(world.people.manager)).get('/api/work-orders?status=overdue');
    expect(overdueList.body.items.map((item: { id: string }) => item.id)).toContain(workOrderId);
    expect(world.events.some((e) => e.type === 'work-order.changed' && e.workOrderId === workOrderId && e.change === 'overdue')).toBeTrue();
  });

  it('tells the manager when an urgent job has no backup to escalate to', async () => {
    const solo = await createWorkOrderWorld({ coverage: 'primary-only' });
    try {
      const device = await solo.device(0);
      const manager = await solo.signedIn(solo.people.manager);
      const opened = await manager.post('/api/service-requests', { applianceId: device.applianceId, priority: 'urgent', title: 'Freezer thawing' });
      const dispatched = await manager.post(`/api/service-requests/${opened.body.id}/dispatch`, {});
      solo.clock.advance((DEFAULT_ORG_SETTINGS.escalateAfterMinutes + 1) * MINUTE_MS);
      await solo.workOrders.services.sweeper.runOnce();
      const view = await manager.get(`/api/work-orders/${dispatched.body.workOrder.id}`);
      expect(view.body.contractor.id).toBe(solo.contractors.primary);
      expect(view.body.events.map((e: { type: string }) => e.type)).toContain('escalation-failed');
      const mails = await solo.mailTo(solo.people.manager.email);
      expect(mails.some((m) => m.subject.startsWith('Nobody has accepted an urgent job'))).toBeTrue();
    } finally {
      await solo.close();
    }
  }, 30_000);
});
