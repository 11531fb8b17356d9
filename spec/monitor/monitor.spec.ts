/**
 * The live monitor end to end: simulated sensor traces through the real ingest pipeline
 * (validation, storage, the committed-batch hook) into MonitorService and the database.
 * The trade signatures are the simulator's (common practice, see spec/simulator/faults.spec.ts).
 */
import { DetectionEngine } from '../../server/detection/engine';
import { IncidentTracker } from '../../server/detection/incidents';
import { MonitorService } from '../../server/monitor/monitor-service';
import { DetectionSettingsService } from '../../server/services/detection-settings';
import type { Actor } from '../../server/auth/actor';
import { defaultProfile, generateTrace, randomProfile, createRng, type ApplianceProfile, type ScheduledFault } from '../../simulator/model';
import { createDevice, createPlacement, type Placement, type TestDevice } from '../telemetry/support/telemetry-fixture';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { DAY_MS, HOUR_MS, IngestRig, MINUTE_MS, SpecClock, monitorOn, silentLogger } from './support/monitor-rig';

const INTERVAL_MS = 5 * MINUTE_MS;

function trace(profile: ApplianceProfile, seed: number, startMs: number, days: number, faults: ScheduledFault[]) {
  return generateTrace({ profile, seed, startMs, durationMs: days * DAY_MS, intervalMs: INTERVAL_MS, faults });
}

/** The incident tracker's top cause over the whole trace, with no database and no restart. */
function offlineTopCause(samples: ReturnType<typeof trace>): string | null {
  const engine = new DetectionEngine('top-freezer');
  const tracker = new IncidentTracker();
  for (const sample of samples) for (const event of engine.push(sample)) tracker.handle(event);
  return tracker.openIncidents().find((i) => i.lane === 'repair')?.probableCauses[0]?.code ?? null;
}

describe('live monitor', () => {
  const SPEC_TIMEOUT_MS = 60_000;
  let db: TestDatabase;
  let placement: Placement;
  // Four days ending now: inside the ingest's acceptance window, a day to learn, then the fault.
  // Midnight UTC: the same scenario (time of day, door habits) on every run.
  const endMs = Math.floor(Date.now() / DAY_MS) * DAY_MS;
  const startMs = endMs - 4 * DAY_MS;
  const faultAtMs = startMs + 36 * HOUR_MS;

  beforeAll(async () => {
    db = await createTestDatabase('cw_monitor');
    placement = await createPlacement(db.dataSource);
  });
  afterAll(async () => db.drop());

  async function repairIncidents(applianceId: string): Promise<Record<string, unknown>[]> {
    return db.dataSource.query(`SELECT * FROM incident WHERE appliance_id = $1 AND lane = 'repair' ORDER BY opened_at`, [applianceId]);
  }

  describe('an evaporator fan that stops', () => {
    let device: TestDevice;
    const samples = trace(defaultProfile(), 41, startMs, 4, [{ fault: 'evaporator-fan', startMs: faultAtMs }]);

    beforeAll(async () => {
      device = await createDevice(db.dataSource, placement, 'top-freezer', 300);
    });

    it('opens one incident whose top cause is the evaporator fan, and survives a restart without re-opening it', async () => {
      const clock = new SpecClock(endMs);
      const first = monitorOn(db.dataSource, clock);
      const rig = new IngestRig(db.url, first.monitor.hook, 200);
      const cutMs = faultAtMs + 20 * HOUR_MS;
      await rig.play([{ deviceId: device.deviceId, samples }], -Infinity, cutMs);
      await first.monitor.idle();
      const beforeRestart = await repairIncidents(device.applianceId);
      expect(beforeRestart.length).toBe(1);
      expect(first.events.filter((e) => e.type === 'incident.opened' && e.incident.lane === 'repair').length).toBe(1);

      // A new service over the same database: what it knows comes from appliance_monitor only.
      await rig.close();
      const second = monitorOn(db.dataSource, clock);
      const rig2 = new IngestRig(db.url, second.monitor.hook, 200);
      await rig2.play([{ deviceId: device.deviceId, samples }], cutMs);
      await second.monitor.idle();
      await rig2.close();

      const incidents = await repairIncidents(device.applianceId);
      expect(incidents.length).toBe(1);
      expect(incidents[0].id).toBe(beforeRestart[0].id);
      expect(second.events.some((e) => e.type === 'incident.opened')).toBeFalse();
      expect(second.events.some((e) => e.type === 'incident.updated')).toBeTrue();
      // The monitor says what the engine says offline over the same readings…
      expect(incidents[0].top_cause).toBe(offlineTopCause(samples));
      // …and (common practice) a stopped evaporator fan is diagnosed as such.
      expect(incidents[0].top_cause).toBe('evaporator-fan');
      expect(incidents[0].closed_at).toBeNull();
      const [state] = await db.dataSource.query(`SELECT health, engine_state, fresh_food_c FROM appliance_monitor WHERE appliance_id = $1`, [device.applianceId]);
      expect(['warm', 'drifting', 'no-cooling']).toContain(state.health);
      expect(Number(state.engine_state.lastAtMs)).toBe(samples[samples.length - 1].atMs);
      const [linked] = await db.dataSource.query(`SELECT count(*)::int AS n FROM finding WHERE incident_id = $1`, [incidents[0].id]);
      expect(linked.n).toBeGreaterThan(0);
    }, SPEC_TIMEOUT_MS);
  });

  it('judges with the organization\'s overrides and picks up a manager\'s change at the next batch', async () => {
    // An organization of its own, so its override touches no other spec.
    const own = await createPlacement(db.dataSource);
    const device = await createDevice(db.dataSource, own, 'fresh-food-only', 300);
    const samples = trace(defaultProfile('fresh-food-only'), 45, startMs, 2, []);
    const clock = new SpecClock(samples[samples.length - 1].atMs);
    const { monitor } = monitorOn(db.dataSource, clock);
    const rig = new IngestRig(db.url, monitor.hook, 200);
    const findings = async () => (await db.dataSource.query(`SELECT kind FROM finding WHERE appliance_id = $1`, [device.applianceId])).map((r: { kind: string }) => r.kind);
    const cutMs = startMs + 30 * HOUR_MS;
    await rig.play([{ deviceId: device.deviceId, samples }], -Infinity, cutMs);
    await monitor.idle();
    // A healthy unit near its 2.5 °C set point: nothing under the defaults (40 °F, U.S. FDA).
    expect(await findings()).toEqual([]);
    // The manager makes the fresh-food limit 1 °C, stricter than the FDA's, as the settings allow.
    const settings = new DetectionSettingsService(db.dataSource);
    const manager = { id: null, role: 'manager', organizationId: own.organizationId } as unknown as Actor;
    await settings.replace(manager, 'fresh-food-only', { freshFoodLimitC: 1 });
    await rig.play([{ deviceId: device.deviceId, samples }], cutMs);
    await monitor.idle();
    await rig.close();
    await monitor.close();
    expect(await findings()).toContain('over-temperature');
  }, SPEC_TIMEOUT_MS);

  it('judges readings committed while it was down when it starts again (no reading left unjudged)', async () => {
    const device = await createDevice(db.dataSource, placement, 'top-freezer', 300);
    const samples = trace(defaultProfile(), 43, startMs, 3, []);
    const clock = new SpecClock(samples[samples.length - 1].atMs);
    const first = monitorOn(db.dataSource, clock);
    const live = new IngestRig(db.url, first.monitor.hook, 200);
    await live.play([{ deviceId: device.deviceId, samples }], -Infinity, startMs + DAY_MS);
    await live.close();
    // The ingest kept committing, but no monitor saw these readings.
    const unjudged = new IngestRig(db.url, undefined, 200);
    await unjudged.play([{ deviceId: device.deviceId, samples }], startMs + DAY_MS, startMs + 2 * DAY_MS);
    await unjudged.close();
    const second = new MonitorService({ dataSource: db.dataSource, bus: first.bus, logger: silentLogger, clock });
    const resumed = new IngestRig(db.url, second.hook, 200);
    await resumed.play([{ deviceId: device.deviceId, samples }], startMs + 2 * DAY_MS);
    await resumed.close();
    await second.idle();
    const [state] = await db.dataSource.query(`SELECT engine_state, health FROM appliance_monitor WHERE appliance_id = $1`, [device.applianceId]);
    const judgedSpanMs = Number(state.engine_state.lastAtMs) - Number(state.engine_state.firstAtMs);
    expect(Number(state.engine_state.firstAtMs)).toBe(samples[0].atMs);
    expect(judgedSpanMs).toBe(samples[samples.length - 1].atMs - samples[0].atMs);
    expect(state.health).toBe('cold');
    expect((await repairIncidents(device.applianceId)).length).toBe(0);
  }, SPEC_TIMEOUT_MS);

  it('turns an appliance silent when its sensor stops reporting, and back when it reports again', async () => {
    const device = await createDevice(db.dataSource, placement, 'top-freezer', 300);
    const samples = trace(defaultProfile(), 47, endMs - 2 * DAY_MS, 2, []);
    const clock = new SpecClock(endMs);
    const { monitor, events } = monitorOn(db.dataSource, clock);
    const rig = new IngestRig(db.url, monitor.hook, 500);
    await rig.play([{ deviceId: device.deviceId, samples: samples.slice(0, -1) }]);
    await monitor.idle();
    // Liveness (telemetry/liveness.ts): silent after three of its own intervals without a
    // reading, counted from the later of the newest reading and when the monitor received it.
    clock.set(Math.max(samples[samples.length - 2].atMs, endMs) + 16 * MINUTE_MS);
    await monitor.sweepLiveness();
    const [silent] = await db.dataSource.query(`SELECT health FROM appliance_monitor WHERE appliance_id = $1`, [device.applianceId]);
    expect(silent.health).toBe('silent');
    await rig.play([{ deviceId: device.deviceId, samples: samples.slice(-1) }]);
    clock.set(samples[samples.length - 1].atMs + MINUTE_MS);
    await rig.play([{ deviceId: device.deviceId, samples: [{ ...samples[samples.length - 1], atMs: samples[samples.length - 1].atMs + 30_000 }] }]);
    await monitor.idle();
    await rig.close();
    const changes = events.filter((e) => e.type === 'appliance.health-changed' && e.applianceId === device.applianceId).map((e) => (e.type === 'appliance.health-changed' ? e.health : null));
    expect(changes).toContain('silent');
    expect(changes[changes.length - 1]).toBe('cold');
  }, SPEC_TIMEOUT_MS);

  describe('a power loss at a property', () => {
    it('opens one property incident for four appliances warming together, not four', async () => {
      const property = await createPlacement(db.dataSource);
      const rng = createRng(5);
      const devices: { device: TestDevice; samples: ReturnType<typeof trace> }[] = [];
      const outage: ScheduledFault = { fault: 'power-loss', startMs: faultAtMs, endMs: faultAtMs + 7 * HOUR_MS };
      for (let i = 0; i < 4; i++) {
        const device = await createDevice(db.dataSource, property, 'top-freezer', 300);
        const profile = { ...randomProfile(rng, 'top-freezer'), lossProbability: 0 };
        devices.push({ device, samples: trace(profile, 60 + i, startMs, 3, [outage]) });
      }
      const clock = new SpecClock(endMs);
      const { monitor, events } = monitorOn(db.dataSource, clock);
      // Small batches: the units' incidents open one after another, as they would live.
      const rig = new IngestRig(db.url, monitor.hook, 24);
      await rig.play(devices.map(({ device, samples }) => ({ deviceId: device.deviceId, samples })));
      await monitor.idle();
      await rig.close();

      const propertyIncidents = await db.dataSource.query(`SELECT * FROM incident WHERE property_id = $1 AND level = 'property'`, [property.propertyId]);
      expect(propertyIncidents.length).toBe(1);
      expect(propertyIncidents[0].kind).toBe('power-loss');
      expect(propertyIncidents[0].top_cause).toBe('power-loss');
      expect(propertyIncidents[0].appliance_ids.length).toBeGreaterThanOrEqual(3);
      const unitIncidents = await db.dataSource.query(`SELECT property_incident_id FROM incident WHERE property_id = $1 AND level = 'appliance' AND lane = 'repair'`, [property.propertyId]);
      expect(unitIncidents.length).toBeGreaterThanOrEqual(3);
      const absorbed = unitIncidents.filter((row: { property_incident_id: string | null }) => row.property_incident_id === propertyIncidents[0].id);
      expect(absorbed.length).toBeGreaterThanOrEqual(3);
      const opened = events.filter((e) => e.type === 'incident.opened' && e.incident.level === 'property');
      expect(opened.length).toBe(1);
    }, SPEC_TIMEOUT_MS);
  });
});
