/**
 * Every threshold and window the detection engine uses, with its default and the reason
 * for it. Managers may override any of them per appliance style or per appliance; the
 * engine only ever reads them from a DetectionSettings object.
 */
import type { ApplianceStyle } from '../../shared/domain';
import { DANGER_ZONE_DISCARD_MINUTES, FREEZER_LIMIT_C, FRESH_FOOD_LIMIT_C } from '../../shared/temperature';

export interface DetectionSettings {
  freshFoodLimitC: number;
  freezerLimitC: number;
  foodAtRiskMinutes: number;
  freshOverTempGraceMinutes: number;
  freezerOverTempGraceMinutes: number;
  freezerAlarmMarginC: number;
  overTempDipToleranceMinutes: number;
  sentinelValuesC: number[];
  sentinelToleranceC: number;
  plausibleMinC: number;
  plausibleMaxC: number;
  impossibleJumpCPerMinute: number;
  impossibleJumpFloorC: number;
  jumpsForSensorFault: number;
  jumpCountWindowHours: number;
  stuckMinutes: number;
  stuckToleranceC: number;
  stuckSuspectMinutes: number;
  dropoutMinutes: number;
  silentAfterMinutes: number;
  sensorRecoveredMinutes: number;
  bucketMinutes: number;
  levelWindowMinutes: number;
  learningHours: number;
  baselineAdaptHours: number;
  baselineAdaptBandC: number;
  minSpreadFreshC: number;
  minSpreadFreezerC: number;
  cusumReferenceSigma: number;
  cusumDecisionSigma: number;
  freshMinRiseC: number;
  freezerMinRiseC: number;
  sustainMinutes: number;
  continuousRunSpikeRatio: number;
  spikyRatio: number;
  slopeWindowMinutes: number;
  recoveringSlopeCPerHour: number;
  forecastWindowMinutes: number;
  forecastHorizonHours: number;
  noCoolingFreshRiseC: number;
  noCoolingFreezerRiseC: number;
  noCoolingSlopeCPerHour: number;
  noCoolingSlopeWindowMinutes: number;
  recoveredBandC: number;
  recoveredHoldMinutes: number;
  cycleSmoothingMinutes: number;
  cycleHysteresisC: number;
  excursionRiseC: number;
  defrostMaxMinutes: number;
  defrostMinSpacingHours: number;
  defrostMissingFactor: number;
  dutyStepMinutes: number;
  dutyTimeConstantHours: number;
  dutyExcessLimit: number;
  dutySustainHours: number;
  dutyAdaptBand: number;
  coldDriftC: number;
  coldDriftSustainMinutes: number;
  updateEveryMinutes: number;
  incidentReopenMinutes: number;
  powerLossMinAppliances: number;
  powerLossMinShare: number;
  powerLossWindowMinutes: number;
}

export interface SettingDoc {
  unit: string;
  reason: string;
}

/** Defaults with their reasons. "common practice" marks values with no published source. */
export const SETTING_DOCS: Record<keyof DetectionSettings, SettingDoc & { value: number | number[] }> = {
  freshFoodLimitC: { value: FRESH_FOOD_LIMIT_C, unit: '°C', reason: '40 °F, U.S. FDA "Refrigerator Thermometers: Cold Facts about Food Safety"' },
  freezerLimitC: { value: FREEZER_LIMIT_C, unit: '°C', reason: '0 °F, U.S. FDA, same page' },
  foodAtRiskMinutes: { value: DANGER_ZONE_DISCARD_MINUTES, unit: 'min', reason: 'perishables above 40 °F for more than 2 hours are discarded: USDA FSIS "Danger Zone"' },
  freshOverTempGraceMinutes: { value: 60, unit: 'min', reason: 'longer than a door opening or a defrost keeps the fresh-food air above 40 °F, and half of the USDA 2-hour allowance so the alarm leaves time to act (common practice)' },
  freezerOverTempGraceMinutes: { value: 90, unit: 'min', reason: 'an automatic defrost lasts roughly 20–45 minutes plus its recovery (common practice, from memory); a full freezer holds for about 48 h (USDA FSIS) so a longer grace costs nothing' },
  freezerAlarmMarginC: { value: 1.5, unit: '°C', reason: 'freezer air cycles about ±1–1.5 °C around a 0 °F set point with the thermostat, while the food stays near the set point; the freezer alarm sits this far above the limit so a healthy unit set at 0 °F does not alarm half of each cycle (common practice)' },
  overTempDipToleranceMinutes: { value: 10, unit: 'min', reason: 'a compressor cycle may dip the air below the limit briefly without the food cooling (common practice)' },
  sentinelValuesC: { value: [-127, 85], unit: '°C', reason: 'values one-wire digital probes report when disconnected (−127) or read before a conversion after power-on (85, the power-on reset value of the register) (common practice)' },
  sentinelToleranceC: { value: 0.01, unit: '°C', reason: 'sentinels are exact codes, not measurements' },
  plausibleMinC: { value: -50, unit: '°C', reason: 'colder than any household freezer can reach (common practice)' },
  plausibleMaxC: { value: 60, unit: '°C', reason: 'hotter than any room an appliance sits in (common practice)' },
  impossibleJumpCPerMinute: { value: 4, unit: '°C/min', reason: 'cabinet air with its food cannot change faster than this even with the door wide open (common practice)' },
  impossibleJumpFloorC: { value: 12, unit: '°C', reason: 'a jump smaller than this is never called impossible, whatever the interval (common practice)' },
  jumpsForSensorFault: { value: 3, unit: 'count', reason: 'one glitch is noise; three in a day is a failing probe or cable (common practice)' },
  jumpCountWindowHours: { value: 24, unit: 'h', reason: 'window for counting glitches (common practice)' },
  stuckMinutes: { value: 240, unit: 'min', reason: 'a working cabinet probe always moves with the compressor cycle within an hour or two; four hours of an identical value is a stuck sensor (common practice)' },
  stuckSuspectMinutes: { value: 30, unit: 'min', reason: 'a probe in cycling cabinet air changes its reading within half an hour; one that has not changed at all for that long may be stuck: it starts no repair finding until it moves again or is called stuck (common practice)' },
  stuckToleranceC: { value: 0.001, unit: '°C', reason: 'identical to the printed resolution' },
  dropoutMinutes: { value: 60, unit: 'min', reason: 'a probe missing for an hour while the sensor reports is a dropout (common practice)' },
  silentAfterMinutes: { value: 60, unit: 'min', reason: 'no reading for an hour: the sensor is silent (common practice)' },
  sensorRecoveredMinutes: { value: 60, unit: 'min', reason: 'a probe must read plausibly for an hour before its fault closes (hysteresis, common practice)' },
  bucketMinutes: { value: 15, unit: 'min', reason: 'readings are summarised per quarter hour so 1- to 15-minute loggers are judged alike' },
  levelWindowMinutes: { value: 90, unit: 'min', reason: 'the median of quarter-hour means over 90 minutes ignores a door opening or a 20–45 minute defrost (common practice)' },
  learningHours: { value: 24, unit: 'h', reason: 'a day covers the daily door rhythm and usually a defrost before deviations are judged (common practice)' },
  baselineAdaptHours: { value: 96, unit: 'h', reason: 'the baseline follows a set-point change over days but not a failure over hours (common practice)' },
  baselineAdaptBandC: { value: 0.8, unit: '°C', reason: 'the baseline adapts only to levels this close to it, so a warming fault is never learned as normal' },
  minSpreadFreshC: { value: 0.25, unit: '°C', reason: 'floor on the learned spread: a very steady unit must not alarm on a tenth of a degree' },
  minSpreadFreezerC: { value: 0.4, unit: '°C', reason: 'same for the freezer, whose cycle swings wider' },
  cusumReferenceSigma: { value: 1, unit: 'σ', reason: 'tabular CUSUM reference value K; larger than the textbook 0.5σ because the level series is autocorrelated (Montgomery, Introduction to SQC, ch. 9)' },
  cusumDecisionSigma: { value: 8, unit: 'σ', reason: 'tabular CUSUM decision interval H, raised from the textbook 5σ for the same reason' },
  freshMinRiseC: { value: 1.5, unit: '°C', reason: 'a warming trend must lift the fresh-food level at least this far above its own normal (common practice)' },
  freezerMinRiseC: { value: 2.5, unit: '°C', reason: 'same for the freezer, which swings wider in normal use (common practice)' },
  continuousRunSpikeRatio: { value: 0.6, unit: '×', reason: 'readings swinging less than this share of their usual rise above the quarter-hour mean: the compressor no longer cycles (it runs on); corroborates a smaller warming (common practice)' },
  spikyRatio: { value: 1.5, unit: '×', reason: 'readings spiking this much more than usual: room air gets in (door seal); corroborates a smaller warming (common practice)' },
  sustainMinutes: { value: 45, unit: 'min', reason: 'the rise must last this long above the threshold before it is a trend' },
  slopeWindowMinutes: { value: 120, unit: 'min', reason: 'window of the robust (Theil–Sen) slope that tells a recovering grocery load from a failure' },
  recoveringSlopeCPerHour: { value: -0.1, unit: '°C/h', reason: 'a level no longer rising (its slope at or below this) is a warm load being pulled down, not a trend; a failing part keeps the level climbing or flat (common practice)' },
  forecastWindowMinutes: { value: 180, unit: 'min', reason: 'least-squares window of the crossing forecast' },
  forecastHorizonHours: { value: 72, unit: 'h', reason: 'crossings forecast further ahead than this are not shown' },
  noCoolingFreshRiseC: { value: 4, unit: '°C', reason: 'fresh food this far above normal and still rising is heading for room temperature (common practice)' },
  noCoolingFreezerRiseC: { value: 12, unit: '°C', reason: 'freezer this far above normal and still rising has lost its cooling (common practice)' },
  noCoolingSlopeCPerHour: { value: 0.5, unit: '°C/h', reason: 'still climbing at least this fast: a stopped evaporator fan levels off short of room temperature, a dead compressor keeps climbing (common practice)' },
  noCoolingSlopeWindowMinutes: { value: 240, unit: 'min', reason: 'window of that slope, long enough that a defrost rise does not tilt it' },
  recoveredBandC: { value: 1, unit: '°C', reason: 'a compartment within this of its baseline (and below its limit) has recovered' },
  recoveredHoldMinutes: { value: 120, unit: 'min', reason: 'it must stay recovered this long before a finding closes (hysteresis)' },
  cycleSmoothingMinutes: { value: 60, unit: 'min', reason: 'time constant of the running mean the compressor cycle oscillates around' },
  cycleHysteresisC: { value: 0.15, unit: '°C', reason: 'crossings smaller than this are sensor noise, not a cycle' },
  excursionRiseC: { value: 2.5, unit: '°C', reason: 'a freezer rise this far above its running level is an excursion (defrost or door) worth recording (common practice)' },
  defrostMaxMinutes: { value: 90, unit: 'min', reason: 'automatic defrost runs roughly 20–45 minutes (common practice, from memory); with recovery it is over within 90' },
  defrostMinSpacingHours: { value: 4, unit: 'h', reason: 'frost-free defrost runs every several hours to a few days (common practice, from memory)' },
  defrostMissingFactor: { value: 2, unit: '×', reason: 'no defrost rise for twice the learned interval means the defrost rises have disappeared' },
  dutyStepMinutes: { value: 5, unit: 'min', reason: 'readings are compared at least this far apart when estimating how much of the time the compressor runs: over a minute a 0.0625 °C probe step is mostly noise, over five the air has moved with the compressor (common practice)' },
  dutyTimeConstantHours: { value: 6, unit: 'h', reason: 'time constant of the EWMA of that estimate: several compressor cycles, short against the days a failing part takes (common practice)' },
  dutyExcessLimit: { value: 0.17, unit: 'share', reason: 'the estimated share of running time this far above the unit\'s own normal (for example 45 % → 62 %) is more than a hot afternoon or a grocery load adds over half a day: the unit runs toward continuous running (common practice; set on simulated traces with hot days and groceries, healthy units stayed below 0.14)' },
  dutySustainHours: { value: 12, unit: 'h', reason: 'the estimate must stay above that limit this long: a grocery load is pulled down within hours, and half a hot day is not enough (common practice)' },
  dutyAdaptBand: { value: 0.05, unit: 'share', reason: 'the learned normal running share follows the estimate only while it stays this close, so a failure is never learned as normal' },
  coldDriftC: { value: 4, unit: '°C', reason: 'a freezer level this far below its own normal means the compressor runs far more than it should while cold air does not reach the fresh food (a damper, an iced duct); door openings and hot days never make a freezer colder (common practice; healthy simulated units stayed within 2.3 °C)' },
  coldDriftSustainMinutes: { value: 360, unit: 'min', reason: 'the freezer must stay that much colder for six hours (common practice)' },
  updateEveryMinutes: { value: 60, unit: 'min', reason: 'an open finding reports its running figures at most this often unless something material changes' },
  incidentReopenMinutes: { value: 720, unit: 'min', reason: 'trouble returning within 12 hours of recovery is the same failure, not a new incident (hysteresis, common practice)' },
  powerLossMinAppliances: { value: 3, unit: 'count', reason: 'three or more units of a property warming together point to the supply, not the appliances (common practice)' },
  powerLossMinShare: { value: 0.5, unit: 'share', reason: 'and at least half of the reporting units of that property' },
  powerLossWindowMinutes: { value: 90, unit: 'min', reason: 'their findings started within this window of each other' },
};

function defaultsFromDocs(): DetectionSettings {
  const entries = Object.entries(SETTING_DOCS).map(([key, doc]) => [key, Array.isArray(doc.value) ? [...doc.value] : doc.value]);
  return Object.fromEntries(entries) as DetectionSettings;
}

export const DEFAULT_SETTINGS: Readonly<DetectionSettings> = Object.freeze(defaultsFromDocs());

/**
 * Defaults per style. None differ yet: the engine learns each unit's own rhythm (a chest
 * freezer simply never shows a defrost). This is where a manager's per-style overrides go.
 */
const STYLE_DEFAULTS: Partial<Record<ApplianceStyle, Partial<DetectionSettings>>> = {};

export type SettingsOverride = Partial<DetectionSettings>;

/** Defaults, then the style's defaults, then the manager's overrides (per style, then per appliance). */
export function settingsFor(style: ApplianceStyle, ...overrides: (SettingsOverride | undefined)[]): DetectionSettings {
  const merged: DetectionSettings = { ...defaultsFromDocs(), ...STYLE_DEFAULTS[style] };
  for (const override of overrides) Object.assign(merged, override ?? {});
  return merged;
}
