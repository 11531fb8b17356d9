/**
 * The engine's whole memory as plain JSON data, so live ingest can persist it after each
 * batch and resume after a restart without re-reading the history. Rings are short plain
 * arrays (a few dozen numbers); nothing here grows with the length of the history.
 */
import type { ApplianceStyle, CauseCode, Probe } from '../../shared/domain';
import type { Finding, ProbeLevelNow } from './types';
import { newCusum, type CusumState } from './stats/cusum';
import { newDutyState } from './duty';

// 2: the compressor duty estimate and the rhythm-change finding.
export const STATE_VERSION = 2;

export type SensorFaultReason = 'disconnected' | 'power-on' | 'implausible' | 'jumps' | 'stuck' | 'dropout';

export interface ProbeValidation {
  lastValidC: number | null;
  lastValidAtMs: number | null;
  /** Start of the current run of identical values. */
  sameValueC: number | null;
  sameSinceMs: number | null;
  /** Start of the current run of missing or invalid values. */
  badSinceMs: number | null;
  badReason: SensorFaultReason | null;
  /** Start of the current run of good values (for closing a fault with hysteresis). */
  goodSinceMs: number | null;
  glitchTimesMs: number[];
  pendingJumpC: number | null;
  faultReason: SensorFaultReason | null;
  faultFindingId: string | null;
}

export interface ProbeLevel {
  bucketSumC: number;
  bucketCount: number;
  bucketMaxC: number | null;
  bucketMeansC: number[];
  /** Bucket max minus bucket mean: how spiky the probe is (door openings, infiltration). */
  spikeC: number | null;
  /** Every bucket mean of the last hours, transients included: the diagnosis sees the raw shape. */
  recentMeansC: number[];
  recentTimesMs: number[];
  learnSpikesC: number[];
  normalSpikeC: number | null;
  levelC: number | null;
  levelsC: number[];
  levelTimesMs: number[];
  learnLevelsC: number[];
  baselineC: number | null;
  spreadC: number | null;
}

export interface ProbeTrend {
  cusum: CusumState;
  cusumOnsetMs: number | null;
  risingSinceMs: number | null;
  recoveredSinceMs: number | null;
  findingId: string | null;
  peakResidualC: number;
  /** Since when the level has sat well below the baseline (a colder compartment is a signature too). */
  coldSinceMs: number | null;
  /** When the level first slipped 1 °C below the baseline in the current cold spell. */
  coolingFromMs: number | null;
  /** Hours the cold spell took from −1 °C to the cold threshold (fast: damper; slow: ice). */
  coolingHours: number | null;
}

export interface ProbeOverTemp {
  aboveSinceMs: number | null;
  belowSinceMs: number | null;
  /** Minutes of the current spell that readings actually showed above the limit. */
  aboveMinutes: number;
  lastValidAtMs: number | null;
  lastWasAbove: boolean;
  findingId: string | null;
}

export interface ProbeRhythm {
  smoothC: number | null;
  /** +1 above the running mean by the hysteresis, −1 below, 0 unknown. */
  side: number;
  lastUpCrossingMs: number | null;
  periodsMin: number[];
  /** Highest reading above the running mean in the current half cycle, and its running typical size. */
  halfCyclePeakC: number;
  cycleSwingC: number | null;
  excursionStartMs: number | null;
  excursionPeakC: number;
  excursionReferenceC: number;
  excursionDoor: boolean;
  /** A short excursion (door, defrost) touched the current bucket: keep it out of the level. */
  transientInBucket: boolean;
  /** Consecutive buckets kept out; past the longest defrost they count again. */
  skippedBuckets: number;
}

export interface ProbeState {
  probe: Probe;
  validation: ProbeValidation;
  level: ProbeLevel;
  trend: ProbeTrend;
  overTemp: ProbeOverTemp;
  rhythm: ProbeRhythm;
}

/** The compressor duty estimate (duty.ts). */
export interface DutyState {
  /** The reading the next one is compared with, and its time. */
  refC: number | null;
  refAtMs: number | null;
  /** Time the reading fell, and changed at all, in the bucket being filled. */
  fallMs: number;
  changeMs: number;
  /** EWMA of the per-bucket share of falling time. */
  ewma: number | null;
  learnFallMs: number;
  learnChangeMs: number;
  /** The learned normal share. */
  baseline: number | null;
  /** Since when the estimate has stayed above its limit. */
  aboveSinceMs: number | null;
}

/** A departure from the unit's own rhythm that does not warm the cabinet (rhythm-change.ts). */
export interface RhythmChangeState {
  /** Since when the freezer level has stayed far colder than its normal. */
  coldDriftSinceMs: number | null;
  findingId: string | null;
  recoveredSinceMs: number | null;
}

export interface DefrostEvent {
  /** Start of the rise. */
  atMs: number;
  riseC: number;
  durationMin: number;
}

export interface EngineState {
  version: number;
  style: ApplianceStyle;
  firstAtMs: number | null;
  lastAtMs: number | null;
  /** Time of the reading being processed. */
  nowMs: number | null;
  bucketIndex: number | null;
  lastFreshAbove: boolean;
  ready: boolean;
  probes: ProbeState[];
  defrosts: DefrostEvent[];
  /** Median duration of the recorded defrost rises, kept up to date for the hot path. */
  defrostDurationMin: number | null;
  defrostRhythm: { intervalHours: number | null; riseC: number | null; durationMinutes: number | null; lastAtMs: number | null };
  /** Rises of the latest brief or long excursions without a door (defrosts among them), newest last. */
  recentRisesC: number[];
  /** Since when the door-less rises have stayed shrunk below the normal defrost rise. */
  risesShrunkSinceMs: number | null;
  /** Median rise of the defrosts seen while the unit was learning its normal. */
  normalDefrostRiseC: number | null;
  /** Running estimate of the reading interval (minutes). */
  intervalMin: number | null;
  doorOpen: boolean;
  doorFlagsSeen: boolean;
  doorOpenings: number;
  doorOpeningsByHourUtc: number[];
  /** Evidence per cause remembered over the current episode of repair findings. */
  causeEvidence: Partial<Record<CauseCode, number>>;
  noCoolingFindingId: string | null;
  noCoolingRecoveredSinceMs: number | null;
  duty: DutyState;
  rhythmChange: RhythmChangeState;
  /** Open findings only; a closed finding is reported once and forgotten. */
  findings: Finding[];
  lastUpdateAtMs: Record<string, number>;
  /** Cumulative fresh-food minutes above the limit, and its value at each bucket end. */
  freshMinutesAboveTotal: number;
  aboveHistory: { atMs: number[]; minutes: number[] };
  /** Cumulative minutes at each open finding's start, so its own count can be derived. */
  aboveBaseByFinding: Record<string, number>;
  closedFindings: number;
}

function newProbe(probe: Probe): ProbeState {
  return {
    probe,
    validation: {
      lastValidC: null,
      lastValidAtMs: null,
      sameValueC: null,
      sameSinceMs: null,
      badSinceMs: null,
      badReason: null,
      goodSinceMs: null,
      glitchTimesMs: [],
      pendingJumpC: null,
      faultReason: null,
      faultFindingId: null,
    },
    level: {
      bucketSumC: 0,
      bucketCount: 0,
      bucketMaxC: null,
      bucketMeansC: [],
      spikeC: null,
      recentMeansC: [],
      recentTimesMs: [],
      learnSpikesC: [],
      normalSpikeC: null,
      levelC: null,
      levelsC: [],
      levelTimesMs: [],
      learnLevelsC: [],
      baselineC: null,
      spreadC: null,
    },
    trend: {
      cusum: newCusum(),
      cusumOnsetMs: null,
      risingSinceMs: null,
      recoveredSinceMs: null,
      findingId: null,
      peakResidualC: 0,
      coldSinceMs: null,
      coolingFromMs: null,
      coolingHours: null,
    },
    overTemp: { aboveSinceMs: null, belowSinceMs: null, aboveMinutes: 0, lastValidAtMs: null, lastWasAbove: false, findingId: null },
    rhythm: {
      smoothC: null,
      side: 0,
      lastUpCrossingMs: null,
      periodsMin: [],
      halfCyclePeakC: 0,
      cycleSwingC: null,
      excursionStartMs: null,
      excursionPeakC: 0,
      excursionReferenceC: 0,
      excursionDoor: false,
      transientInBucket: false,
      skippedBuckets: 0,
    },
  };
}

export function newEngineState(style: ApplianceStyle, probes: readonly Probe[]): EngineState {
  return {
    version: STATE_VERSION,
    style,
    firstAtMs: null,
    lastAtMs: null,
    nowMs: null,
    bucketIndex: null,
    lastFreshAbove: false,
    ready: false,
    probes: probes.map(newProbe),
    defrosts: [],
    defrostDurationMin: null,
    defrostRhythm: { intervalHours: null, riseC: null, durationMinutes: null, lastAtMs: null },
    normalDefrostRiseC: null,
    recentRisesC: [],
    risesShrunkSinceMs: null,
    intervalMin: null,
    doorOpen: false,
    doorFlagsSeen: false,
    doorOpenings: 0,
    doorOpeningsByHourUtc: new Array(24).fill(0),
    causeEvidence: {},
    noCoolingFindingId: null,
    noCoolingRecoveredSinceMs: null,
    duty: newDutyState(),
    rhythmChange: { coldDriftSinceMs: null, findingId: null, recoveredSinceMs: null },
    findings: [],
    lastUpdateAtMs: {},
    freshMinutesAboveTotal: 0,
    aboveHistory: { atMs: [], minutes: [] },
    aboveBaseByFinding: {},
    closedFindings: 0,
  };
}

/** Pushes onto a short ring, dropping the oldest values beyond `capacity`. */
export function pushRing(ring: number[], value: number, capacity: number): void {
  ring.push(value);
  while (ring.length > capacity) ring.shift();
}

/**
 * Each probe's level and baseline read from a state (the engine's accessor uses it; a stored
 * snapshot can be read the same way without building an engine).
 */
export function levelsOfState(state: EngineState): Partial<Record<Probe, ProbeLevelNow>> {
  const levels: Partial<Record<Probe, ProbeLevelNow>> = {};
  for (const p of state.probes) {
    const times = p.level.levelTimesMs;
    levels[p.probe] = { levelC: p.level.levelC, levelAtMs: times.length ? times[times.length - 1] : null, baselineC: p.level.baselineC };
  }
  return levels;
}

/**
 * A state saved by an older engine, brought to this version (null when it cannot be). Version 1
 * lacked the duty estimate and the rhythm-change finding: both start empty and the duty's
 * normal is learned afresh from the next readings, while everything else carries on.
 */
export function upgradeState(state: EngineState): EngineState | null {
  if (state.version === STATE_VERSION) return state;
  if (state.version !== 1) return null;
  return { ...state, version: STATE_VERSION, duty: newDutyState(), rhythmChange: { coldDriftSinceMs: null, findingId: null, recoveredSinceMs: null } };
}
