import net from 'node:net';
import mqtt, { type MqttClient } from 'mqtt';
import pino from 'pino';
import type { DataSource } from 'typeorm';
import { startBroker, type RunningBroker } from '../../../broker/create-broker';
import type { BrokerConfig } from '../../../broker/config';
import { loadIngestConfig, type IngestConfig } from '../../../server/ingest/config';
import type { CommittedBatchHook } from '../../../server/ingest/pipeline';
import { IngestWorker } from '../../../server/ingest/worker';
import { generateDeviceSecret, hashDeviceSecret } from '../../../server/telemetry/device-secret';
import type { IngestAccount } from '../../../server/telemetry/ingest-account';
import type { ApplianceStyle } from '../../../shared/domain';

export const silentLogger = pino({ level: 'silent' });
export const TEST_INGEST: IngestAccount = { username: 'cw-ingest', password: 'ingest-test-secret' };

export interface TestDevice {
  deviceId: string;
  secret: string;
  sensorId: string;
  applianceId: string;
}

export interface Placement {
  organizationId: string;
  propertyId: string;
  unitId: string;
}

let counter = 0;

/** An organization, a property and a unit to put appliances in. */
export async function createPlacement(db: DataSource): Promise<Placement> {
  const [org] = await db.query(`INSERT INTO organization (name) VALUES ('Spec Rentals') RETURNING id`);
  const [property] = await db.query(
    `INSERT INTO property (organization_id, name, address_line1, city, time_zone) VALUES ($1, 'Spec House', '1 Example Row', 'Millbrook', 'UTC') RETURNING id`,
    [org.id],
  );
  const [unit] = await db.query(`INSERT INTO unit (property_id, label) VALUES ($1, '1A') RETURNING id`, [property.id]);
  return { organizationId: org.id, propertyId: property.id, unitId: unit.id };
}

/** An appliance with a registered sensor; the secret is returned, the database holds its hash. */
export async function createDevice(db: DataSource, placement: Placement, style: ApplianceStyle = 'top-freezer', intervalSeconds = 60): Promise<TestDevice> {
  const deviceId = `cw-spec${String(++counter).padStart(4, '0')}${Math.floor(Math.random() * 1e6).toString(36)}`;
  const secret = generateDeviceSecret();
  const [appliance] = await db.query(`INSERT INTO appliance (unit_id, style) VALUES ($1, $2) RETURNING id`, [placement.unitId, style]);
  const [sensor] = await db.query(
    `INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds) VALUES ($1, $2, $3, $4) RETURNING id`,
    [deviceId, appliance.id, await hashDeviceSecret(secret), intervalSeconds],
  );
  return { deviceId, secret, sensorId: sensor.id, applianceId: appliance.id };
}

export function brokerConfig(databaseUrl: string, overrides: Partial<BrokerConfig> = {}): BrokerConfig {
  return {
    host: '127.0.0.1',
    port: 0,
    databaseUrl,
    redisUrl: null,
    brokerId: undefined,
    maxPayloadBytes: 65_536,
    maxSessionDelivery: 100_000,
    ingest: TEST_INGEST,
    logLevel: 'silent',
    ...overrides,
  };
}

export function testBroker(databaseUrl: string, overrides: Partial<BrokerConfig> = {}): Promise<RunningBroker> {
  return startBroker(brokerConfig(databaseUrl, overrides), silentLogger);
}

export function ingestConfig(overrides: Partial<IngestConfig> = {}, env: NodeJS.ProcessEnv = {}): IngestConfig {
  const base = loadIngestConfig({ INGEST_MAX_BATCH_DELAY_MS: '10', INGEST_BACKOFF_INITIAL_MS: '50', INGEST_BACKOFF_MAX_MS: '200', ...env });
  return { ...base, clientId: `cw-ingest-spec-${++counter}`, ...overrides };
}

export function testWorker(mqttUrl: string, databaseUrl: string, config: IngestConfig, onCommitted?: CommittedBatchHook): IngestWorker {
  return new IngestWorker({ mqttUrl, databaseUrl, account: TEST_INGEST, config, logger: silentLogger, onCommitted });
}

export function connectDevice(url: string, device: Pick<TestDevice, 'deviceId' | 'secret'>, extra: mqtt.IClientOptions = {}): Promise<MqttClient> {
  return mqtt.connectAsync(url, { clientId: device.deviceId, username: device.deviceId, password: device.secret, protocolVersion: 4, reconnectPeriod: 0, ...extra });
}

export const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** Polls until `check` is true; fails with `what` after `timeoutMs`. */
export async function eventually(what: string, check: () => Promise<boolean>, timeoutMs = 15_000): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (Date.now() < deadline) {
    if (await check()) return;
    await sleep(50);
  }
  throw new Error(`timed out waiting for ${what}`);
}

export async function countRows(db: DataSource, sql: string, params: unknown[] = []): Promise<number> {
  const [row] = await db.query(sql, params);
  return Number(row.n);
}

/**
 * A TCP proxy in front of PostgreSQL, so a spec can take the database away from the
 * ingest (an outage) and give it back, while the spec itself keeps its own connection.
 */
export class TcpProxy {
  private server: net.Server | null = null;
  private readonly sockets = new Set<net.Socket>();
  private isDown = false;
  port = 0;

  constructor(
    private readonly targetHost: string,
    private readonly targetPort: number,
  ) {}

  async start(): Promise<number> {
    this.server = net.createServer((client) => {
      if (this.isDown) {
        client.destroy();
        return;
      }
      const upstream = net.connect(this.targetPort, this.targetHost);
      for (const socket of [client, upstream]) {
        this.sockets.add(socket);
        socket.on('close', () => this.sockets.delete(socket));
        socket.on('error', () => undefined);
      }
      client.pipe(upstream).pipe(client);
      client.on('close', () => upstream.destroy());
      upstream.on('close', () => client.destroy());
    });
    await new Promise<void>((resolve) => this.server!.listen(0, '127.0.0.1', () => resolve()));
    this.port = (this.server.address() as net.AddressInfo).port;
    return this.port;
  }

  /** Cuts every connection and refuses new ones. */
  down(): void {
    this.isDown = true;
    this.sockets.forEach((socket) => socket.destroy());
  }

  up(): void {
    this.isDown = false;
  }

  async close(): Promise<void> {
    this.down();
    await new Promise<void>((resolve) => (this.server ? this.server.close(() => resolve()) : resolve()));
  }

  /** The same database URL, through this proxy. */
  urlFor(databaseUrl: string): string {
    const url = new URL(databaseUrl);
    url.host = `127.0.0.1:${this.port}`;
    return url.toString();
  }
}

/** Publishes QoS 1 messages keeping up to `window` unacknowledged, and waits for all acks. */
export async function publishAll(client: MqttClient, messages: { topic: string; payload: string }[], window = 100): Promise<void> {
  const pending = new Set<Promise<unknown>>();
  for (const message of messages) {
    const sent = client.publishAsync(message.topic, message.payload, { qos: 1 }).finally(() => pending.delete(sent));
    pending.add(sent);
    if (pending.size >= window) await Promise.race(pending);
  }
  await Promise.all(pending);
}
