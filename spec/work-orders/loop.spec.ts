/**
 * The whole loop against the real broker, ingest and PostgreSQL: simulated sensors sign in
 * to aedes with their own credentials and publish over MQTT; the ingest worker stores the
 * readings and feeds the monitor; the monitor's incident opens a request and an urgent
 * work order for the covering contractor, whose e-mail arrives at the fake SMTP server;
 * the contractor accepts, records the fan motor with a photo and completes; then the
 * simulator's fault is cleared on one appliance (verified) and left in on the other
 * (reopened). The readings lie in the recent past, the spec's clock follows them.
 */
import type { MqttClient } from 'mqtt';
import sharp from 'sharp';
import type { RunningBroker } from '../../broker/create-broker';
import type { IngestWorker } from '../../server/ingest/worker';
import { readingTopic } from '../../shared/telemetry';
import { readingPayload } from '../../simulator/cli/device-link';
import { ApplianceSimulator, defaultProfile } from '../../simulator/model';
import type { Browser } from '../auth/support/browser';
import { DAY_MS, HOUR_MS, MINUTE_MS } from '../monitor/support/monitor-rig';
import { connectDevice, eventually, ingestConfig, testBroker, testWorker, type TestDevice } from '../telemetry/support/telemetry-fixture';
import { createWorkOrderWorld, PUBLIC_URL, type WorkOrderWorld } from './support/world';

const INTERVAL_MS = 5 * MINUTE_MS;

/** One simulated sensor: the physical model and its MQTT connection with its own credentials. */
class SimulatedSensor {
  private seq = 0;
  private nextAtMs: number;

  constructor(
    readonly device: TestDevice,
    readonly sim: ApplianceSimulator,
    private readonly client: MqttClient,
    startMs: number,
  ) {
    this.nextAtMs = startMs;
  }

  get published(): number {
    return this.seq;
  }

  /** Publishes every reading up to untilMs (QoS 1, a window of 100 in flight). */
  async publishUntil(untilMs: number): Promise<void> {
    let window: Promise<unknown>[] = [];
    for (; this.nextAtMs < untilMs; this.nextAtMs += INTERVAL_MS) {
      this.sim.advanceTo(this.nextAtMs);
      const sample = this.sim.sample();
      if (!sample) continue;
      const payload = JSON.stringify(readingPayload(this.device.deviceId, this.seq++, sample));
      window.push(this.client.publishAsync(readingTopic(this.device.deviceId), payload, { qos: 1 }));
      if (window.length >= 100) {
        await Promise.all(window);
        window = [];
      }
    }
    await Promise.all(window);
  }

  close(): Promise<void> {
    return this.client.endAsync();
  }
}

describe('the whole loop: broker → ingest → monitor → request → work order → verification', () => {
  let world: WorkOrderWorld;
  let broker: RunningBroker;
  let worker: IngestWorker;
  const sensors: SimulatedSensor[] = [];
  // Midnight UTC: the same scenario (time of day, door habits) on every run.
  const endMs = Math.floor(Date.now() / DAY_MS) * DAY_MS;
  const startMs = endMs - 3 * DAY_MS;
  const faultAtMs = startMs + 30 * HOUR_MS;
  const visitAtMs = faultAtMs + 14 * HOUR_MS;

  beforeAll(async () => {
    world = await createWorkOrderWorld({ units: 2 });
    broker = await testBroker(world.db.url);
    const mqttUrl = `mqtt://127.0.0.1:${broker.port}`;
    worker = testWorker(mqttUrl, world.db.url, ingestConfig(), world.monitor.hook);
    await worker.start();
    for (const [unit, seed] of [[0, 41], [1, 42]]) {
      const device = await world.device(unit);
      const sim = new ApplianceSimulator(defaultProfile(), { seed, startMs: startMs - 6 * HOUR_MS, faults: [{ fault: 'evaporator-fan', startMs: faultAtMs }] });
      sensors.push(new SimulatedSensor(device, sim, await connectDevice(mqttUrl, device), startMs));
    }
  }, 60_000);

  afterAll(async () => {
    for (const sensor of sensors) await sensor.close();
    await worker?.stop();
    await broker?.close();
    await world?.close();
  });

  /** Plays the sensors to untilMs and waits until every reading is stored and judged. */
  async function playUntil(untilMs: number): Promise<void> {
    for (const sensor of sensors) await sensor.publishUntil(untilMs);
    const published = sensors.reduce((sum, s) => sum + s.published, 0);
    await eventually(
      'every reading stored',
      async () => {
        const [row] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM reading`);
        return row.n === published;
      },
      30_000,
    );
    await worker.idle();
    await world.monitor.idle();
  }

  async function workOrderOf(sensor: SimulatedSensor): Promise<{ id: string; state: string; priority: string; request_id: string }> {
    const [row] = await world.db.dataSource.query(
      `SELECT wo.id, wo.state, wo.priority, r.id AS request_id FROM work_order wo JOIN service_request r ON r.id = wo.service_request_id
        WHERE r.appliance_id = $1 ORDER BY wo.created_at DESC LIMIT 1`,
      [sensor.device.applianceId],
    );
    return row;
  }

  async function repair(technician: Browser, workOrderId: string, photo: Buffer): Promise<void> {
    world.clock.set(visitAtMs);
    expect((await technician.post(`/api/work-orders/${workOrderId}/accept`)).status).toBe(200);
    world.clock.set(visitAtMs + 20 * MINUTE_MS);
    expect((await technician.post(`/api/work-orders/${workOrderId}/arrive`, { notes: 'Fan blade does not turn; motor hums with 120 V at the connector.' })).status).toBe(200);
    const part = await technician.post(`/api/work-orders/${workOrderId}/parts`, { name: 'Evaporator fan motor', quantity: 1, unitCostCents: 6450 });
    expect(part.status).toBe(201);
    const uploaded = await technician.agent
      .post(`/api/work-orders/${workOrderId}/attachments`)
      .set('X-XSRF-TOKEN', technician.csrfToken)
      .field('kind', 'after')
      .attach('file', photo, { filename: 'new-fan-motor.jpg', contentType: 'image/jpeg' });
    expect(uploaded.status).toBe(201);
    expect((await technician.post(`/api/work-orders/${workOrderId}/labour`, { minutes: 45, hourlyRateCents: 9000 })).status).toBe(201);
    world.clock.set(visitAtMs + 60 * MINUTE_MS);
    const done = await technician.post(`/api/work-orders/${workOrderId}/complete`, { causeFound: 'evaporator-fan', findings: 'Replaced the evaporator fan motor; fan runs, air moves.' });
    expect(done.status).toBe(200);
    expect(done.body.state).toBe('completed');
    // 1 × $64.50 + 45 min at $90.00/h = $64.50 + $67.50.
    expect(done.body.totals.total).toEqual({ cents: 13200, currency: 'USD' });
  }

  it('dispatches an urgent job, and after the repair verifies the fixed unit and reopens the unfixed one', async () => {
    world.clock.set(visitAtMs - HOUR_MS);
    await playUntil(visitAtMs - HOUR_MS);

    const technician = await world.signedIn(world.people.primaryTech);
    const photo = await sharp({ create: { width: 80, height: 60, channels: 3, background: '#445566' } }).jpeg().toBuffer();
    const jobs = [];
    for (const sensor of sensors) {
      const job = await workOrderOf(sensor);
      expect(job).withContext(`a work order for ${sensor.device.deviceId}`).toBeDefined();
      expect(job.priority).toBe('urgent');
      expect(job.state).toBe('dispatched');
      const view = await technician.get(`/api/work-orders/${job.id}`);
      expect(view.body.contractor.id).toBe(world.contractors.primary);
      // Common practice: a stopped evaporator fan is diagnosed as such, with its parts and checks.
      expect(view.body.diagnosis.topCause).toBe('evaporator-fan');
      expect(view.body.diagnosis.cause.parts[0]).toContain('Evaporator fan motor');
      expect(view.body.cautions.join(' ')).toContain('EPA Section 608');
      jobs.push(job);
    }
    const dispatchMails = await world.mailTo('dispatch@frostline.example.com');
    for (const job of jobs) {
      expect(dispatchMails.some((m) => m.links.includes(`${PUBLIC_URL}/work-orders/${job.id}`))).withContext('dispatch e-mail with the job link').toBeTrue();
    }

    // The tenants hear what to do with their food (USDA FSIS guidance, deferring to the local health authority).
    const warning = (await world.mailTo(world.people.tenantA.email)).find((m) => m.subject.includes('is warming up'));
    expect(warning?.text).toContain('local health authority');

    for (const job of jobs) await repair(technician, job.id, photo);
    // The fan motor of the first appliance really was replaced; the second keeps its fault.
    sensors[0].sim.clearFault('evaporator-fan', visitAtMs + 40 * MINUTE_MS);
    await playUntil(visitAtMs + 10 * HOUR_MS);

    const fixed = await workOrderOf(sensors[0]);
    expect(fixed.state).toBe('verified');
    const [fixedRequest] = await world.db.dataSource.query(`SELECT status, first_visit_fix, close_reason FROM service_request WHERE id = $1`, [fixed.request_id]);
    expect(fixedRequest).toEqual({ status: 'closed', first_visit_fix: true, close_reason: 'repair verified from telemetry' });
    // The incident is still settling after the repair; it opens no second request.
    const [requests] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM service_request WHERE appliance_id = $1`, [sensors[0].device.applianceId]);
    expect(requests.n).toBe(1);

    const unfixed = await workOrderOf(sensors[1]);
    expect(unfixed.state).toBe('reopened');
    const [unfixedRequest] = await world.db.dataSource.query(`SELECT status, first_visit_fix FROM service_request WHERE id = $1`, [unfixed.request_id]);
    expect(unfixedRequest).toEqual({ status: 'open', first_visit_fix: false });
    const reopenedMails = (await world.mailTo('dispatch@frostline.example.com')).filter((m) => m.subject.startsWith('Reopened:'));
    expect(reopenedMails.length).toBe(1);
    expect((await world.mailTo(world.people.manager.email)).some((m) => m.subject.startsWith('Repair did not hold'))).toBeTrue();
    const history = (await technician.get(`/api/work-orders/${unfixed.id}`)).body.events.map((e: { type: string }) => e.type);
    expect(history).toEqual(['dispatched', 'accepted', 'on-site', 'part-recorded', 'attachment-added', 'labour-recorded', 'completed', 'reopened']);
  }, 120_000);
});
