/**
 * A power cut at a property: four appliances warm together. Fed hour by hour through the
 * real ingest pipeline and the monitor (clock moving with the telemetry), the loop must
 * open one request for the property and tell the manager, not dispatch every unit.
 */
import { createRng, generateTrace, randomProfile, type SimSample } from '../../simulator/model';
import { DAY_MS, HOUR_MS, IngestRig, MINUTE_MS } from '../monitor/support/monitor-rig';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

describe('power loss at a property', () => {
  let world: WorkOrderWorld;
  // Midnight UTC: the same scenario (time of day, door habits) on every run.
  const endMs = Math.floor(Date.now() / DAY_MS) * DAY_MS;
  const startMs = endMs - 3 * DAY_MS;
  const outageMs = startMs + 36 * HOUR_MS;

  beforeEach(async () => {
    world = await createWorkOrderWorld({ units: 4 });
  }, 30_000);
  afterEach(async () => world.close());

  /** Four appliances of the property through the pipeline, an hour at a time, sweeping after each hour. */
  async function playOutage(): Promise<void> {
    const rng = createRng(9);
    const devices: { deviceId: string; samples: SimSample[] }[] = [];
    for (let unit = 0; unit < 4; unit++) {
      const device = await world.device(unit);
      const profile = { ...randomProfile(rng, 'top-freezer'), lossProbability: 0 };
      const faults = [{ fault: 'power-loss' as const, startMs: outageMs, endMs: outageMs + 7 * HOUR_MS }];
      devices.push({ deviceId: device.deviceId, samples: generateTrace({ profile, seed: 80 + unit, startMs, durationMs: 3 * DAY_MS, intervalMs: 5 * MINUTE_MS, faults }) });
    }
    const rig = new IngestRig(world.db.url, world.monitor.hook, 500);
    try {
      for (let fromMs = startMs; fromMs < endMs; fromMs += HOUR_MS) {
        world.clock.set(fromMs + HOUR_MS);
        await rig.play(devices, fromMs, fromMs + HOUR_MS);
        await world.monitor.idle();
        await world.workOrders.services.sweeper.runOnce();
      }
    } finally {
      await rig.close();
    }
  }

  it('opens one request for the property, dispatches no unit, tells the manager, and closes when power is back', async () => {
    await playOutage();

    const requests = await world.db.dataSource.query(`SELECT level, source, status, close_reason FROM service_request WHERE property_id = $1`, [world.place.propertyId]);
    expect(requests.length).withContext(JSON.stringify(requests)).toBe(1);
    expect(requests[0].level).toBe('property');
    const [workOrders] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM work_order`);
    expect(workOrders.n).toBe(0);
    expect((await world.mailTo('dispatch@frostline.example.com')).length).toBe(0);
    const notice = (await world.mailTo(world.people.manager.email)).find((m) => m.subject.startsWith('Power loss at Fernhill Court'));
    expect(notice?.text).toContain('No technician has been sent to the units.');
    // Power came back and the cabinets recovered: the property incident closed, and with it the request.
    expect(requests[0].status).toBe('closed');
    expect(requests[0].close_reason).toContain('power restored');
  }, 120_000);

  it('without the dispatch hold, merges the unit requests it opened into the property request and cancels their jobs', async () => {
    const manager = await world.signedIn(world.people.manager);
    expect((await manager.patch('/api/org-settings', { dispatchHoldMinutes: 0 })).status).toBe(200);
    await playOutage();
    const [property] = await world.db.dataSource.query(`SELECT id, incident_id FROM service_request WHERE property_id = $1 AND level = 'property'`, [world.place.propertyId]);
    expect(property).toBeDefined();
    // Every unit request whose incident the outage explains was merged into it, its job cancelled.
    const absorbed: { id: string; status: string; merged_into_id: string | null; active_jobs: number }[] = await world.db.dataSource.query(
      `SELECT r.id, r.status, r.merged_into_id,
              (SELECT count(*)::int FROM work_order wo WHERE wo.service_request_id = r.id AND wo.state <> 'cancelled') AS active_jobs
         FROM service_request r JOIN incident i ON i.id = r.incident_id WHERE i.property_incident_id = $1`,
      [property.incident_id],
    );
    expect(absorbed.length).toBeGreaterThan(0);
    for (const request of absorbed) expect(request).withContext(request.id).toEqual({ id: request.id, status: 'merged', merged_into_id: property.id, active_jobs: 0 });
    // Cancellation e-mails go out after the commit, so give the fake SMTP server a moment.
    const cancellations = async () => (await world.mailTo('dispatch@frostline.example.com')).filter((m) => m.subject.startsWith('Cancelled:'));
    // One e-mail per cancelled job: a unit request may have been merged before its job went out.
    const [cancelled] = await world.db.dataSource.query(
      `SELECT count(*)::int AS n FROM work_order WHERE state = 'cancelled' AND service_request_id = ANY($1::uuid[])`,
      [absorbed.map((request) => request.id)],
    );
    expect(cancelled.n).toBeGreaterThan(0);
    for (let tries = 0; tries < 50 && (await cancellations()).length < cancelled.n; tries++) await new Promise((resolve) => setTimeout(resolve, 100));
    expect((await cancellations()).length).toBe(cancelled.n);
  }, 120_000);
});
