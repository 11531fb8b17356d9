/**
 * Probable causes from the temperature signature alone. Each rule adds evidence for a
 * cause; the evidence is normalised into confidences. The rules follow common practice of
 * the repair trade (no published source):
 * - compressor, start relay or overload: the freezer climbs fast (several °C per hour)
 *   while the still-running fan keeps the fresh food cool for hours from the freezer's cold;
 * - power loss: the same climb, but the fresh food climbs along (no fan moves air);
 * - evaporator fan: both compartments warm at a moderate pace and level off short of room
 *   temperature, fresh food near 10 °C and a freezer that is "not cold enough";
 * - air damper stuck closed: fresh food warms while the freezer stays normal or gets colder;
 * - condenser fan or dirty coil: the compressor runs on and cannot pull the freezer down,
 *   while the fresh food stays normal or even gets colder;
 * - defrost system: the brief defrost rises disappear, and days later the fresh food warms
 *   as ice chokes the duct;
 * - door seal: readings turn spiky (warm room air rushes in at every opening) with a modest rise.
 */
import type { ApplianceStyle, CauseCode } from '../../shared/domain';
import { DEFAULT_SETTINGS } from './settings';
import type { ProbableCause } from './types';

export interface ProbeSignature {
  /** Latest quarter-hour mean minus the baseline (°C): the raw shape, transients included. */
  riseC: number;
  /** Smoothed level minus the baseline (°C). */
  levelRiseC: number;
  /** Robust slope of the recent quarter-hour means (°C/h), null if too few points. */
  slopeCPerHour: number | null;
  /** Hours since this probe's rise began, null if it has not risen. */
  hoursRising: number | null;
  /** Hours the level has sat well below the baseline, null if it has not. */
  hoursColder: number | null;
  /** Hours the cold spell took to develop (an abrupt one is a damper, a slow one ice). */
  coolingHours: number | null;
  /** Spikiness now relative to the learned normal (1 = as usual, near 0 = no cycling left). */
  spikeRatio: number | null;
  levelC: number;
}

export interface Signature {
  style: ApplianceStyle;
  freshFood: ProbeSignature | null;
  freezer: ProbeSignature | null;
  /** Hours since the last defrost rise relative to the learned interval (null if unknown). */
  defrostOverdueRatio: number | null;
  /** The last defrost rise relative to the unit's normal one (null if unknown). */
  lastDefrostRiseRatio: number | null;
  /** Hours the defrost rises had been shrunk or missing before this trouble began (null: not before). */
  defrostFadedHoursBefore: number | null;
  noCooling: boolean;
  /** Estimated compressor running share above the unit's normal (null before it is known). */
  dutyExcess: number | null;
  /** That estimate has stayed above its limit (the unit runs toward continuous running). */
  runsOn: boolean;
  /** The freezer has stayed far colder than its normal (rhythm-change.ts). */
  coldDrift: boolean;
}

type Scores = Partial<Record<CauseCode, number>>;

/** °C per hour: a freezer climbing faster than this has lost its cooling altogether. */
const FAST_CLIMB_C_PER_H = 2;
/** Below this the compressor is climbing slowly, as it does against a starved condenser. */
const SLOW_CLIMB_C_PER_H = 0.7;
/** Share of the freezer's climb the fresh food follows when no fan moves air. */
const FOLLOW_SHARE = 0.15;
const CONTINUOUS_RUN_SPIKE_RATIO = DEFAULT_SETTINGS.continuousRunSpikeRatio;
const SPIKY_RATIO = DEFAULT_SETTINGS.spikyRatio;
/** A fresh-food shift this size (°C) in either direction tells a fan stop from a starved condenser. */
const FRESH_SHIFT_C = 0.3;

function add(scores: Scores, code: CauseCode, weight: number): void {
  scores[code] = (scores[code] ?? 0) + weight;
}

const slope = (p: ProbeSignature | null) => p?.slopeCPerHour ?? 0;

/** Rise at which a freezer is clearly heading for room temperature, not levelling off. */
const HEADING_TO_ROOM_C = 6;
/** A cold spell that develops within this many hours is abrupt (a stuck damper). */
const ABRUPT_COOLING_HOURS = 8;
/** Recent rises below this share of the normal defrost rise: the heater is weak or dead. */
const SHRUNK_RISE_RATIO = 0.7;
const KEPT_RISE_RATIO = 0.85;
const FADED_BEFORE_HOURS = 12;

function scoreFastClimb(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (z && z.riseC >= 3 && slope(z) >= FAST_CLIMB_C_PER_H) {
    if (!f) {
      add(scores, 'compressor-start', 3);
      add(scores, 'power-loss', 1.5);
    } else if (f.riseC < FOLLOW_SHARE * z.riseC) {
      // While the freezer climbs, a fan that still runs carries its cold into the fresh food.
      add(scores, 'compressor-start', 4);
      add(scores, 'power-loss', 1);
    } else {
      add(scores, 'power-loss', 3);
      add(scores, 'compressor-start', 2);
    }
    return;
  }
  if (z && z.riseC >= 3 && (z.riseC >= HEADING_TO_ROOM_C || z.levelC > -3)) {
    // Late in the climb both look alike: only the remembered early shape tells them apart.
    add(scores, 'compressor-start', 1.5);
    add(scores, 'power-loss', 1.5);
    return;
  }
  if (!z && f && slope(f) >= 0.5 && f.riseC >= 1.5) {
    add(scores, 'compressor-start', 3);
    add(scores, 'power-loss', 1.5);
  }
  if (s.style === 'chest-freezer' && z && z.riseC >= 1.5 && slope(z) >= 0.5) add(scores, 'compressor-start', 3);
  if (s.noCooling) add(scores, 'compressor-start', 1.5);
}

/**
 * The freezer warms at a moderate pace with the compressor running on: a stopped evaporator
 * fan or a starved condenser. The fresh food tells them apart: with the fan stopped it loses
 * its cold supply and warms; with the condenser starved the fan still blows the continuously
 * running coil's cold into it and it gets colder.
 */
function scoreModerateWarming(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (!z || s.style === 'chest-freezer' && z.riseC < 1.5) return;
  const warmer = z.riseC >= 1.5 && z.riseC < HEADING_TO_ROOM_C && slope(z) < FAST_CLIMB_C_PER_H && z.levelC < -3;
  if (warmer && f) {
    if (f.levelRiseC <= -FRESH_SHIFT_C && isRunningAsUsual(s)) {
      // Warmer although the compressor seems to run no more than usual: room air leaking in
      // warms the cabinet through every running phase too, while a starved condenser shows
      // as longer, clearer pull-downs (our reading of the model, no published source).
      // The more specific sign: it outweighs the remembered early look of a starved condenser.
      add(scores, 'door-seal', 4.5);
      add(scores, 'condenser-airflow', 1);
    } else if (f.levelRiseC <= -FRESH_SHIFT_C) add(scores, 'condenser-airflow', 3.5);
    else if (f.riseC >= FRESH_SHIFT_C) add(scores, 'evaporator-fan', 3.5);
    else {
      add(scores, 'evaporator-fan', 1.5);
      add(scores, 'condenser-airflow', 1.5);
    }
  } else if (warmer) {
    // A freezer alone: a fan stop warms it faster than a starved condenser does, and without
    // the compressor running more (a starved condenser makes it run longer).
    const fanStop = slope(z) >= 0.5 || (s.dutyExcess !== null && s.dutyExcess <= -RUNNING_AS_USUAL_EXCESS);
    add(scores, fanStop ? 'evaporator-fan' : 'condenser-airflow', 3);
  }
  if ((z.spikeRatio ?? 1) < CONTINUOUS_RUN_SPIKE_RATIO && warmer) add(scores, 'condenser-airflow', 0.5);
  // Later: both levelled off short of room temperature, fresh food near 10 °C. A freezer
  // levelled off near 0 °C is thawing contents (no cooling at all), not a stopped fan.
  const plateau = f !== null && f.levelRiseC >= 3 && z.levelRiseC >= 4 && z.levelC < -3 && Math.abs(slope(z)) < 0.5;
  if (plateau) add(scores, 'evaporator-fan', 2.5);
  if (!f && s.style !== 'chest-freezer' && z.levelRiseC >= 6 && z.levelC < -3 && Math.abs(slope(z)) < 0.5) add(scores, 'evaporator-fan', 1.5);
}

/** An estimated running share within this of the unit's normal counts as running as usual. */
const RUNNING_AS_USUAL_EXCESS = 0.06;

function isRunningAsUsual(s: Signature): boolean {
  return s.style !== 'chest-freezer' && s.dutyExcess !== null && Math.abs(s.dutyExcess) < RUNNING_AS_USUAL_EXCESS;
}

function scoreDamperAndDefrost(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  const overdue = s.defrostOverdueRatio ?? 0;
  // Fading counts only if it came well before the trouble: a stopped fan or a dead compressor
  // also changes the defrost rises, but at the same moment the cabinet starts to warm.
  const fadedBefore = (s.defrostFadedHoursBefore ?? -Infinity) >= FADED_BEFORE_HOURS;
  const defrostFading = fadedBefore && (overdue >= 2 || (s.lastDefrostRiseRatio ?? 1) < SHRUNK_RISE_RATIO);
  // Defrost rises gone for two intervals before any other trouble: the coil is icing up, and
  // an iced coil then chokes the air like a stopped fan or a closed damper.
  // (A freezer far above its normal hides its defrost rises: no evidence either way then.)
  const freezerNearNormal = !z || z.levelRiseC < HEADING_TO_ROOM_C;
  if (defrostFading && freezerNearNormal) add(scores, 'defrost-system', overdue >= 3 ? 4 : 2.5);
  if (!z || !f || f.levelRiseC < 0.8 || z.levelRiseC > 0.5 || z.riseC > 1) return;
  // Fresh food warmer, freezer not: the cold air no longer reaches the fresh food. A damper
  // sticks at once; ice from a dead defrost heater closes the duct over days.
  // The heater tells them apart: its rises shrink when it is dead, and stay when a damper sticks.
  const riseRatio = s.lastDefrostRiseRatio;
  if (riseRatio !== null && riseRatio < SHRUNK_RISE_RATIO && fadedBefore) add(scores, 'defrost-system', 3.5);
  else if (riseRatio !== null && riseRatio >= KEPT_RISE_RATIO) add(scores, 'air-damper', 3.5);
  else if (z.coolingHours !== null && z.coolingHours > ABRUPT_COOLING_HOURS) add(scores, 'defrost-system', 3);
  else {
    add(scores, 'air-damper', 2.5);
    add(scores, 'defrost-system', 1.5);
  }
}

/**
 * The cabinet holds its temperatures but the rhythm changed:
 * - freezer far colder while the fresh food is not: the cold air no longer reaches the fresh
 *   food and the compressor runs on for it. Abrupt (within hours of the first cooling) is a
 *   damper stuck closed; a drift over many hours is a duct icing up from a dead defrost heater,
 *   as are shrunken defrost rises;
 * - running far more than usual at normal temperatures: first a starved condenser (dirty
 *   coil, stopped condenser fan), then a leaking door seal (room air to cool all the time).
 */
function scoreRhythmChange(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (s.coldDrift && z && f && f.levelRiseC > z.levelRiseC + 2) {
    const shrunk = s.lastDefrostRiseRatio !== null && s.lastDefrostRiseRatio < SHRUNK_RISE_RATIO;
    const slow = z.coolingHours !== null && z.coolingHours > ABRUPT_COOLING_HOURS;
    // Defrost rises missing for two intervals, or fading for a day before the cold came.
    const vanished = (s.defrostOverdueRatio ?? 0) >= 2 || (s.defrostFadedHoursBefore ?? -Infinity) >= 2 * FADED_BEFORE_HOURS;
    if (shrunk || slow || vanished) add(scores, 'defrost-system', 3.5);
    else add(scores, 'air-damper', 3.5);
    return;
  }
  const near = (p: ProbeSignature | null) => p === null || Math.abs(p.levelRiseC) < 1.5;
  if (s.runsOn && near(z) && near(f)) {
    add(scores, 'condenser-airflow', 2.5);
    add(scores, 'door-seal', 1.5);
  }
}

function scoreDoorSeal(s: Signature, scores: Scores): void {
  const ratios = [s.freshFood?.spikeRatio, s.freezer?.spikeRatio].filter((r): r is number => r !== null && r !== undefined);
  const spikiest = ratios.length ? Math.max(...ratios) : 0;
  if (spikiest >= SPIKY_RATIO) add(scores, 'door-seal', 4);
  if (spikiest >= 4 / 3 * SPIKY_RATIO) add(scores, 'door-seal', 1.5);
}

/** Causes an appliance of this style can have (a chest freezer has no fan, damper or auto defrost). */
export function possibleCauses(style: ApplianceStyle): CauseCode[] {
  const all: CauseCode[] = ['evaporator-fan', 'defrost-system', 'condenser-airflow', 'compressor-start', 'air-damper', 'door-seal', 'power-loss'];
  if (style === 'chest-freezer') return all.filter((c) => c !== 'evaporator-fan' && c !== 'defrost-system' && c !== 'air-damper');
  if (style === 'fresh-food-only' || style === 'upright-freezer') return all.filter((c) => c !== 'air-damper');
  return all;
}

const ROUND = 100;

export type CauseScores = Partial<Record<CauseCode, number>>;

/** Evidence for each cause in the signature as it is now. */
export function scoreCauses(signature: Signature): CauseScores {
  const scores: Scores = {};
  scoreFastClimb(signature, scores);
  scoreModerateWarming(signature, scores);
  scoreDamperAndDefrost(signature, scores);
  scoreRhythmChange(signature, scores);
  scoreDoorSeal(signature, scores);
  return scores;
}

/** Normalised confidences of the causes this style can have, best first, at most four. */
export function causesFrom(scores: CauseScores, style: ApplianceStyle): ProbableCause[] {
  const allowed = possibleCauses(style);
  // A little weight everywhere keeps the list honest: the signature never proves a cause.
  const entries = allowed.map((code) => [code, (scores[code] ?? 0) + 0.25] as const);
  const total = entries.reduce((sum, [, score]) => sum + score, 0);
  return entries
    .map(([code, score]) => ({ code, confidence: Math.floor((score / total) * ROUND) / ROUND }))
    .filter((cause) => cause.confidence >= 0.05)
    .sort((a, b) => b.confidence - a.confidence || a.code.localeCompare(b.code))
    .slice(0, 4);
}

export function diagnose(signature: Signature): ProbableCause[] {
  return causesFrom(scoreCauses(signature), signature.style);
}

/**
 * Evidence remembered over an episode: the decisive early shape of a failure (a freezer
 * climbing fast while the fresh food holds) outweighs the dull shape of its late phase, so
 * each cause keeps the best evidence seen, fading slowly (a half-life of about 3.5 days of quarter-hours).
 */
export function rememberEvidence(memory: CauseScores, now: CauseScores, fade: number): CauseScores {
  const merged: CauseScores = {};
  const codes = new Set([...Object.keys(memory), ...Object.keys(now)] as CauseCode[]);
  for (const code of codes) merged[code] = Math.max((memory[code] ?? 0) * fade, now[code] ?? 0);
  return merged;
}

/** A sensor fault: the only cause is the sensor. */
export const SENSOR_CAUSES: readonly ProbableCause[] = [{ code: 'sensor', confidence: 1 }];
