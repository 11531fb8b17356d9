/**
 * Appliance profiles: a calibrated default per style and wide random variation around it.
 *
 * The default top-freezer is an ordinary frost-free unit of about 500 L (350 L fresh food,
 * 150 L freezer), moderately stocked. Its numbers are engineering estimates (from memory, common
 * practice for this size): walls about 1.0 W/K (fresh food) and 0.75 W/K (freezer), a compressor
 * lifting about 100 W at a −25 °C coil (duty about 50 % in a 22 °C room), a fan stream of about
 * 18 W/K (≈15 L/s of air) with 15 % sent to the fresh-food section, defrost every 10 h for
 * 30 min with a 350 W heater, fresh food held at 2.5 °C (a middle setting), freezer at −18 °C.
 * Calibration, checked by the specs in spec/simulator:
 * - the fresh-food contents (120 kJ/K ≈ 25 kg of food plus glass and drawers) make a closed unit
 *   without power pass 4 °C after about 4 h (USDA FSIS, "Keeping Food Safe During an Emergency":
 *   about 4 h); the cabinet air, which the probe reads, gets there after about 2 h;
 * - partition and duct leaks leave the fresh-food section near 10 °C and the freezer near −7 °C
 *   with the evaporator fan stopped (common practice: about 10 °C / 50 °F);
 * - freezer contents (50 kJ/K ≈ 20 kg) with their latent heat hold frozen for one to three days.
 * randomProfile scales size, fill, habits, room and controls widely and sizes the compressor from
 * the unit's own heat load at a 32 °C room, so every random unit holds its setpoints when healthy.
 */
import type { ApplianceStyle } from '../../shared/domain';
import { APPLIANCE_STYLES } from '../../shared/domain';
import type { ApplianceProfile } from './types';
import { logUniform, pick, Rng, uniform } from './rng';

const TOP_FREEZER: ApplianceProfile = {
  style: 'top-freezer',
  freshFoodSetpointC: 2.5,
  freezerSetpointC: -18,
  freshFoodHysteresisK: 1.5,
  freezerHysteresisK: 2,
  compressorMinOffS: 300,
  compressorMinOnS: 180,
  freshFoodContentsJPerK: 120_000,
  freezerContentsJPerK: 50_000,
  freshFoodAirJPerK: 2_000,
  freezerAirJPerK: 1_200,
  freshFoodShellJPerK: 25_000,
  freezerShellJPerK: 15_000,
  freshFoodUaWPerK: 1.0,
  freezerUaWPerK: 0.75,
  partitionUaWPerK: 0.25,
  freshFoodAirToShellWPerK: 25,
  freezerAirToShellWPerK: 15,
  freshFoodAirToContentsWPerK: 15,
  freezerAirToContentsWPerK: 10,
  freshFoodThermostatLagS: 300,
  freezerThermostatLagS: 900,
  compressorCapacityW: 100,
  hasEvaporatorFan: true,
  evaporatorAirflowWPerK: 18,
  freshFoodAirShare: 0.15,
  damperLeakShare: 0.01,
  coilNaturalWPerK: 1.0,
  ductNaturalWPerK: 0.3,
  defrostIntervalH: 10,
  defrostDurationMin: 30,
  defrostHeaterW: 350,
  iceGrowthKgPerDay: 0.4,
  doorOpeningsPerDay: 30,
  freezerDoorShare: 0.2,
  doorOpenMeanS: 20,
  freshFoodDoorExchangeWPerK: 20,
  freezerDoorExchangeWPerK: 12,
  doorHabitShiftH: 0,
  roomMeanC: 22,
  roomDailySwingK: 1.5,
  roomPeakHourLocal: 16,
  roomWeatherSwingK: 1,
  utcOffsetHours: -5,
  probeNoiseC: 0.03,
  freshFoodProbeOffsetC: 0,
  freezerProbeOffsetC: 0,
  lossProbability: 0.002,
  batteryStartV: 3.2,
  batteryDrainVPerYear: 0.15,
};

/** How each style differs from the top-freezer (common practice of the layouts). */
const STYLE_CHANGES: Record<ApplianceStyle, Partial<ApplianceProfile>> = {
  'top-freezer': {},
  // The freezer drawer is opened from above, so less cold air spills out.
  'bottom-freezer': { freshFoodAirShare: 0.18, freezerDoorExchangeWPerK: 7, freezerDoorShare: 0.25 },
  // A tall partition (mullion) and a tall freezer door.
  'side-by-side': { partitionUaWPerK: 0.4, freezerUaWPerK: 0.9, freezerDoorShare: 0.3, compressorCapacityW: 150 },
  // Evaporator in the fresh-food section, off-cycle defrost (the coil warms above 0 °C each off period).
  'fresh-food-only': {
    freshFoodContentsJPerK: 200_000,
    freshFoodUaWPerK: 1.3,
    compressorCapacityW: 80,
    evaporatorAirflowWPerK: 6,
    coilNaturalWPerK: 2,
    defrostIntervalH: null,
    iceGrowthKgPerDay: 0.1,
    freezerDoorShare: 0,
  },
  'upright-freezer': {
    freezerContentsJPerK: 80_000,
    freezerAirJPerK: 5_000,
    freezerUaWPerK: 1.1,
    compressorCapacityW: 120,
    evaporatorAirflowWPerK: 15,
    defrostIntervalH: 12,
    freezerDoorShare: 1,
    freezerDoorExchangeWPerK: 18,
    doorOpeningsPerDay: 6,
  },
  // Cold-wall evaporator, no fan, manual defrost; cold air stays in an open chest.
  'chest-freezer': {
    freezerContentsJPerK: 90_000,
    freezerAirJPerK: 4_000,
    freezerUaWPerK: 0.9,
    compressorCapacityW: 90,
    hasEvaporatorFan: false,
    coilNaturalWPerK: 8,
    defrostIntervalH: null,
    iceGrowthKgPerDay: 0.02,
    freezerDoorShare: 1,
    freezerDoorExchangeWPerK: 4,
    doorOpeningsPerDay: 4,
  },
};

export function defaultProfile(style: ApplianceStyle = 'top-freezer'): ApplianceProfile {
  return { ...TOP_FREEZER, ...STYLE_CHANGES[style], style };
}

/** A varied but physically sane appliance; same rng sequence, same profile. */
export function randomProfile(rng: Rng, style?: ApplianceStyle): ApplianceProfile {
  const chosen = style ?? pick(rng, APPLIANCE_STYLES);
  const p = defaultProfile(chosen);
  scaleCabinet(p, rng);
  chooseControls(p, rng);
  chooseDefrost(p, rng);
  chooseHabits(p, rng);
  chooseRoom(p, rng);
  chooseSensor(p, rng);
  p.compressorCapacityW = sizeCompressorW(p, rng);
  return p;
}

function scaleCabinet(p: ApplianceProfile, rng: Rng): void {
  const size = logUniform(rng, 0.55, 1.7);
  const wallScale = Math.pow(size, 2 / 3) * uniform(rng, 0.8, 1.25);
  p.freshFoodContentsJPerK *= size * uniform(rng, 0.5, 1.4);
  p.freezerContentsJPerK *= size * uniform(rng, 0.5, 1.4);
  p.freshFoodAirJPerK *= size;
  p.freezerAirJPerK *= size;
  p.freshFoodShellJPerK *= size * uniform(rng, 0.8, 1.25);
  p.freezerShellJPerK *= size * uniform(rng, 0.8, 1.25);
  p.freshFoodAirToShellWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.freezerAirToShellWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.freshFoodUaWPerK *= wallScale;
  p.freezerUaWPerK *= wallScale;
  p.partitionUaWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.freshFoodAirToContentsWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.freezerAirToContentsWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.evaporatorAirflowWPerK *= Math.sqrt(size) * uniform(rng, 0.8, 1.25);
  p.freshFoodAirShare *= uniform(rng, 0.75, 1.1);
  p.ductNaturalWPerK *= wallScale * uniform(rng, 0.8, 1.25);
  p.coilNaturalWPerK *= wallScale * uniform(rng, 0.8, 1.25);
}

/** Bands first, then a setpoint that keeps the band inside 1.5–4.4 °C / below −17 °C. */
function chooseControls(p: ApplianceProfile, rng: Rng): void {
  p.freshFoodHysteresisK = uniform(rng, 1, 2);
  const halfFresh = p.freshFoodHysteresisK / 2;
  p.freshFoodSetpointC = uniform(rng, 1.5 + halfFresh, 4.4 - halfFresh);
  p.freezerHysteresisK = uniform(rng, 1.5, 3);
  p.freezerSetpointC = uniform(rng, -24, -17 - p.freezerHysteresisK / 2);
  p.compressorMinOffS = uniform(rng, 180, 480);
  p.compressorMinOnS = uniform(rng, 120, 300);
}

function chooseDefrost(p: ApplianceProfile, rng: Rng): void {
  p.iceGrowthKgPerDay *= uniform(rng, 0.6, 1.6);
  if (p.defrostIntervalH === null) return;
  p.defrostIntervalH = logUniform(rng, 6, 72);
  p.defrostDurationMin = uniform(rng, 20, 45);
  p.defrostHeaterW = uniform(rng, 250, 600);
  // Adaptive controls stretch the interval where little frost forms: keep one interval's frost
  // below the 0.5 kg at which the fresh-food duct starts to choke.
  p.iceGrowthKgPerDay = Math.min(p.iceGrowthKgPerDay, (0.4 * 24) / p.defrostIntervalH);
}

function chooseHabits(p: ApplianceProfile, rng: Rng): void {
  const freezerOnly = p.freezerDoorShare === 1;
  p.doorOpeningsPerDay = freezerOnly ? logUniform(rng, 1, 15) : logUniform(rng, 4, 80);
  if (p.freezerDoorShare > 0 && !freezerOnly) p.freezerDoorShare = uniform(rng, 0.08, 0.35);
  p.doorOpenMeanS = logUniform(rng, 8, 40);
  p.doorHabitShiftH = uniform(rng, -2, 3);
}

function chooseRoom(p: ApplianceProfile, rng: Rng): void {
  p.roomMeanC = uniform(rng, 17, 28);
  p.roomDailySwingK = uniform(rng, 0.3, 4);
  p.roomPeakHourLocal = uniform(rng, 13, 19);
  p.roomWeatherSwingK = uniform(rng, 0, 2.5);
  p.utcOffsetHours = Math.round(uniform(rng, -10, 3));
}

function chooseSensor(p: ApplianceProfile, rng: Rng): void {
  p.probeNoiseC = uniform(rng, 0.01, 0.08);
  p.freshFoodProbeOffsetC = uniform(rng, -0.3, 0.3);
  p.freezerProbeOffsetC = uniform(rng, -0.3, 0.3);
  p.lossProbability = rng() < 0.2 ? 0 : logUniform(rng, 0.0005, 0.02);
  p.batteryStartV = uniform(rng, 2.9, 3.3);
  p.batteryDrainVPerYear = uniform(rng, 0.05, 0.4);
}

/**
 * Heat load at a 32 °C room (walls, door openings, defrost heater) times a design margin of
 * 1.4–2.0; 32 °C is about the hottest room a healthy unit is expected to hold in (common practice).
 */
function sizeCompressorW(p: ApplianceProfile, rng: Rng): number {
  const hotRoomC = 32;
  const hasFresh = p.style !== 'upright-freezer' && p.style !== 'chest-freezer';
  const hasFreezer = p.style !== 'fresh-food-only';
  const wallsW = (hasFresh ? p.freshFoodUaWPerK * (hotRoomC - p.freshFoodSetpointC) : 0)
    + (hasFreezer ? p.freezerUaWPerK * (hotRoomC - p.freezerSetpointC) : 0);
  const doorS = (p.doorOpeningsPerDay * p.doorOpenMeanS) / 86_400;
  const doorsW = doorS * (p.freshFoodDoorExchangeWPerK + p.freezerDoorExchangeWPerK) * 30;
  const defrostW = p.defrostIntervalH === null ? 0 : (0.5 * p.defrostHeaterW * p.defrostDurationMin) / (60 * p.defrostIntervalH);
  return (wallsW + doorsW + defrostW) * uniform(rng, 1.4, 2.0);
}
