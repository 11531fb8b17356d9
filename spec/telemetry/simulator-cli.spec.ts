import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { RunningBroker } from '../../broker/create-broker';
import { fleetStep } from '../../seeds/steps/fleet';
import type { SeedContext } from '../../seeds/context';
import { verifyDeviceSecret } from '../../server/telemetry/device-secret';
import type { IngestWorker } from '../../server/ingest/worker';
import { APPLIANCE_STYLES } from '../../shared/domain';
import { readingPayloadSchema } from '../../shared/telemetry';
import { readingPayload } from '../../simulator/cli/device-link';
import { planFleet, readFleetFile, type FleetFile } from '../../simulator/cli/fleet';
import { FleetRunner, type ResumeState } from '../../simulator/cli/fleet-runner';
import { parseCli } from '../../simulator/cli/main';
import { faultsFor, parseFaultSpec } from '../../simulator/cli/schedule';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { countRows, eventually, ingestConfig, testBroker, testWorker } from './support/telemetry-fixture';

const HOUR_MS = 3_600_000;
const plan = (seed: number) => planFleet({ seed, properties: 2, appliancesPerProperty: 3, intervalSeconds: 300, newSecret: () => 'not-a-real-secret' });

describe('simulator CLI', () => {
  it('prints its options with --help', () => {
    const out = execFileSync(process.execPath, ['--import', 'tsx', path.join(__dirname, '../../simulator/cli/main.ts'), '--help'], {
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
      encoding: 'utf8',
    });
    for (const option of ['--properties', '--appliances', '--interval', '--speed', '--fault', '--broker', '--backfill-days']) expect(out).toContain(option);
  }, 20_000);

  it('reads its options, with defaults from the environment', () => {
    const options = parseCli(['--speed', '60', '--backfill-days', '3', '--fault', 'door-seal@2', '--fault', 'power-loss@property:p1'], { MQTT_URL: 'mqtt://broker.example.com:1883' }, '/data');
    expect(options).toEqual(jasmine.objectContaining({ speed: 60, backfillDays: 3, brokerUrl: 'mqtt://broker.example.com:1883', fleetFile: '/data/fleet.json', faults: ['door-seal@2', 'power-loss@property:p1'] }));
    expect(() => parseCli(['--speed', '0'], {}, '/data')).toThrowError(/--speed/);
    expect(() => parseCli(['--bogus'], {}, '/data')).toThrow();
  });

  it('plans the same fleet from the same seed, with every style', () => {
    const [a, b] = [plan(11), plan(11)];
    expect(a.devices.map((d) => d.deviceId)).toEqual(b.devices.map((d) => d.deviceId));
    expect(a.devices.map((d) => d.profile)).toEqual(b.devices.map((d) => d.profile));
    expect(plan(12).devices[0].deviceId).not.toBe(a.devices[0].deviceId);
    expect(new Set(a.devices.map((d) => d.style))).toEqual(new Set(APPLIANCE_STYLES));
  });

  it('schedules faults on one appliance, or a power cut on a whole property', () => {
    const fleet = plan(11);
    const startMs = Date.UTC(2026, 0, 1);
    const nowMs = startMs + 48 * HOUR_MS;
    const cut = parseFaultSpec('power-loss@property:p1,start=-8h,for=5h', fleet, startMs, nowMs);
    expect(cut).toEqual(jasmine.objectContaining({ fault: 'power-loss', propertyKey: 'p1', startMs: nowMs - 8 * HOUR_MS, endMs: nowMs - 3 * HOUR_MS }));
    const fan = parseFaultSpec('evaporator-fan@2,start=+6h,severity=0.5', fleet, startMs, nowMs);
    expect(fan).toEqual(jasmine.objectContaining({ deviceId: fleet.devices[1].deviceId, startMs: startMs + 6 * HOUR_MS, endMs: null, severity: 0.5 }));
    const inP1 = fleet.devices.filter((d) => d.propertyKey === 'p1');
    expect(inP1.every((d) => faultsFor(d, [cut]).length === 1)).toBeTrue();
    expect(fleet.devices.filter((d) => d.propertyKey === 'p2').every((d) => faultsFor(d, [cut]).length === 0)).toBeTrue();
    expect(() => parseFaultSpec('gremlins@1', fleet, startMs, nowMs)).toThrowError(/unknown fault/);
    expect(() => parseFaultSpec('door-seal@99', fleet, startMs, nowMs)).toThrowError(/outside/);
  });

  it('publishes payloads that match the shared schema', () => {
    const payload = readingPayload('cw-0123456789ab', 5, { atMs: Date.UTC(2026, 0, 1), freshFoodC: 3.0625, freezerC: null, doorOpen: true, batteryV: 3.01, compressorOn: true });
    expect(payload).toEqual({ sensor: 'cw-0123456789ab', seq: 5, at: '2026-01-01T00:00:00.000Z', fresh_food: 3.0625, battery_v: 3.01, door: 'open' });
    expect(readingPayloadSchema.safeParse(payload).success).toBeTrue();
  });
});

describe('demo fleet seed step and the fleet runner', () => {
  let db: TestDatabase;
  let dataDir: string;
  let fleet: FleetFile;
  let broker: RunningBroker;
  let worker: IngestWorker;

  beforeAll(async () => {
    db = await createTestDatabase();
    dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-fleet-'));
    const context: SeedContext = { dataSource: db.dataSource, seed: 4242, dataDir, nowMs: Date.now(), facts: {}, log: () => undefined };
    await fleetStep.run(context);
    fleet = readFleetFile(path.join(dataDir, 'fleet.json'));
    broker = await testBroker(db.url);
    worker = testWorker(`mqtt://127.0.0.1:${broker.port}`, db.url, ingestConfig());
    await worker.start();
  }, 60_000);

  afterAll(async () => {
    await worker?.stop();
    await broker?.close();
    await db?.drop();
    fs.rmSync(dataDir, { recursive: true, force: true });
  });

  it('registers the fleet in the database with hashed secrets, and writes a private fleet file', async () => {
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM organization')).toBe(1);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM property')).toBe(2);
    const sensors: { device_id: string; secret_hash: string; appliance_id: string }[] = await db.dataSource.query('SELECT device_id, secret_hash, appliance_id FROM sensor');
    expect(sensors.length).toBe(6);
    for (const device of fleet.devices) {
      const row = sensors.find((sensor) => sensor.device_id === device.deviceId)!;
      expect(row.appliance_id).toBe(device.applianceId!);
      expect(row.secret_hash).not.toContain(device.secret);
      expect(await verifyDeviceSecret(device.secret, row.secret_hash)).toBeTrue();
    }
    expect(fs.statSync(path.join(dataDir, 'fleet.json')).mode & 0o777).toBe(0o600);
    expect(fleet.faults.map((fault) => fault.fault).sort()).toEqual(['defrost-system', 'evaporator-fan']);
  });

  it('backfills history through the broker, and a restart continues without repeating it', async () => {
    const devices = fleet.devices.slice(0, 2);
    const nowMs = Date.now();
    const resume: ResumeState = {};
    const stateFile = path.join(dataDir, 'simulator-state.json');
    const run = async (state: ResumeState) => {
      const runner = new FleetRunner({
        mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
        devices,
        faultsFor: () => [],
        startMs: nowMs - 6 * HOUR_MS,
        replayFromMs: nowMs,
        speed: 1,
        allowFuture: false,
        intervalSecondsOverride: null,
        resume: state,
        stateFile,
        tickMs: 1000,
        log: () => undefined,
      });
      await runner.start();
      await runner.stop();
      return runner.published;
    };
    const published = await run(resume);
    // 6 h at 5 min per sensor is 72 readings, less the few the model loses on the way.
    expect(published).toBeGreaterThan(2 * 65);
    expect(published).toBeLessThanOrEqual(2 * 73);
    await eventually('the backfill to be stored', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')) === published);

    const again = await run(JSON.parse(fs.readFileSync(stateFile, 'utf8')));
    expect(again).toBeLessThanOrEqual(2);
    await eventually('the second run to be stored', async () => (await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')) === published + again);
    const [seqs] = await db.dataSource.query('SELECT count(*)::int AS n, count(DISTINCT (sensor_id, seq))::int AS distinct_seqs FROM reading');
    expect(seqs.n).toBe(published + again);
    expect(seqs.distinct_seqs).toBe(seqs.n);
  }, 60_000);

  it('after a restart, starts the replay where the sensors got rather than idling up to it', async () => {
    const nowMs = Date.now();
    const resumedAtMs = nowMs - HOUR_MS;
    const devices = fleet.devices.slice(0, 2);
    const runner = new FleetRunner({
      mqttUrl: `mqtt://127.0.0.1:${broker.port}`,
      devices,
      faultsFor: () => [],
      startMs: nowMs - 6 * HOUR_MS,
      replayFromMs: nowMs - 6 * HOUR_MS,
      speed: 60,
      allowFuture: false,
      intervalSecondsOverride: null,
      resume: Object.fromEntries(devices.map((device) => [device.deviceId, { lastAtMs: resumedAtMs, seq: 500 }])),
      stateFile: null,
      tickMs: 1000,
      log: () => undefined,
    });
    try {
      await runner.start();
      expect(runner.simulatedNowMs).toBeGreaterThanOrEqual(resumedAtMs);
      expect(runner.simulatedNowMs).toBeLessThan(resumedAtMs + 10 * 60_000);
    } finally {
      await runner.stop();
    }
  });
});
