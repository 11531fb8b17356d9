/**
 * The fixed, seeded trace set of the detection benchmark: healthy appliances with groceries
 * and hot days, each appliance fault at a random onset, sensor faults, and properties whose
 * power fails for several units at once. Profiles vary widely (size, fill, set-points, room,
 * door habits, defrost rhythm) through the simulator's randomProfile; intervals run from
 * 1 to 15 minutes.
 */
import type { ApplianceStyle, Probe } from '../../../shared/domain';
import { APPLIANCE_STYLES, probesOf } from '../../../shared/domain';
import {
  createRng,
  deriveSeed,
  randomProfile,
  uniform,
  type ApplianceProfile,
  type ExtraEvent,
  type FaultCode,
  type Rng,
  type ScheduledFault,
} from '../../../simulator/model';

export const HOUR_MS = 3_600_000;
export const DAY_MS = 24 * HOUR_MS;
const INTERVALS_MIN = [1, 2, 5, 5, 10, 15];

export type ScenarioGroup = 'healthy' | 'appliance-fault' | 'sensor-fault' | 'power-loss';

export interface Scenario {
  id: string;
  group: ScenarioGroup;
  fault: FaultCode | null;
  style: ApplianceStyle;
  profile: ApplianceProfile;
  seed: number;
  startMs: number;
  durationMs: number;
  intervalMs: number;
  onsetMs: number | null;
  faults: ScheduledFault[];
  extraEvents: ExtraEvent[];
  /** Power-loss scenarios: the property the unit belongs to. */
  propertyId?: string;
}

export const APPLIANCE_FAULTS: readonly FaultCode[] = [
  'evaporator-fan',
  'defrost-system',
  'condenser-airflow',
  'compressor-start',
  'air-damper',
  'door-seal',
];
export const SENSOR_FAULT_CODES: readonly FaultCode[] = ['sensor-disconnected', 'sensor-power-on', 'sensor-stuck', 'sensor-dropout'];

/** Styles that have the failing part (a chest freezer has no fan, no damper, no auto defrost). */
const STYLES_FOR: Partial<Record<FaultCode, readonly ApplianceStyle[]>> = {
  'evaporator-fan': ['top-freezer', 'bottom-freezer', 'side-by-side', 'fresh-food-only', 'upright-freezer'],
  'defrost-system': ['top-freezer', 'bottom-freezer', 'side-by-side', 'upright-freezer'],
  'air-damper': ['top-freezer', 'bottom-freezer', 'side-by-side'],
};

function pickOf<T>(rng: Rng, items: readonly T[]): T {
  return items[Math.floor(rng() * items.length)];
}

function groceriesAndHeat(rng: Rng, startMs: number, durationMs: number): ExtraEvent[] {
  const events: ExtraEvent[] = [];
  const loads = 1 + Math.floor(rng() * 3);
  for (let i = 0; i < loads; i++) events.push({ kind: 'grocery-load', atMs: startMs + uniform(rng, 0.2, 0.95) * durationMs, magnitude: uniform(rng, 3, 12) });
  if (rng() < 0.5) events.push({ kind: 'hot-day', atMs: startMs + uniform(rng, 0.2, 0.8) * durationMs, magnitude: uniform(rng, 4, 10) });
  return events;
}

interface Base {
  rng: Rng;
  seed: number;
  style: ApplianceStyle;
  profile: ApplianceProfile;
  intervalMs: number;
  startMs: number;
}

function base(seed: number, styles: readonly ApplianceStyle[]): Base {
  const rng = createRng(seed);
  const style = pickOf(rng, styles);
  const profile = randomProfile(createRng(deriveSeed(seed, 1)), style);
  const intervalMs = pickOf(rng, INTERVALS_MIN) * 60_000;
  const startMs = Date.UTC(2025, 0, 1) + Math.floor(uniform(rng, 0, 300)) * DAY_MS + Math.floor(uniform(rng, 0, 24)) * HOUR_MS;
  return { rng, seed, style, profile, intervalMs, startMs };
}

function healthy(seed: number, index: number): Scenario {
  const b = base(seed, APPLIANCE_STYLES);
  const durationMs = 7 * DAY_MS;
  return { id: `healthy-${index}`, group: 'healthy', fault: null, ...b, durationMs, onsetMs: null, faults: [], extraEvents: groceriesAndHeat(b.rng, b.startMs, durationMs) };
}

function applianceFault(seed: number, fault: FaultCode, index: number): Scenario {
  const b = base(seed, STYLES_FOR[fault] ?? APPLIANCE_STYLES);
  const onsetMs = b.startMs + uniform(b.rng, 2, 4) * DAY_MS;
  // Ice takes days to choke the coil once the defrost heater is gone.
  const afterMs = (fault === 'defrost-system' ? 12 : 5) * DAY_MS;
  const durationMs = onsetMs - b.startMs + afterMs;
  const severity = uniform(b.rng, 0.9, 1);
  const extraEvents = groceriesAndHeat(b.rng, b.startMs, onsetMs - b.startMs);
  return { id: `${fault}-${index}`, group: 'appliance-fault', fault, ...b, durationMs, onsetMs, faults: [{ fault, startMs: onsetMs, severity }], extraEvents };
}

function sensorFault(seed: number, fault: FaultCode, index: number): Scenario {
  const b = base(seed, APPLIANCE_STYLES);
  const onsetMs = b.startMs + uniform(b.rng, 2, 3) * DAY_MS;
  const durationMs = onsetMs - b.startMs + 2 * DAY_MS;
  const intermittent = fault === 'sensor-disconnected' || fault === 'sensor-power-on';
  const severity = intermittent ? uniform(b.rng, 0.2, 1) : 1;
  const own = probesOf(b.style);
  const probe: Probe | undefined = own.length === 1 ? own[0] : pickOf(b.rng, [...own, undefined]);
  const extraEvents = groceriesAndHeat(b.rng, b.startMs, durationMs);
  return { id: `${fault}-${index}`, group: 'sensor-fault', fault, ...b, durationMs, onsetMs, faults: [{ fault, startMs: onsetMs, severity, probe }], extraEvents };
}

/** One property: several units lose power together for 3 to 12 hours. */
function property(seed: number, index: number, units: number): Scenario[] {
  const rng = createRng(seed);
  const startMs = Date.UTC(2025, 0, 1) + Math.floor(uniform(rng, 0, 300)) * DAY_MS;
  const onsetMs = startMs + uniform(rng, 2, 4) * DAY_MS;
  const endMs = onsetMs + uniform(rng, 3, 12) * HOUR_MS;
  const durationMs = endMs - startMs + 2 * DAY_MS;
  const scenarios: Scenario[] = [];
  for (let unit = 0; unit < units; unit++) {
    const b = base(deriveSeed(seed, 10 + unit), APPLIANCE_STYLES);
    scenarios.push({
      id: `power-loss-${index}-unit-${unit}`,
      group: 'power-loss',
      fault: 'power-loss',
      ...b,
      startMs,
      durationMs,
      onsetMs,
      faults: [{ fault: 'power-loss', startMs: onsetMs, endMs }],
      extraEvents: [],
      propertyId: `property-${index}`,
    });
  }
  return scenarios;
}

export interface ScenarioCounts {
  healthy: number;
  perApplianceFault: number;
  perSensorFault: number;
  properties: number;
  unitsPerProperty: number;
}

export const FULL_COUNTS: ScenarioCounts = { healthy: 72, perApplianceFault: 14, perSensorFault: 8, properties: 8, unitsPerProperty: 4 };

export function buildScenarios(baseSeed: number, counts: ScenarioCounts = FULL_COUNTS): Scenario[] {
  const scenarios: Scenario[] = [];
  let stream = 0;
  const next = () => deriveSeed(baseSeed, stream++);
  for (let i = 0; i < counts.healthy; i++) scenarios.push(healthy(next(), i));
  for (const fault of APPLIANCE_FAULTS) for (let i = 0; i < counts.perApplianceFault; i++) scenarios.push(applianceFault(next(), fault, i));
  for (const fault of SENSOR_FAULT_CODES) for (let i = 0; i < counts.perSensorFault; i++) scenarios.push(sensorFault(next(), fault, i));
  for (let i = 0; i < counts.properties; i++) scenarios.push(...property(next(), i, counts.unitsPerProperty));
  return scenarios;
}
