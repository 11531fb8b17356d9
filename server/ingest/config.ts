import { SHARD_COUNT } from '../../shared/telemetry';
import type { PipelineSettings } from './pipeline';

/** Ingest settings from the environment; every one has a default that suits one machine. */
export interface IngestConfig {
  /** The shards this worker owns (disjoint across workers; together all of them). */
  shards: number[];
  /** Fixed per worker, so its persistent session (and the messages queued in it) survives restarts. */
  clientId: string;
  pipeline: PipelineSettings;
  /** Stop reading from the broker while this many messages wait for their commit. */
  maxUnacked: number;
  /** Raw readings (and 5-minute rollups) older than this are dropped; hourly rollups are kept. */
  retentionDays: number;
  maxFutureSkewMs: number;
  maintenanceIntervalMs: number;
}

/** "all", or a list like "0-31" or "0,4,8-11". */
export function parseShards(spec: string | undefined): number[] {
  if (!spec || spec === 'all') return Array.from({ length: SHARD_COUNT }, (_, shard) => shard);
  const shards = new Set<number>();
  for (const part of spec.split(',').map((text) => text.trim())) {
    const match = /^(\d+)(?:-(\d+))?$/.exec(part);
    if (!match) throw new Error(`INGEST_SHARDS: cannot read "${part}"`);
    const first = Number(match[1]);
    const last = Number(match[2] ?? match[1]);
    if (first > last || last >= SHARD_COUNT) throw new Error(`INGEST_SHARDS: ${part} is outside 0-${SHARD_COUNT - 1}`);
    for (let shard = first; shard <= last; shard++) shards.add(shard);
  }
  return [...shards].sort((a, b) => a - b);
}

function compactShards(shards: number[]): string {
  if (shards.length === SHARD_COUNT) return 'all';
  const ranges: string[] = [];
  for (let i = 0; i < shards.length; i++) {
    const start = shards[i];
    while (i + 1 < shards.length && shards[i + 1] === shards[i] + 1) i++;
    ranges.push(start === shards[i] ? `${start}` : `${start}-${shards[i]}`);
  }
  return ranges.join('_');
}

function integer(value: string | undefined, fallback: number, min: number): number {
  const parsed = Number(value);
  return value !== undefined && Number.isInteger(parsed) && parsed >= min ? parsed : fallback;
}

export function loadIngestConfig(env: NodeJS.ProcessEnv = process.env): IngestConfig {
  const shards = parseShards(env.INGEST_SHARDS);
  return {
    shards,
    clientId: env.INGEST_CLIENT_ID ?? `cw-ingest-${compactShards(shards)}`.slice(0, 64),
    pipeline: {
      batchSize: integer(env.INGEST_BATCH_SIZE, 5000, 1),
      maxBatchDelayMs: integer(env.INGEST_MAX_BATCH_DELAY_MS, 20, 0),
      maxQueued: integer(env.INGEST_MAX_QUEUED, 20_000, 1),
      backoffInitialMs: integer(env.INGEST_BACKOFF_INITIAL_MS, 250, 1),
      backoffMaxMs: integer(env.INGEST_BACKOFF_MAX_MS, 30_000, 1),
    },
    maxUnacked: integer(env.INGEST_MAX_UNACKED, 10_000, 1),
    retentionDays: integer(env.READING_RETENTION_DAYS, 400, 1),
    maxFutureSkewMs: integer(env.INGEST_MAX_FUTURE_SKEW_MS, 5 * 60_000, 0),
    maintenanceIntervalMs: integer(env.INGEST_MAINTENANCE_INTERVAL_MS, 60 * 60_000, 1000),
  };
}
