import type { DataSource } from 'typeorm';
import type { HistoryEnvelopePoint, HistoryPoint, ProbeHistory } from '../../shared/api/telemetry';
import type { ApplianceStyle, Probe } from '../../shared/domain';

/** Same origin as the rollups (server/ingest/store.ts), so merged buckets line up with stored ones. */
const BUCKET_ORIGIN = `TIMESTAMPTZ '2000-01-01 00:00:00+00'`;

export interface Range {
  applianceId: string;
  fromMs: number;
  toMs: number;
}

export type ProbeSeries = Record<Probe, ProbeHistory>;

const emptySeries = (withEnvelope: boolean): ProbeSeries => ({
  fresh_food: { points: [], envelope: withEnvelope ? [] : null },
  freezer: { points: [], envelope: withEnvelope ? [] : null },
});

/** Readings per probe in the range, from the hourly rollups (an upper bound at the edges). One index range scan. */
export async function countRaw(db: DataSource, range: Range): Promise<number> {
  const [row] = await db.query(
    `SELECT coalesce(greatest(sum(fresh_food_count), sum(freezer_count)), 0)::int AS n
       FROM reading_rollup_1h
      WHERE appliance_id = $1 AND bucket >= date_bin('1 hour', $2::timestamptz, ${BUCKET_ORIGIN}) AND bucket < $3`,
    [range.applianceId, new Date(range.fromMs), new Date(range.toMs)],
  );
  return row.n;
}

export async function rawSeries(db: DataSource, range: Range): Promise<ProbeSeries> {
  const rows: { t: number; ff: number | null; fz: number | null }[] = await db.query(
    `SELECT (extract(epoch FROM at) * 1000)::float8 AS t, fresh_food_c AS ff, freezer_c AS fz
       FROM reading WHERE appliance_id = $1 AND at >= $2 AND at < $3 ORDER BY at`,
    [range.applianceId, new Date(range.fromMs), new Date(range.toMs)],
  );
  const series = emptySeries(false);
  for (const row of rows) {
    if (row.ff !== null) series.fresh_food.points.push([row.t, row.ff]);
    if (row.fz !== null) series.freezer.points.push([row.t, row.fz]);
  }
  return series;
}

type RollupRow = { t: number; ff_min: number | null; ff_max: number | null; ff_mean: number | null; fz_min: number | null; fz_max: number | null; fz_mean: number | null };

const round3 = (value: number) => Math.round(value * 1000) / 1000;

/**
 * Rollup buckets of `widthMs` from a rollup table: merging is exact because the table keeps
 * min, max, sum and count (the mean is sum / count over the merged buckets).
 */
export async function rollupSeries(db: DataSource, table: 'reading_rollup_5m' | 'reading_rollup_1h', range: Range, widthMs: number): Promise<ProbeSeries> {
  const width = `${Math.round(widthMs / 1000)} seconds`;
  const rows: RollupRow[] = await db.query(
    // Group on the timestamp and convert only the merged buckets to epoch ms (numeric
    // arithmetic on every hourly row would cost more than the grouping itself).
    `SELECT (extract(epoch FROM merged) * 1000)::float8 AS t, ff_min, ff_max, ff_mean, fz_min, fz_max, fz_mean FROM (
       SELECT date_bin($2::interval, bucket, ${BUCKET_ORIGIN}) AS merged,
              min(fresh_food_min) AS ff_min, max(fresh_food_max) AS ff_max, sum(fresh_food_sum) / nullif(sum(fresh_food_count), 0) AS ff_mean,
              min(freezer_min) AS fz_min, max(freezer_max) AS fz_max, sum(freezer_sum) / nullif(sum(freezer_count), 0) AS fz_mean
         FROM ${table}
        WHERE appliance_id = $1 AND bucket >= date_bin($2::interval, $3::timestamptz, ${BUCKET_ORIGIN}) AND bucket < $4
        GROUP BY 1
     ) buckets ORDER BY merged`,
    [range.applianceId, width, new Date(range.fromMs), new Date(range.toMs)],
  );
  const series = emptySeries(true);
  const add = (probe: ProbeHistory, t: number, mean: number | null, min: number | null, max: number | null) => {
    if (mean === null || min === null || max === null) return;
    probe.points.push([t, round3(mean)] as HistoryPoint);
    probe.envelope!.push([t, min, max] as HistoryEnvelopePoint);
  };
  for (const row of rows) {
    add(series.fresh_food, row.t, row.ff_mean, row.ff_min, row.ff_max);
    add(series.freezer, row.t, row.fz_mean, row.fz_min, row.fz_max);
  }
  return series;
}

export interface SensorLiveness {
  lastSeenAtMs: number | null;
  intervalSeconds: number;
}

export interface ApplianceMeta {
  style: ApplianceStyle;
  /** The appliance's current sensor (newest, not archived), if it has one. */
  sensor: SensorLiveness | null;
}

/** The appliance's style and current sensor in one round trip; null when there is no such appliance. */
export async function applianceMeta(db: DataSource, applianceId: string): Promise<ApplianceMeta | null> {
  const [row] = await db.query(
    `SELECT a.style, s.last_seen_at, s.interval_seconds
       FROM appliance a
       LEFT JOIN LATERAL (
         SELECT last_seen_at, interval_seconds FROM sensor WHERE appliance_id = a.id AND archived_at IS NULL ORDER BY created_at DESC LIMIT 1
       ) s ON true
      WHERE a.id = $1`,
    [applianceId],
  );
  if (!row) return null;
  const sensor = row.interval_seconds === null ? null : { lastSeenAtMs: row.last_seen_at ? new Date(row.last_seen_at).getTime() : null, intervalSeconds: row.interval_seconds };
  return { style: row.style, sensor };
}
