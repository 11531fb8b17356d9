import type { DataSource } from 'typeorm';
import type { ApplianceHistory, ProbeHistory } from '../../shared/api/telemetry';
import { probesOf, type Probe } from '../../shared/domain';
import { badRequest, notFound } from '../errors';
import { DEFAULT_MAX_POINTS, planAuto, planLttb, type HistoryPlan } from './history-resolution';
import { applianceMeta, countRaw, rawSeries, rollupSeries, type ProbeSeries, type Range, type SensorLiveness } from './history-queries';
import { isSilent } from './liveness';
import { lttb } from './lttb';

/**
 * The one scope check of telemetry reads: throws (404 for out of scope, so nobody learns
 * that another organization's appliance exists) unless the actor may read this
 * appliance's readings. The accounts work supplies it (Scope.requireAppliance).
 */
export interface TelemetryAccess<Actor> {
  assertCanReadAppliance(actor: Actor, applianceId: string): Promise<void>;
}

export interface HistoryQuery {
  fromMs: number;
  toMs: number;
  maxPoints?: number;
  method?: 'auto' | 'lttb';
}

const MAX_RANGE_MS = 10 * 366 * 86_400_000;
const MINUTE_MS = 60_000;
const HOUR_MS = 60 * MINUTE_MS;

export class HistoryService<Actor> {
  constructor(
    private readonly db: DataSource,
    private readonly access: TelemetryAccess<Actor>,
    private readonly nowMs: () => number = Date.now,
  ) {}

  async applianceHistory(actor: Actor, applianceId: string, query: HistoryQuery): Promise<ApplianceHistory> {
    await this.access.assertCanReadAppliance(actor, applianceId);
    const range = this.checkRange(applianceId, query);
    const maxPoints = query.maxPoints ?? DEFAULT_MAX_POINTS;
    const [meta, rawPerProbe] = await Promise.all([applianceMeta(this.db, applianceId), countRaw(this.db, range)]);
    if (!meta) throw notFound('appliance');
    const plan = query.method === 'lttb' ? planLttb(range.toMs - range.fromMs, rawPerProbe) : planAuto(range.toMs - range.fromMs, rawPerProbe, maxPoints);
    const series = await this.fetch(plan, range);
    if (plan.resolution === 'lttb') {
      for (const probe of Object.values(series)) {
        probe.points = lttb(probe.points, maxPoints);
        probe.envelope = null;
      }
    }
    return {
      applianceId,
      from: new Date(range.fromMs).toISOString(),
      to: new Date(range.toMs).toISOString(),
      resolution: plan.resolution,
      source: plan.source,
      bucketMs: plan.bucketMs,
      probes: this.pick(series, probesOf(meta.style)),
      sensor: this.liveness(meta.sensor),
    };
  }

  private checkRange(applianceId: string, query: HistoryQuery): Range {
    if (!(query.toMs > query.fromMs)) throw badRequest('`to` must be after `from`');
    if (query.toMs - query.fromMs > MAX_RANGE_MS) throw badRequest('a history range is at most ten years');
    return { applianceId, fromMs: query.fromMs, toMs: query.toMs };
  }

  private fetch(plan: HistoryPlan, range: Range): Promise<ProbeSeries> {
    if (plan.source === 'reading') return rawSeries(this.db, range);
    const table = plan.source === 'rollup_5m' ? 'reading_rollup_5m' : 'reading_rollup_1h';
    const widthMs = plan.bucketMs ?? (plan.source === 'rollup_5m' ? 5 * MINUTE_MS : HOUR_MS);
    return rollupSeries(this.db, table, range, widthMs);
  }

  private pick(series: ProbeSeries, probes: readonly Probe[]): Partial<Record<Probe, ProbeHistory>> {
    return Object.fromEntries(probes.map((probe) => [probe, series[probe]]));
  }

  private liveness(sensor: SensorLiveness | null): ApplianceHistory['sensor'] {
    if (!sensor) return null;
    return {
      lastSeenAt: sensor.lastSeenAtMs === null ? null : new Date(sensor.lastSeenAtMs).toISOString(),
      intervalSeconds: sensor.intervalSeconds,
      silent: isSilent(sensor.lastSeenAtMs, sensor.intervalSeconds, this.nowMs()),
    };
  }
}
