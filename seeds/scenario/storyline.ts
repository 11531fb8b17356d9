/**
 * The live storyline: what goes wrong after `npm start`, while the simulator replays the
 * last STORYLINE_REPLAY_HOURS before start at the chosen speed (90× by default: the
 * replay takes under seven minutes). Times are hours after the live start, the end of
 * the seeded history. In order:
 *  1. defrost-system (p3/3B, an aging top-freezer): the heater died days before the live
 *     start; frost has been choking the fresh-food duct since, and in the replay the
 *     fresh-food section starts to climb: a warming trend, then too warm;
 *  2. evaporator-fan (p1/304, the demo tenant's bottom-freezer): the freezer warms within
 *     a couple of hours: an urgent work order for the primary contractor;
 *  3. sensor-disconnected (p1/502): the freezer probe reads −127 for five hours;
 *  4. power-loss (every appliance at p2, the townhouses) for three hours: one property request.
 * The faults on real parts stay until the simulator sees the work order completed.
 */
import type { FaultCode } from '../../simulator/model';
import type { ApplianceProfile } from '../../simulator/model';
import type { Probe } from '../../shared/domain';

export const STORYLINE_REPLAY_HOURS = 10;
export const DEFAULT_STORYLINE_SPEED = 90;
const HOUR_MS = 3_600_000;

export interface StorylineProfile {
  ageYears: number;
  /** Seed of the appliance's doors and noise, fixed so the schedule below holds for every scenario seed. */
  simSeed: number;
  overrides: Partial<ApplianceProfile>;
}

/**
 * The storyline's appliances use the style's calibrated default profile (not a random one),
 * so the faults unfold on the same schedule whatever the seed.
 */
export const STORYLINE_PROFILES: Record<string, StorylineProfile> = {
  // A cold-set unit that gathers frost slowly: the choked duct shows over the last day.
  'p3/3B/1': { ageYears: 13.6, simSeed: 4, overrides: { freshFoodSetpointC: 1.4, iceGrowthKgPerDay: 0.12, doorOpeningsPerDay: 24 } },
  'p1/304/1': { ageYears: 4.2, simSeed: 5, overrides: {} },
};

export function calibratedProfile(base: ApplianceProfile, storyline: StorylineProfile): ApplianceProfile {
  return { ...base, ...storyline.overrides };
}

export interface StorylineStep {
  /** A device (by scenario appliance key) or a whole property. */
  applianceKey?: string;
  propertyKey?: string;
  fault: FaultCode;
  /** Hours after the live start (negative: before it, in the seeded history). */
  startH: number;
  /** Hours it lasts; null until repaired. */
  forH: number | null;
  probe?: Probe;
  /** What the visitor should see, for the banner and the report. */
  shows: string;
  /**
   * Hours after the live start at which the monitor concluded it in a run of the whole
   * stack (the defrost trend moves by a few hours with the time of day the history ends).
   */
  seenH: number;
}

/**
 * The heater fails this long before the live start. Measured with the detection engine at
 * this profile and ten-minute readings (sim seed 4, 20 s and 120 s physics steps): the
 * first warming trend (both compartments, watch, probable defrost system) is concluded
 * about 177 h after the failure (±7 h with the time of day the history ends), the
 * fresh-food section is too warm at about 223 h. So the trend opens around the start of the
 * replay and food is at risk about two days later.
 */
export const DEFROST_FAILED_BEFORE_LIVE_H = 174;

export const STORYLINE: readonly StorylineStep[] = [
  { applianceKey: 'p3/3B/1', fault: 'defrost-system', startH: -DEFROST_FAILED_BEFORE_LIVE_H, forH: null, seenH: 7, shows: 'a warming trend at 3B, The Ostler Building (food at risk only two days later): a work order for the defrost system' },
  { applianceKey: 'p1/304/1', fault: 'evaporator-fan', startH: 0.5, forH: null, seenH: 3.5, shows: 'the freezer of 304, Harrowgate Commons (the demo tenant) too warm: an urgent work order for Rook Appliance Repair' },
  { applianceKey: 'p1/502/1', fault: 'sensor-disconnected', startH: 3.5, forH: 5, probe: 'freezer', seenH: 3.8, shows: 'the freezer probe of 502, Harrowgate Commons reads −127 °C: a sensor fault, no technician' },
  { propertyKey: 'p2', fault: 'power-loss', startH: 7, forH: 3, seenH: 10.2, shows: 'Bramblewick Row loses power for three hours: one power-loss request for the property, no job per unit' },
];

export function storylineWindowMs(liveStartMs: number, step: StorylineStep): { startMs: number; endMs: number | null } {
  const startMs = liveStartMs + step.startH * HOUR_MS;
  return { startMs, endMs: step.forH === null ? null : startMs + step.forH * HOUR_MS };
}
