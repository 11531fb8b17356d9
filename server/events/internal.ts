/**
 * Events that stay inside the server: never sent to a client. The monitor publishes one
 * status per appliance and batch, which the work-order verification reads.
 */
import type { Probe } from '../../shared/domain';
import type { EventPlace } from '../../shared/api/monitor';

/** One probe's smoothed level as the detection engine sees it, with its learned normal. */
export interface ProbeLevelStatus {
  levelC: number | null;
  /** Time of the quarter-hour bucket the level was last computed at. */
  levelAtMs: number | null;
  baselineC: number | null;
}

/** Each probe's smoothed level at the end of one quarter hour (monitor/level-trail.ts). */
export interface LevelPoint {
  atMs: number;
  levelsC: Partial<Record<Probe, number | null>>;
}

export interface ApplianceStatusEvent extends EventPlace {
  type: 'appliance.status';
  applianceId: string;
  unitId: string;
  /** Time of the newest reading handled. */
  lastReadingAtMs: number;
  probes: Partial<Record<Probe, ProbeLevelStatus>>;
  /** Repair findings (over-temperature, warming-trend, no-cooling) still open. */
  openRepairFindings: number;
  /** Every quarter-hour level of this batch, oldest first (a batch may span hours). */
  trail?: LevelPoint[];
}
