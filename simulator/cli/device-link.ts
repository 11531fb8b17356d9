import mqtt, { type MqttClient } from 'mqtt';
import { readingTopic, type ReadingPayload } from '../../shared/telemetry';
import type { SimSample } from '../model';
import type { FleetDevice } from './fleet';

/** The payload a sensor publishes for one sample (see shared/telemetry.ts). */
export function readingPayload(deviceId: string, seq: number, sample: SimSample): ReadingPayload {
  const payload: ReadingPayload = { sensor: deviceId, seq, at: new Date(sample.atMs).toISOString() };
  if (sample.freshFoodC !== null) payload.fresh_food = sample.freshFoodC;
  if (sample.freezerC !== null) payload.freezer = sample.freezerC;
  // A probe the appliance has but that dropped out is reported as null, not left out.
  if (payload.fresh_food === undefined && payload.freezer === undefined) payload.fresh_food = null;
  payload.battery_v = sample.batteryV;
  payload.door = sample.doorOpen ? 'open' : 'closed';
  return payload;
}

/**
 * One sensor's MQTT connection, signed in with its own credentials. Publishes QoS 1 in
 * a window of unacknowledged messages (a tight unwindowed loop stalls MQTT.js; one at a
 * time is slow), so a backfill of weeks takes seconds.
 */
export class DeviceLink {
  private inFlight = 0;
  private waiting: (() => void)[] = [];
  private failures = 0;

  private constructor(
    readonly device: FleetDevice,
    private readonly client: MqttClient,
    private readonly window: number,
  ) {}

  static async open(url: string, device: FleetDevice, window = 64): Promise<DeviceLink> {
    const client = await mqtt.connectAsync(url, {
      clientId: device.deviceId,
      username: device.deviceId,
      password: device.secret,
      protocolVersion: 4,
      // A real sensor keeps its session so the broker finishes QoS 1 handshakes after a drop.
      clean: false,
      reconnectPeriod: 2000,
      keepalive: 60,
    });
    return new DeviceLink(device, client, window);
  }

  get failed(): number {
    return this.failures;
  }

  /** Resolves once the message is handed to the client and the window has room again. */
  async publish(payload: ReadingPayload): Promise<void> {
    while (this.inFlight >= this.window) await new Promise<void>((resolve) => this.waiting.push(resolve));
    this.inFlight++;
    this.client
      .publishAsync(readingTopic(this.device.deviceId), JSON.stringify(payload), { qos: 1 })
      .catch(() => this.failures++)
      .finally(() => {
        this.inFlight--;
        this.waiting.shift()?.();
      });
  }

  /** Resolves when every published message is acknowledged by the broker. */
  async drain(): Promise<void> {
    while (this.inFlight > 0) await new Promise<void>((resolve) => this.waiting.push(resolve));
  }

  async close(): Promise<void> {
    await this.drain();
    await this.client.endAsync();
  }
}
