import type { Socket } from 'node:net';
import mqtt, { type IPublishPacket, type MqttClient } from 'mqtt';
import { coalesceWrites } from '../telemetry/coalesce-writes';

/**
 * An MQTT 3.1.1 subscriber that acknowledges a QoS 1 message only when told to, so the
 * ingest sends PUBACK after the reading is committed, not when it arrives.
 *
 * MQTT.js 5 offers `customHandleAcks` for MQTT 5 only, and `handleMessage`, which holds
 * back the next packet until its callback runs (one message at a time: far too slow for
 * batching). What we rely on instead, in mqtt 5.16 (lib/handlers/publish.ts): for QoS 1
 * the PUBACK is sent from handleMessage's callback, and only when that callback gets no
 * error; an error there is not emitted, the packet loop simply moves on. So we answer
 * every QoS 1 packet with a marker error (no automatic PUBACK) and later send the PUBACK
 * ourselves through the client's own packet writer. The spec
 * spec/telemetry/ingest-e2e.spec.ts (restart mid-stream) fails if that ever changes.
 *
 * MQTT 3.1.1 §4.6 wants PUBACKs in the order the PUBLISH packets arrived; the pipeline
 * acknowledges batches in arrival order. A PUBACK for a packet of an earlier connection
 * is never sent: the broker redelivers those after the reconnect (§4.4), and the
 * (sensor, time) key stores them once.
 */
export interface InboundMessage {
  topic: string;
  payload: Buffer;
  qos: number;
  /** The connection the message came on; its ack is dropped after a reconnect. */
  connection: number;
  ack(): void;
}

export interface AckingSubscriberOptions {
  url: string;
  clientId: string;
  username: string;
  password: string;
  filters: string[];
  /** Stop reading from the socket while this many messages wait for their ack. */
  maxUnacked: number;
  onMessage(message: InboundMessage): void;
  onConnectionLost?(): void;
  onError?(error: Error): void;
  reconnectPeriodMs?: number;
}

class DeferredAck extends Error {
  constructor() {
    super('acknowledged after commit');
  }
}
const DEFERRED_ACK = new DeferredAck();

type PacketWriter = (packet: { cmd: 'puback'; messageId: number }, callback?: () => void) => void;

export class AckingSubscriber {
  private client: MqttClient | null = null;
  private connection = 0;
  private unacked = 0;
  private resumeReading: (() => void) | null = null;
  private subscribing: Promise<void> = Promise.resolve();

  constructor(private readonly options: AckingSubscriberOptions) {}

  get connected(): boolean {
    return this.client?.connected ?? false;
  }

  get unackedCount(): number {
    return this.unacked;
  }

  async start(): Promise<void> {
    const { options } = this;
    const client = mqtt.connect(options.url, {
      clientId: options.clientId,
      username: options.username,
      password: options.password,
      protocolVersion: 4,
      clean: false,
      keepalive: 30,
      reconnectPeriod: options.reconnectPeriodMs ?? 1000,
      connectTimeout: 10_000,
      resubscribe: false,
    });
    this.client = client;
    client.handleMessage = (packet, callback) => this.handle(packet, callback);
    client.on('connect', () => {
      // A committed batch acknowledges thousands of messages at once: one writev, not one per PUBACK.
      coalesceWrites(client.stream as unknown as Socket);
      this.subscribing = this.subscribe();
    });
    client.on('close', () => this.connectionLost());
    client.on('error', (error) => options.onError?.(error));
    await new Promise<void>((resolve) => client.once('connect', () => resolve()));
    await this.subscribing;
  }

  async stop(): Promise<void> {
    const client = this.client;
    this.client = null;
    this.resumeReading?.();
    if (client) await client.endAsync(true);
  }

  /**
   * One SUBSCRIBE per filter, on every connect (so MQTT.js' own resubscribe is off). One
   * packet with many filters makes aedes 1.2 store the whole list once per filter, and
   * with aedes-persistence-redis those stores wait on one another and the SUBACK never
   * comes; one filter per packet avoids it.
   */
  private async subscribe(): Promise<void> {
    const refused: string[] = [];
    for (const filter of this.options.filters) {
      try {
        await this.client?.subscribeAsync(filter, { qos: 1 });
      } catch (error) {
        if (!this.client?.connected) return;
        refused.push(`${filter} (${(error as Error).message})`);
      }
    }
    if (refused.length) this.options.onError?.(new Error(`subscription refused: ${refused.join(', ')}`));
  }

  private connectionLost(): void {
    this.connection++;
    this.unacked = 0;
    this.resumeReading?.();
    this.options.onConnectionLost?.();
  }

  private handle(packet: IPublishPacket, callback: (error?: Error) => void): void {
    const connection = this.connection;
    const messageId = packet.messageId;
    const needsAck = packet.qos > 0 && messageId !== undefined;
    if (needsAck) this.unacked++;
    const ack = () => (needsAck ? this.sendAck(connection, messageId) : undefined);
    const payload = Buffer.isBuffer(packet.payload) ? packet.payload : Buffer.from(packet.payload);
    this.options.onMessage({ topic: packet.topic, payload, qos: packet.qos, connection, ack });
    if (!needsAck) return callback();
    const next = () => callback(DEFERRED_ACK);
    if (this.unacked < this.options.maxUnacked) return next();
    this.resumeReading = next;
  }

  private sendAck(connection: number, messageId: number): void {
    if (connection !== this.connection || !this.client) return;
    this.unacked--;
    const writePacket = (this.client as unknown as { _sendPacket: PacketWriter })._sendPacket.bind(this.client);
    writePacket({ cmd: 'puback', messageId });
    const resume = this.resumeReading;
    if (resume && this.unacked < this.options.maxUnacked) {
      this.resumeReading = null;
      resume();
    }
  }
}
