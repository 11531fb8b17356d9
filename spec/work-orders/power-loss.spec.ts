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
  const endMs = Math.floor(Date.now() / (5 * MINUTE_MS)) * 5 * MINUTE_MS - 5 * MINUTE_MS;
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
    const requests: { id: string; level: string; status: string; merged_into_id: string | null }[] = await world.db.dataSource.query(
      `SELECT id, level, status, merged_into_id FROM service_request WHERE property_id = $1`,
      [world.place.propertyId],
    );
    const property = requests.filter((r) => r.level === 'property');
    expect(property.length).toBe(1);
    const units = requests.filter((r) => r.level === 'appliance');
    expect(units.length).toBeGreaterThan(0);
    expect(units.every((r) => r.status === 'merged' && r.merged_into_id === property[0].id)).withContext(JSON.stringify(units)).toBeTrue();
    const active = await world.db.dataSource.query(`SELECT state FROM work_order WHERE state NOT IN ('cancelled')`);
    expect(active).toEqual([]);
  }, 120_000);
});
