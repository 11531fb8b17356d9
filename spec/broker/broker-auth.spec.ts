import mqtt from 'mqtt';
import type { RunningBroker } from '../../broker/create-broker';
import { readingTopic } from '../../shared/telemetry';
import { createTestDatabase, type TestDatabase } from '../support/test-db';
import { TEST_INGEST, connectDevice, countRows, createDevice, createPlacement, eventually, testBroker, type TestDevice } from '../telemetry/support/telemetry-fixture';

/** Resolves with the CONNACK refusal message, or 'connected'. */
async function tryConnect(url: string, options: mqtt.IClientOptions): Promise<string> {
  try {
    const client = await mqtt.connectAsync(url, { protocolVersion: 4, reconnectPeriod: 0, connectTimeout: 5000, ...options });
    await client.endAsync();
    return 'connected';
  } catch (error) {
    return (error as Error).message;
  }
}

/** The SUBACK return codes; MQTT.js rejects the promise when any is a failure (0x80). */
async function grantedCodes(client: mqtt.MqttClient, topics: string[]): Promise<number[]> {
  try {
    return (await client.subscribeAsync(topics, { qos: 1 })).map((grant) => grant.qos);
  } catch (error) {
    return (error as { packet: { granted: number[] } }).packet.granted;
  }
}

describe('broker: per-device credentials', () => {
  let db: TestDatabase;
  let broker: RunningBroker;
  let url: string;
  let sensor: TestDevice;
  let other: TestDevice;

  beforeAll(async () => {
    db = await createTestDatabase();
    const placement = await createPlacement(db.dataSource);
    sensor = await createDevice(db.dataSource, placement);
    other = await createDevice(db.dataSource, placement);
    broker = await testBroker(db.url);
    url = `mqtt://127.0.0.1:${broker.port}`;
  }, 30_000);

  afterAll(async () => {
    await broker?.close();
    await db?.drop();
  });

  const rejectCount = (reason: string, sensorId: string | null) =>
    countRows(db.dataSource, 'SELECT coalesce(sum(count), 0) AS n FROM telemetry_reject_count WHERE reason = $1 AND sensor_id IS NOT DISTINCT FROM $2', [reason, sensorId]);

  it('lets a sensor in with its own id and secret', async () => {
    expect(await tryConnect(url, { clientId: sensor.deviceId, username: sensor.deviceId, password: sensor.secret })).toBe('connected');
  });

  // CONNACK return code 4, "bad user name or password" (MQTT 3.1.1 §3.2.2.3).
  it('refuses a wrong secret and records it on the sensor', async () => {
    const outcome = await tryConnect(url, { clientId: sensor.deviceId, username: sensor.deviceId, password: `${sensor.secret}x` });
    expect(outcome).toMatch(/Bad username or password/);
    await eventually('the wrong-secret reject to be counted', async () => (await rejectCount('wrong-secret', sensor.sensorId)) === 1);
  });

  it('refuses an unregistered device id and a missing secret', async () => {
    expect(await tryConnect(url, { clientId: 'cw-nobody-here', username: 'cw-nobody-here', password: 'whatever' })).toMatch(/Bad username or password/);
    expect(await tryConnect(url, { clientId: other.deviceId, username: other.deviceId })).toMatch(/Bad username or password/);
    await eventually('the unknown-device reject to be counted', async () => (await rejectCount('unknown-device', null)) >= 1);
  });

  // CONNACK return code 2, "identifier rejected": one device cannot take over another's session.
  it('refuses a client id that is not the device id', async () => {
    const outcome = await tryConnect(url, { clientId: other.deviceId, username: sensor.deviceId, password: sensor.secret });
    expect(outcome).toMatch(/Identifier rejected/);
  });

  it('closes the connection of a sensor publishing to another sensor’s topic, and stores nothing', async () => {
    const client = await connectDevice(url, sensor);
    const closed = new Promise<void>((resolve) => client.once('close', () => resolve()));
    client.publish(readingTopic(other.deviceId), JSON.stringify({ sensor: other.deviceId, seq: 1, at: new Date().toISOString(), fresh_food: 3 }), { qos: 1 });
    await closed;
    client.end(true);
    await eventually('the publish-denied reject to be counted', async () => (await rejectCount('publish-denied', sensor.sensorId)) === 1);
    expect(await countRows(db.dataSource, 'SELECT count(*) AS n FROM reading')).toBe(0);
  });

  it('refuses a retained reading on the sensor’s own topic', async () => {
    const client = await connectDevice(url, other);
    const closed = new Promise<void>((resolve) => client.once('close', () => resolve()));
    client.publish(readingTopic(other.deviceId), '{}', { qos: 1, retain: true });
    await closed;
    client.end(true);
    await eventually('the retained publish to be counted', async () => (await rejectCount('publish-denied', other.sensorId)) === 1);
  });

  // A refused subscription gets return code 0x80 in the SUBACK (MQTT 3.1.1 §3.9.3) and the connection stays.
  it('refuses a sensor’s subscription to # and to another sensor’s topic, keeping the connection', async () => {
    const client = await connectDevice(url, sensor);
    expect(await grantedCodes(client, ['#', readingTopic(other.deviceId)])).toEqual([128, 128]);
    expect(client.connected).toBeTrue();
    await client.endAsync();
    await eventually('the subscribe-denied rejects to be counted', async () => (await rejectCount('subscribe-denied', sensor.sensorId)) === 2);
  });

  it('gives the ingest account its shards’ reading topics and nothing else', async () => {
    expect(await tryConnect(url, { clientId: 'cw-ingest-x', username: TEST_INGEST.username, password: 'not-it' })).toMatch(/Bad username or password/);
    const ingest = await mqtt.connectAsync(url, { clientId: 'cw-ingest-y', username: TEST_INGEST.username, password: TEST_INGEST.password, protocolVersion: 4, reconnectPeriod: 0 });
    expect(await grantedCodes(ingest, ['cw/v1/s/3/+/reading', 'cw/v1/s/+/+/reading', '#', 'cw/v1/s/3/cw-abc/reading'])).toEqual([1, 1, 128, 128]);
    await ingest.endAsync();
  });
});
