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
import type { ProbableCause } from './types';

export interface ProbeSignature {
  /** Level minus baseline now (°C). */
  riseC: number;
  /** Robust slope of the level (°C/h), null if too few points. */
  slopeCPerHour: number | null;
  /** Hours since this probe's rise began, null if it has not risen. */
  hoursRising: number | null;
  /** Spikiness now relative to the learned normal (1 = as usual). */
  spikeRatio: number | null;
  levelC: number;
}

export interface Signature {
  style: ApplianceStyle;
  freshFood: ProbeSignature | null;
  freezer: ProbeSignature | null;
  /** Hours since the last defrost rise relative to the learned interval (null if unknown). */
  defrostOverdueRatio: number | null;
  noCooling: boolean;
}

type Scores = Partial<Record<CauseCode, number>>;

const FAST_FREEZER_C_PER_H = 2.5;

function add(scores: Scores, code: CauseCode, weight: number): void {
  scores[code] = (scores[code] ?? 0) + weight;
}

function scoreFastClimb(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  const climbing = z ? z.riseC >= 6 && (z.slopeCPerHour ?? 0) >= FAST_FREEZER_C_PER_H : f !== null && f.riseC >= 3 && (f.slopeCPerHour ?? 0) >= 1;
  if (!climbing && !s.noCooling) return;
  const weight = climbing ? 3 : 1.5;
  add(scores, 'compressor-start', weight);
  add(scores, 'power-loss', weight * 0.5);
  if (z && f) {
    // The share of the freezer's climb that the fresh food follows tells a fan that still runs.
    const share = f.riseC / Math.max(1, z.riseC);
    add(scores, share < 0.1 ? 'compressor-start' : 'power-loss', 1.5);
  }
}

function scoreEvaporatorFan(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (s.style === 'chest-freezer') return;
  if (z && f) {
    if (f.riseC >= 1 && z.riseC >= 2.5) add(scores, 'evaporator-fan', 2.5);
    const moderate = z.slopeCPerHour !== null && z.slopeCPerHour < FAST_FREEZER_C_PER_H;
    if (f.riseC >= 1 && z.riseC >= 2.5 && moderate) add(scores, 'evaporator-fan', 1.5);
    if (f.levelC >= 6 && f.levelC <= 13 && z.levelC < -3) add(scores, 'evaporator-fan', 1);
    return;
  }
  if (z && z.riseC >= 2.5 && (z.slopeCPerHour ?? 0) < FAST_FREEZER_C_PER_H) add(scores, 'evaporator-fan', 2.5);
}

function scoreDamper(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (!z || !f || f.riseC < 1) return;
  if (z.riseC <= 0.5) add(scores, 'air-damper', 2.5);
  if (z.riseC <= -1) add(scores, 'air-damper', 1.5);
}

function scoreCondenser(s: Signature, scores: Scores): void {
  const z = s.freezer;
  const f = s.freshFood;
  if (!z) {
    if (f && f.riseC >= 1 && (f.slopeCPerHour ?? 0) < 0.5) add(scores, 'condenser-airflow', 1.5);
    return;
  }
  if (z.riseC < 2) return;
  const slow = (z.slopeCPerHour ?? 0) < 1;
  if (!f) add(scores, 'condenser-airflow', slow ? 2.5 : 1);
  else if (f.riseC <= 0.5) add(scores, 'condenser-airflow', slow ? 3.5 : 2);
}

function scoreDefrost(s: Signature, scores: Scores): void {
  if (s.defrostOverdueRatio !== null && s.defrostOverdueRatio >= 2) add(scores, 'defrost-system', 3.5);
}

function scoreDoorSeal(s: Signature, scores: Scores): void {
  const spikes = [s.freshFood?.spikeRatio ?? null, s.freezer?.spikeRatio ?? null].filter((r): r is number => r !== null);
  const spiky = spikes.length > 0 && Math.max(...spikes) >= 1.6;
  if (spiky) add(scores, 'door-seal', 2.5);
  const f = s.freshFood;
  if (spiky && f && f.riseC >= 1 && f.riseC < 5) add(scores, 'door-seal', 1);
}

/** Causes an appliance of this style can have (a chest freezer has no fan, damper or auto defrost). */
export function possibleCauses(style: ApplianceStyle): CauseCode[] {
  const all: CauseCode[] = ['evaporator-fan', 'defrost-system', 'condenser-airflow', 'compressor-start', 'air-damper', 'door-seal', 'power-loss'];
  if (style === 'chest-freezer') return all.filter((c) => c !== 'evaporator-fan' && c !== 'defrost-system' && c !== 'air-damper');
  if (style === 'fresh-food-only' || style === 'upright-freezer') return all.filter((c) => c !== 'air-damper');
  return all;
}

const ROUND = 100;

export function diagnose(signature: Signature): ProbableCause[] {
  const scores: Scores = {};
  scoreFastClimb(signature, scores);
  scoreEvaporatorFan(signature, scores);
  scoreDamper(signature, scores);
  scoreCondenser(signature, scores);
  scoreDefrost(signature, scores);
  scoreDoorSeal(signature, scores);
  const allowed = possibleCauses(signature.style);
  // A little weight everywhere keeps the list honest: the signature never proves a cause.
  for (const code of allowed) add(scores, code, 0.25);
  const entries = allowed.map((code) => [code, scores[code] ?? 0] as const);
  const total = entries.reduce((sum, [, score]) => sum + score, 0);
  return entries
    .map(([code, score]) => ({ code, confidence: Math.floor((score / total) * ROUND) / ROUND }))
    .filter((cause) => cause.confidence >= 0.05)
    .sort((a, b) => b.confidence - a.confidence || a.code.localeCompare(b.code))
    .slice(0, 4);
}

/** A sensor fault: the only cause is the sensor. */
export const SENSOR_CAUSES: readonly ProbableCause[] = [{ code: 'sensor', confidence: 1 }];
