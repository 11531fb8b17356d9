/**
 * The sensors' side of the ingest benchmark, in its own process (spec/bench/ingest-bench.ts
 * starts it): signs every device in with its own credentials, prints "ready", and on each
 * "go <json>" line on standard input publishes a run of readings, then prints "done <json>".
 *
 * A run: `count` readings spread round-robin over the devices, QoS 1, at most `window`
 * unacknowledged per connection; `ratePerS` paces the run (null: as fast as it goes);
 * `timestamps: "publish"` stamps each reading with its publish time (for latency),
 * otherwise `baseMs + seq * stepMs`.
 */
import readline from 'node:readline';
import mqtt, { type MqttClient } from 'mqtt';
import { readingTopic } from '../../shared/telemetry';

interface Device {
  deviceId: string;
  secret: string;
  /** The broker this sensor signs in to (the clustered benchmark spreads them over two). */
  url: string;
}

interface Run {
  count: number;
  window: number;
  ratePerS: number | null;
  timestamps: 'publish' | 'sequence';
  baseMs: number;
  stepMs: number;
  firstSeq: number;
}

interface Link {
  client: MqttClient;
  topic: string;
  deviceId: string;
  inFlight: number;
  waiters: (() => void)[];
  /** Publish-time stamps stay distinct per device: (sensor, time) is the reading's key. */
  lastAtMs: number;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

async function open(device: Device): Promise<Link> {
  const client = await mqtt.connectAsync(device.url, { clientId: device.deviceId, username: device.deviceId, password: device.secret, protocolVersion: 4, reconnectPeriod: 0, keepalive: 120 });
  return { client, topic: readingTopic(device.deviceId), deviceId: device.deviceId, inFlight: 0, waiters: [], lastAtMs: 0 };
}

async function send(link: Link, payload: string, window: number): Promise<void> {
  while (link.inFlight >= window) await new Promise<void>((resolve) => link.waiters.push(resolve));
  link.inFlight++;
  link.client.publish(link.topic, payload, { qos: 1 }, () => {
    link.inFlight--;
    link.waiters.shift()?.();
  });
}

function payloadFor(link: Link, seq: number, run: Run): string {
  const atMs = run.timestamps === 'publish' ? Math.max(Date.now(), link.lastAtMs + 1) : run.baseMs + seq * run.stepMs;
  link.lastAtMs = atMs;
  const freshFoodC = 3 + ((seq * 7) % 32) / 16;
  return `{"sensor":"${link.deviceId}","seq":${seq},"at":"${new Date(atMs).toISOString()}","fresh_food":${freshFoodC},"freezer":-18.5,"battery_v":3.01,"door":"closed"}`;
}

/**
 * Each connection publishes its share in its own loop (round-robin over one loop would
 * stall every sensor behind the one whose window is full). A paced run gives reading k of
 * sensor i the slot (k · sensors + i) / rate.
 */
async function linkLoop(link: Link, index: number, sensors: number, run: Run, startedMs: number): Promise<void> {
  for (let k = 0; k * sensors + index < run.count; k++) {
    if (run.ratePerS) {
      const aheadMs = startedMs + ((k * sensors + index) / run.ratePerS) * 1000 - Date.now();
      if (aheadMs >= 1) await sleep(aheadMs);
    }
    await send(link, payloadFor(link, run.firstSeq + k, run), run.window);
  }
  while (link.inFlight > 0) await new Promise<void>((resolve) => link.waiters.push(resolve));
}

async function publishRun(links: Link[], run: Run): Promise<{ publishMs: number }> {
  const startedMs = Date.now();
  await Promise.all(links.map((link, index) => linkLoop(link, index, links.length, run, startedMs)));
  return { publishMs: Date.now() - startedMs };
}

async function main(): Promise<void> {
  const { devices } = JSON.parse(process.argv[2]) as { devices: Device[] };
  const links = await Promise.all(devices.map((device) => open(device)));
  process.stdout.write('ready\n');
  const lines = readline.createInterface({ input: process.stdin });
  for await (const line of lines) {
    if (line === 'quit') break;
    if (!line.startsWith('go ')) continue;
    const result = await publishRun(links, JSON.parse(line.slice(3)) as Run);
    process.stdout.write(`done ${JSON.stringify(result)}\n`);
  }
  await Promise.all(links.map((link) => link.client.endAsync()));
  process.exit(0);
}

main().catch((error) => {
  process.stderr.write(`publisher: ${(error as Error).message}\n`);
  process.exit(1);
});
