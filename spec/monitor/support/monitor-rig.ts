import { Pool } from 'pg';
import pino from 'pino';
import type { DataSource } from 'typeorm';
import type { Clock } from '../../../server/auth/clock';
import { EventBus, type BusEvent } from '../../../server/events/bus';
import { PartitionManager } from '../../../server/ingest/partitions';
import { IngestPipeline, type CommittedBatchHook } from '../../../server/ingest/pipeline';
import { SensorDirectory } from '../../../server/ingest/sensor-directory';
import { MonitorService } from '../../../server/monitor/monitor-service';
import { readingTopic } from '../../../shared/telemetry';
import { readingPayload } from '../../../simulator/cli/device-link';
import type { SimSample } from '../../../simulator/model';

export const MINUTE_MS = 60_000;
export const HOUR_MS = 60 * MINUTE_MS;
export const DAY_MS = 24 * HOUR_MS;
export const silentLogger = pino({ level: 'silent' });

/** A clock the spec sets: the monitor and the work-order rules read "now" from it. */
export class SpecClock implements Clock {
  constructor(public currentMs = Date.now()) {}
  now(): Date {
    return new Date(this.currentMs);
  }
  set(ms: number): void {
    this.currentMs = ms;
  }
  advance(ms: number): void {
    this.currentMs += ms;
  }
}

export interface DeviceSamples {
  deviceId: string;
  samples: SimSample[];
}

/**
 * The real ingest pipeline (validation, storage, rollups, sensor last-seen) writing to the
 * spec's database and handing committed batches to the hook, as the server wires it; only
 * the MQTT subscription is left out, messages are pushed in directly.
 */
export class IngestRig {
  readonly pool: Pool;
  readonly pipeline: IngestPipeline;
  /** What the hook threw: the pipeline only logs it, the spec should see it. */
  readonly hookErrors: unknown[] = [];
  private readonly seqs = new Map<string, number>();

  constructor(databaseUrl: string, hook: CommittedBatchHook | undefined, batchSize = 500) {
    this.pool = new Pool({ connectionString: databaseUrl, max: 2 });
    this.pool.on('error', () => undefined);
    const recorded: CommittedBatchHook | undefined = hook
      ? async (batch) => {
          try {
            await hook(batch);
          } catch (error) {
            this.hookErrors.push(error);
            throw error;
          }
        }
      : undefined;
    this.pipeline = new IngestPipeline(
      {
        pool: this.pool,
        directory: new SensorDirectory(),
        partitions: new PartitionManager(this.pool),
        limits: () => ({ nowMs: Date.now(), oldestAcceptedMs: Date.now() - 400 * DAY_MS, maxFutureSkewMs: 5 * MINUTE_MS }),
        logger: silentLogger,
        onCommitted: recorded,
      },
      { batchSize, maxBatchDelayMs: 2, maxQueued: 10_000_000, backoffInitialMs: 10, backoffMaxMs: 100 },
    );
  }

  /** Pushes the devices' samples interleaved by time, as a fleet reports, and waits until all are handled. */
  async play(devices: DeviceSamples[], fromMs = -Infinity, toMs = Infinity): Promise<void> {
    const all = devices.flatMap(({ deviceId, samples }) => samples.filter((s) => s.atMs >= fromMs && s.atMs < toMs).map((sample) => ({ deviceId, sample })));
    all.sort((a, b) => a.sample.atMs - b.sample.atMs);
    for (const { deviceId, sample } of all) {
      const seq = this.seqs.get(deviceId) ?? 0;
      this.seqs.set(deviceId, seq + 1);
      const payload = Buffer.from(JSON.stringify(readingPayload(deviceId, seq, sample)));
      this.pipeline.push({ topic: readingTopic(deviceId), payload, qos: 1, connection: 0, ack: () => undefined });
    }
    await this.pipeline.idle();
    if (this.hookErrors.length) throw this.hookErrors[0];
  }

  async close(): Promise<void> {
    await this.pipeline.stop();
    await this.pool.end();
  }
}

/** A monitor on its own bus, recording every event it publishes. */
export function monitorOn(dataSource: DataSource, clock: Clock, bus = new EventBus(silentLogger)): { monitor: MonitorService; bus: EventBus; events: BusEvent[] } {
  const events: BusEvent[] = [];
  bus.onAny((event) => {
    events.push(event);
  });
  return { monitor: new MonitorService({ dataSource, bus, logger: silentLogger, clock }), bus, events };
}
