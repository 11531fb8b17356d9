/**
 * The smoothed level of each probe after every quarter hour, kept by the monitor for the
 * work-order verification, which must see the whole path of a batch (a backfilled batch
 * can span hours) and not only where it ended. Same definition as the engine's level:
 * the median of the quarter-hour means over the level window (settings.ts), so a door
 * opening or a defrost filling one or two buckets does not move it.
 */
import type { Probe } from '../../shared/domain';
import type { DetectionSettings } from '../detection/settings';
import type { LevelPoint } from '../events/internal';

interface ProbeBuckets {
  sumC: number;
  count: number;
  meansC: number[];
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 ? sorted[middle] : (sorted[middle - 1] + sorted[middle]) / 2;
}

export class LevelTrail {
  private bucketIndex: number | null = null;
  private readonly probes = new Map<Probe, ProbeBuckets>();
  private readonly bucketMs: number;
  private readonly windowBuckets: number;
  private points: LevelPoint[] = [];

  constructor(probes: readonly Probe[], settings: Pick<DetectionSettings, 'bucketMinutes' | 'levelWindowMinutes'>) {
    for (const probe of probes) this.probes.set(probe, { sumC: 0, count: 0, meansC: [] });
    this.bucketMs = settings.bucketMinutes * 60_000;
    this.windowBuckets = Math.max(1, Math.round(settings.levelWindowMinutes / settings.bucketMinutes));
  }

  /** A valid reading (null for a missing or flagged probe value). */
  add(atMs: number, valuesC: Partial<Record<Probe, number | null>>): void {
    const bucket = Math.floor(atMs / this.bucketMs);
    if (this.bucketIndex !== null && bucket !== this.bucketIndex) this.close((this.bucketIndex + 1) * this.bucketMs, bucket - this.bucketIndex > this.windowBuckets);
    this.bucketIndex = bucket;
    for (const [probe, buckets] of this.probes) {
      const valueC = valuesC[probe];
      if (valueC === null || valueC === undefined || !Number.isFinite(valueC)) continue;
      buckets.sumC += valueC;
      buckets.count++;
    }
  }

  /** The levels computed since the last call, oldest first. */
  take(): LevelPoint[] {
    const points = this.points;
    this.points = [];
    return points;
  }

  private close(bucketEndMs: number, afterLongGap: boolean): void {
    const levelsC: Partial<Record<Probe, number | null>> = {};
    for (const [probe, buckets] of this.probes) {
      if (afterLongGap) buckets.meansC.length = 0;
      if (buckets.count) buckets.meansC.push(buckets.sumC / buckets.count);
      if (buckets.meansC.length > this.windowBuckets) buckets.meansC.shift();
      buckets.sumC = 0;
      buckets.count = 0;
      levelsC[probe] = buckets.meansC.length * 2 >= this.windowBuckets ? median(buckets.meansC) : null;
    }
    this.points.push({ atMs: bucketEndMs, levelsC });
  }
}
