import type { Pool, PoolClient } from 'pg';
import type { Logger } from 'pino';
import type { RejectReason } from '../../shared/api/telemetry';
import type { InboundMessage } from './acking-subscriber';
import type { PartitionManager } from './partitions';
import { payloadExcerpt, writeRejects, type RejectEntry } from './rejects';
import type { SensorDirectory, SensorRef } from './sensor-directory';
import { insertReadingsListingNew, type StoredReading } from './store';
import { validateMessage, type ValidationLimits, type Verdict } from './validate';

/**
 * What the ingest hands on after a commit: the readings that were new (duplicates left
 * out), ordered by appliance and reading time. Within one worker batches arrive in
 * order, and a sensor's shard belongs to exactly one worker, so each appliance's
 * readings reach this hook in one place, in order. The detection engine plugs in here.
 */
export interface CommittedBatch {
  readings: StoredReading[];
  committedAtMs: number;
}
export type CommittedBatchHook = (batch: CommittedBatch) => void | Promise<void>;

export interface PipelineSettings {
  batchSize: number;
  maxBatchDelayMs: number;
  /** QoS 0 messages beyond this many queued are dropped (they carry no delivery promise). */
  maxQueued: number;
  backoffInitialMs: number;
  backoffMaxMs: number;
}

export interface PipelineDeps {
  pool: Pool;
  directory: SensorDirectory;
  partitions: PartitionManager;
  limits: () => ValidationLimits;
  logger: Logger;
  onCommitted?: CommittedBatchHook;
}

export interface PipelineStats {
  received: number;
  stored: number;
  duplicates: number;
  rejected: Partial<Record<RejectReason, number>>;
  batches: number;
  retries: number;
  droppedQos0: number;
  queued: number;
  lastError: string | null;
  /** When the last batch was committed. */
  lastCommitAtMs: number | null;
  /** Since when storing has been failing and being retried; null while writes succeed. */
  failingSinceMs: number | null;
}

interface QueuedItem {
  message: InboundMessage;
  verdict: Verdict;
  receivedAtMs: number;
}

interface SortedBatch {
  readings: StoredReading[];
  rejects: RejectEntry[];
  /** Copies of one reading within the batch itself. */
  repeats: number;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/** SQLSTATE class 22 (data exception) or 23 (integrity constraint violation). */
function isDataError(error: unknown): boolean {
  const code = (error as { code?: unknown }).code;
  return typeof code === 'string' && /^2[23]/.test(code);
}

function rejectOf({ message, receivedAtMs }: QueuedItem, reason: RejectReason, detail: string, deviceId: string | null, sensorId: string | null): RejectEntry {
  return {
    source: 'ingest',
    reason,
    atMs: receivedAtMs,
    sensorId,
    deviceId,
    topic: message.topic.slice(0, 200),
    detail,
    payloadExcerpt: payloadExcerpt(message.payload),
  };
}

/** Orders the readings the way detection wants them: per appliance, by reading time. */
function byApplianceAndTime(a: StoredReading, b: StoredReading): number {
  const appliance = (a.applianceId ?? '').localeCompare(b.applianceId ?? '');
  return appliance !== 0 ? appliance : a.atMs - b.atMs;
}

export class IngestPipeline {
  private queue: QueuedItem[] = [];
  private flushing = false;
  private timer: NodeJS.Timeout | null = null;
  private stopped = false;
  private idleWaiters: (() => void)[] = [];
  private readonly counters: PipelineStats = {
    received: 0,
    stored: 0,
    duplicates: 0,
    rejected: {},
    batches: 0,
    retries: 0,
    droppedQos0: 0,
    queued: 0,
    lastError: null,
    lastCommitAtMs: null,
    failingSinceMs: null,
  };

  constructor(
    private readonly deps: PipelineDeps,
    private readonly settings: PipelineSettings,
  ) {}

  stats(): PipelineStats {
    return { ...this.counters, rejected: { ...this.counters.rejected }, queued: this.queue.length };
  }

  push(message: InboundMessage): void {
    this.counters.received++;
    if (message.qos === 0 && this.queue.length >= this.settings.maxQueued) {
      this.counters.droppedQos0++;
      return;
    }
    const verdict = validateMessage(message.topic, message.payload, this.deps.limits());
    this.queue.push({ message, verdict, receivedAtMs: Date.now() });
    this.kick();
  }

  /** Messages of a lost connection will be redelivered: drop the ones not being written yet. */
  connectionLost(): void {
    this.queue = [];
  }

  /** Resolves when nothing is queued or being written. */
  idle(): Promise<void> {
    if (!this.flushing && !this.queue.length) return Promise.resolve();
    return new Promise((resolve) => this.idleWaiters.push(resolve));
  }

  /** Stops taking batches; a batch being written finishes (or is abandoned unacknowledged). */
  async stop(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearTimeout(this.timer);
    this.queue = [];
    await this.idle();
  }

  private kick(): void {
    if (this.flushing || this.stopped) return;
    if (this.queue.length >= this.settings.batchSize) {
      void this.flushLoop();
    } else if (!this.timer) {
      this.timer = setTimeout(() => void this.flushLoop(), this.settings.maxBatchDelayMs);
    }
  }

  /** Writes batches one after the other, so acknowledgements keep the arrival order. */
  private async flushLoop(): Promise<void> {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.flushing) return;
    this.flushing = true;
    try {
      while (this.queue.length && !this.stopped) {
        const batch = this.queue.splice(0, this.settings.batchSize);
        const committed = await this.writeWithRetry(batch);
        if (!committed) break;
        for (const item of batch) item.message.ack();
        await this.handOn(committed);
      }
    } finally {
      this.flushing = false;
      if (!this.queue.length || this.stopped) this.idleWaiters.splice(0).forEach((resolve) => resolve());
      else this.kick();
    }
  }

  /**
   * Retries with exponential back-off until the batch is stored; null when stopped first.
   * A data error (SQLSTATE class 22 or 23) is no outage: retrying would block the ingest
   * for good, so the batch is written in halves until the one refused message is found,
   * and that one is stored as a `store-error` reject instead.
   */
  private async writeWithRetry(batch: QueuedItem[]): Promise<StoredReading[] | null> {
    let delayMs = this.settings.backoffInitialMs;
    for (;;) {
      try {
        const stored = await this.write(batch);
        this.counters.lastCommitAtMs = Date.now();
        this.counters.failingSinceMs = null;
        return stored;
      } catch (error) {
        if (isDataError(error)) return this.isolate(batch, error as Error);
        this.counters.failingSinceMs ??= Date.now();
        this.counters.retries++;
        this.counters.lastError = (error as Error).message;
        this.deps.logger.warn({ err: error, retryInMs: delayMs, batch: batch.length }, 'ingest: storing a batch failed; retrying');
        await sleep(delayMs);
        if (this.stopped) return null;
        delayMs = Math.min(delayMs * 2, this.settings.backoffMaxMs);
      }
    }
  }

  private async isolate(batch: QueuedItem[], error: Error): Promise<StoredReading[] | null> {
    if (batch.length === 1) {
      const [item] = batch;
      if (!item.verdict.ok && item.verdict.reason === 'store-error') {
        // Even its reject was refused: drop it (logged) rather than block the ingest.
        this.deps.logger.error({ err: error, topic: item.message.topic }, 'ingest: could not store a reject; dropped');
        return [];
      }
      this.deps.logger.error({ err: error, topic: item.message.topic }, 'ingest: the database refused a reading; stored as a reject');
      const deviceId = item.verdict.ok ? item.verdict.reading.deviceId : item.verdict.deviceId;
      return this.writeWithRetry([{ ...item, verdict: { ok: false, reason: 'store-error', detail: error.message.slice(0, 200), deviceId } }]);
    }
    const middle = Math.ceil(batch.length / 2);
    const first = await this.writeWithRetry(batch.slice(0, middle));
    if (!first) return null;
    const second = await this.writeWithRetry(batch.slice(middle));
    return second ? first.concat(second) : null;
  }

  private async write(batch: QueuedItem[]): Promise<StoredReading[]> {
    const client = await this.deps.pool.connect();
    try {
      const deviceIds = batch.flatMap((item) => (item.verdict.ok ? [item.verdict.reading.deviceId] : item.verdict.deviceId ? [item.verdict.deviceId] : []));
      const sensors = await this.deps.directory.resolve(client, deviceIds);
      const sorted = this.sort(batch, sensors);
      await this.deps.partitions.ensureFor(client, sorted.readings.map((reading) => reading.atMs));
      const inserted = await this.commit(client, sorted);
      this.count(sorted, inserted.length);
      return inserted;
    } finally {
      client.release();
    }
  }

  private async commit(client: PoolClient, sorted: SortedBatch): Promise<StoredReading[]> {
    await client.query('BEGIN');
    try {
      const keys = await insertReadingsListingNew(client, sorted.readings);
      await writeRejects(client, sorted.rejects);
      await client.query('COMMIT');
      const fresh = new Set(keys.map((key) => `${key.sensorId}|${key.atMs}`));
      return sorted.readings.filter((reading) => fresh.has(`${reading.sensorId}|${reading.atMs}`));
    } catch (error) {
      await client.query('ROLLBACK').catch(() => undefined);
      throw error;
    }
  }

  /** Splits a batch into storable readings (one per sensor and time) and rejects. */
  private sort(batch: QueuedItem[], sensors: Map<string, SensorRef | null>): SortedBatch {
    const readings: StoredReading[] = [];
    const rejects: RejectEntry[] = [];
    const seen = new Set<string>();
    let repeats = 0;
    for (const item of batch) {
      const { verdict } = item;
      if (!verdict.ok) {
        const sensorId = verdict.deviceId ? (sensors.get(verdict.deviceId)?.sensorId ?? null) : null;
        rejects.push(rejectOf(item, verdict.reason, verdict.detail, verdict.deviceId, sensorId));
        continue;
      }
      const ref = sensors.get(verdict.reading.deviceId);
      if (!ref) {
        rejects.push(rejectOf(item, 'unknown-sensor', `device id ${verdict.reading.deviceId}`, verdict.reading.deviceId, null));
        continue;
      }
      for (const note of verdict.notes) rejects.push(rejectOf(item, note.reason, note.detail, verdict.reading.deviceId, ref.sensorId));
      const key = `${ref.sensorId}|${verdict.reading.atMs}`;
      if (seen.has(key)) {
        repeats++;
        continue;
      }
      seen.add(key);
      readings.push({ ...verdict.reading, sensorId: ref.sensorId, applianceId: ref.applianceId });
    }
    return { readings, rejects, repeats };
  }

  private count(sorted: SortedBatch, insertedCount: number): void {
    this.counters.batches++;
    this.counters.stored += insertedCount;
    this.counters.duplicates += sorted.readings.length - insertedCount + sorted.repeats;
    for (const reject of sorted.rejects) this.counters.rejected[reject.reason] = (this.counters.rejected[reject.reason] ?? 0) + 1;
  }

  private async handOn(readings: StoredReading[]): Promise<void> {
    if (!this.deps.onCommitted || !readings.length) return;
    try {
      await this.deps.onCommitted({ readings: [...readings].sort(byApplianceAndTime), committedAtMs: Date.now() });
    } catch (error) {
      this.deps.logger.error({ err: error }, 'ingest: the committed-batch hook failed');
    }
  }
}
