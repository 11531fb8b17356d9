/**
 * Public types of the appliance simulator model.
 *
 * The profile describes one appliance as a lumped thermal network (see physics.ts and
 * compartment.ts): per compartment an air node (air and probe, seconds to a minute), a shell
 * node (liner and shelves, tens of minutes) and a contents node (the food, hours), one
 * evaporator coil node in the freezer section (in the fresh-food section of a fresh-food-only
 * unit) cooled by the compressor and warmed by the defrost heater, and a fan that pushes coil
 * air to the freezer and, through a damper, to the fresh-food section. Every number is in SI units with the unit in its name.
 */
import type { ApplianceStyle, CauseCode, Probe } from '../../shared/domain';

export type FaultCode =
  | Exclude<CauseCode, 'sensor'>
  | 'sensor-disconnected'
  | 'sensor-power-on'
  | 'sensor-stuck'
  | 'sensor-dropout';

export const SENSOR_FAULTS = ['sensor-disconnected', 'sensor-power-on', 'sensor-stuck', 'sensor-dropout'] as const;
export type SensorFaultCode = (typeof SENSOR_FAULTS)[number];

export interface ApplianceProfile {
  style: ApplianceStyle;
  /** Thermostat targets for the mean cabinet air temperature. Unused for an absent compartment. */
  freshFoodSetpointC: number;
  freezerSetpointC: number;
  /** Thermostat dead bands (full width, K): demand starts at set + band/2, ends at set − band/2. */
  freshFoodHysteresisK: number;
  freezerHysteresisK: number;
  /** Compressor protection against short cycling. */
  compressorMinOffS: number;
  compressorMinOnS: number;

  /** Heat capacity of food + liner + shelves. */
  freshFoodContentsJPerK: number;
  freezerContentsJPerK: number;
  /** Heat capacity of the air node (air, the probe, light fittings). */
  freshFoodAirJPerK: number;
  freezerAirJPerK: number;
  /** Heat capacity of the shell node (liner, shelves, drawers). */
  freshFoodShellJPerK: number;
  freezerShellJPerK: number;
  /** Conductance of walls and gasket to the room (all of it; 90 % reaches the shell). */
  freshFoodUaWPerK: number;
  freezerUaWPerK: number;
  /** Conductance of the insulated partition between the compartments' shells. */
  partitionUaWPerK: number;
  /** Convection between each air node and its shell, and its contents. */
  freshFoodAirToShellWPerK: number;
  freezerAirToShellWPerK: number;
  freshFoodAirToContentsWPerK: number;
  freezerAirToContentsWPerK: number;
  /** Time constants of the control board's thermostat sensors following the air. */
  freshFoodThermostatLagS: number;
  freezerThermostatLagS: number;

  /** Compressor capacity at a −25 °C coil and a 25 °C room. */
  compressorCapacityW: number;
  /** Whether a fan drives air over the coil (false: cold-wall or cold-plate evaporator). */
  hasEvaporatorFan: boolean;
  /** Fan air stream through the coil as a conductance (mass flow × specific heat). */
  evaporatorAirflowWPerK: number;
  /** Share of the fan air stream sent to the fresh-food section with the damper open. */
  freshFoodAirShare: number;
  /** Share that still leaks to the fresh-food section with the damper closed. */
  damperLeakShare: number;
  /** Natural convection from the coil to the air around it (fan off). */
  coilNaturalWPerK: number;
  /** Natural air exchange through the ducts between the fresh-food air and the coil (fan off). */
  ductNaturalWPerK: number;

  /** Automatic defrost interval in hours; null for units without automatic defrost. */
  defrostIntervalH: number | null;
  /** Length of the whole defrost period (heater on until terminated, then drip time). */
  defrostDurationMin: number;
  defrostHeaterW: number;
  /** Frost gathered on the coil from the gasket and the room air, door openings excluded. */
  iceGrowthKgPerDay: number;

  /** Door habits: openings per day of both doors together, share on the freezer door. */
  doorOpeningsPerDay: number;
  freezerDoorShare: number;
  doorOpenMeanS: number;
  /** Air exchange with the room while a door is open. */
  freshFoodDoorExchangeWPerK: number;
  freezerDoorExchangeWPerK: number;
  /** Shift of the household's day against the usual clock (positive: later risers). */
  doorHabitShiftH: number;

  /** Room: daily mean, half the peak-to-trough swing, hour of the daily peak (local), weather. */
  roomMeanC: number;
  roomDailySwingK: number;
  roomPeakHourLocal: number;
  roomWeatherSwingK: number;
  /** Offset of the unit's local time from UTC (day/night habits follow local time). */
  utcOffsetHours: number;

  /** Sensor: random noise (SD) before the 12-bit rounding, fixed calibration offsets. */
  probeNoiseC: number;
  freshFoodProbeOffsetC: number;
  freezerProbeOffsetC: number;
  /** Probability that one reading is lost on the way. */
  lossProbability: number;
  batteryStartV: number;
  batteryDrainVPerYear: number;
}

export interface ScheduledFault {
  fault: FaultCode;
  startMs: number;
  endMs?: number | null;
  /** 0..1, how bad; default 1 (the textbook signature). */
  severity?: number;
  /** Sensor faults only: the probe affected; default every probe of the appliance. */
  probe?: Probe;
}

export interface SimSample {
  atMs: number;
  freshFoodC: number | null;
  freezerC: number | null;
  doorOpen: boolean;
  batteryV: number;
  /** Ground truth, not sent by real sensors. */
  compressorOn: boolean;
}

export type ExtraEventKind = 'grocery-load' | 'hot-day';

export interface ExtraEvent {
  kind: ExtraEventKind;
  atMs: number;
  /** grocery-load: kg of groceries (default 4–10); hot-day: K above normal (default 5–10). */
  magnitude?: number;
}

export interface SimulatorOptions {
  seed: number;
  startMs: number;
  faults?: ScheduledFault[];
  extraEvents?: ExtraEvent[];
  /** Internal physics step; default 20 s. */
  stepMs?: number;
}

export interface TraceOptions {
  profile: ApplianceProfile;
  seed: number;
  startMs: number;
  durationMs: number;
  intervalMs: number;
  faults?: ScheduledFault[];
  /** Settling time simulated before startMs; default 6 h. */
  warmupMs?: number;
  extraEvents?: ExtraEvent[];
  stepMs?: number;
}
