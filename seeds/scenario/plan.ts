/**
 * The demo scenario as data, planned deterministically from a seed number and a "now":
 * the company's properties, units and appliances (style, model, serial, age), one sensor per
 * appliance, the tenants, the past repairs and the live storyline. No I/O; the seed steps
 * write it. Secrets are not part of the plan (they are random, see fleet-file.ts).
 */
import type { ApplianceStyle } from '../../shared/domain';
import { createRng, defaultProfile, deriveSeed, randomProfile, type ApplianceProfile, type Rng } from '../../simulator/model';
import { DEMO_CITY, DEMO_REGION, DEMO_TIME_ZONE, DEMO_UTC_OFFSET_HOURS, MODEL_CODES, OTHER_TENANTS, PROPERTY_BLUEPRINTS, type PersonBlueprint, type PropertyBlueprint } from './catalogue';
import { calibratedProfile, STORYLINE_PROFILES } from './storyline';

export const DAY_MS = 86_400_000;
export const YEAR_MS = 365.25 * DAY_MS;
/** Ten-minute readings: judged alike by the engine (quarter-hour buckets), half the rows of five. */
export const SENSOR_INTERVAL_SECONDS = 600;
export const DEFAULT_SCENARIO_SEED = 20261201;

export interface PlannedAppliance {
  /** `property/unit/n`, stable across seeds: the storyline and past repairs name appliances by it. */
  key: string;
  propertyKey: string;
  unitLabel: string;
  deviceId: string;
  style: ApplianceStyle;
  model: string;
  serial: string;
  installedOn: string;
  warrantyEndsOn: string;
  ageYears: number;
  /** When its sensor was fitted: the history starts here. */
  monitoredFromMs: number;
  seed: number;
  profile: ApplianceProfile;
}

export interface PlannedUnit {
  label: string;
  floor: number;
  appliances: PlannedAppliance[];
}

export interface PlannedProperty extends PropertyBlueprint {
  city: string;
  region: string;
  timeZone: string;
  utcOffsetHours: number;
  units: PlannedUnit[];
}

export interface PlannedTenant extends PersonBlueprint {
  unitKey: string;
}

export interface ScenarioPlan {
  seed: number;
  nowMs: number;
  properties: PlannedProperty[];
  /** Other tenants than the demo sign-in (they were invited and have not signed up). */
  tenants: PlannedTenant[];
  /** `property/unit` of the demo tenant: where the storyline's evaporator fan fails. */
  demoTenantUnitKey: string;
}

interface UnitLayout {
  label: string;
  floor: number;
  /** Styles in the unit, the refrigerator first. */
  styles: ApplianceStyle[];
  /** Range of appliance ages in years (the units of a property spread over it evenly). */
  ages: [number, number];
  /** Range for a freezer in the unit, when it differs. */
  freezerAges?: [number, number];
}

/** Units whose appliances the storyline or the past repairs need in a known style. */
const FIXED_STYLES: Record<string, ApplianceStyle[]> = {
  'p1/304': ['bottom-freezer'],
  'p1/206': ['side-by-side'],
  'p1/403': ['top-freezer'],
  'p1/502': ['top-freezer'],
  'p1/108': ['side-by-side', 'upright-freezer'],
  'p1/308': ['bottom-freezer', 'upright-freezer'],
  'p2/4': ['bottom-freezer', 'chest-freezer'],
  'p2/8': ['bottom-freezer'],
  'p3/1B': ['top-freezer', 'chest-freezer'],
  'p3/3A': ['top-freezer'],
  'p3/3B': ['top-freezer'],
  'p3/4A': ['top-freezer', 'upright-freezer'],
};

function midRiseUnits(rng: Rng): UnitLayout[] {
  const units: UnitLayout[] = [];
  for (let floor = 1; floor <= 5; floor++) {
    for (let n = 1; n <= 8; n++) {
      const label = `${floor}0${n}`;
      const corner = n === 1 || n === 8;
      const style: ApplianceStyle = corner ? (rng() < 0.5 ? 'side-by-side' : 'bottom-freezer') : rng() < 0.12 ? 'fresh-food-only' : rng() < 0.5 ? 'top-freezer' : 'bottom-freezer';
      units.push({ label, floor, styles: [style], ages: [1.5, 8] });
    }
  }
  return units;
}

function townhouseUnits(): UnitLayout[] {
  return [2, 4, 6, 8, 10, 12].map((house, index) => ({ label: String(house), floor: 1, styles: [index % 3 === 2 ? 'side-by-side' : 'bottom-freezer'], ages: [3, 9] }));
}

/** The walk-up: original-era refrigerators and freezers past or near their expected life. */
function olderUnits(): UnitLayout[] {
  const labels = ['1A', '1B', '2A', '2B', '3A', '3B', '4A', '4B'];
  return labels.map((label) => ({ label, floor: Number(label[0]), styles: ['top-freezer'], ages: [9, 16], freezerAges: [11.5, 15] }));
}

function layoutsOf(blueprint: PropertyBlueprint, rng: Rng): UnitLayout[] {
  const layouts = blueprint.kind === 'mid-rise' ? midRiseUnits(rng) : blueprint.kind === 'townhouses' ? townhouseUnits() : olderUnits();
  return layouts.map((layout) => ({ ...layout, styles: FIXED_STYLES[`${blueprint.key}/${layout.label}`] ?? layout.styles }));
}

/**
 * Age wears an appliance: past ten years the compressor has lost some capacity and the
 * insulation and gaskets leak more (common practice, from memory; the figures are ours).
 */
function agedProfile(profile: ApplianceProfile, ageYears: number): ApplianceProfile {
  if (ageYears < 10) return profile;
  const wear = Math.min(1, (ageYears - 10) / 6);
  return {
    ...profile,
    compressorCapacityW: profile.compressorCapacityW * (1 - 0.15 * wear),
    freshFoodUaWPerK: profile.freshFoodUaWPerK * (1 + 0.12 * wear),
    freezerUaWPerK: profile.freezerUaWPerK * (1 + 0.12 * wear),
  };
}

const alignDown = (ms: number) => Math.floor(ms / (SENSOR_INTERVAL_SECONDS * 1000)) * SENSOR_INTERVAL_SECONDS * 1000;
const hex = (rng: Rng, length: number) => Array.from({ length }, () => Math.floor(rng() * 16).toString(16)).join('');
const dateOnly = (ms: number) => new Date(ms).toISOString().slice(0, 10);
const pickOf = <T>(rng: Rng, items: readonly T[]) => items[Math.floor(rng() * items.length)];

interface PlanCursor {
  seed: number;
  nowMs: number;
  /** No history before this (a quick seed), else 0. */
  historyFloorMs: number;
  rng: Rng;
  index: number;
}

/** Monitoring began 90 days ago at the smaller properties and eight weeks ago at the mid-rise. */
function rolloutMs(kind: PlannedProperty['kind'], nowMs: number): number {
  return nowMs - (kind === 'mid-rise' ? 56 : 90) * DAY_MS;
}

/** Stratified: the i-th of n units gets an age in the i-th slice of the range, so every range is covered. */
function ageOf(rng: Rng, range: [number, number], unitIndex: number, unitCount: number): number {
  const share = (unitIndex + rng()) / unitCount;
  return Math.round((range[0] + share * (range[1] - range[0])) * 10) / 10;
}

function planAppliance(cursor: PlanCursor, property: PropertyBlueprint, layout: UnitLayout, style: ApplianceStyle, place: { position: number; unitIndex: number; unitCount: number }): PlannedAppliance {
  const { rng, nowMs } = cursor;
  const key = `${property.key}/${layout.label}/${place.position + 1}`;
  const storyline = STORYLINE_PROFILES[key];
  const range = place.position > 0 && layout.freezerAges ? layout.freezerAges : layout.ages;
  // Shuffled slices: the age does not follow the unit number.
  const slice = (place.unitIndex * 5 + 3) % place.unitCount;
  const ageYears = storyline?.ageYears ?? ageOf(rng, range, slice, place.unitCount);
  const installedMs = nowMs - ageYears * YEAR_MS;
  const derivedSeed = deriveSeed(cursor.seed, 1000 + cursor.index++);
  const seed = storyline?.simSeed ?? derivedSeed;
  const random = agedProfile(randomProfile(createRng(derivedSeed), style), ageYears);
  const profile = storyline ? calibratedProfile(defaultProfile(style), storyline) : random;
  const model = pickOf(rng, MODEL_CODES[style]);
  return {
    key,
    propertyKey: property.key,
    unitLabel: layout.label,
    deviceId: `cw-${hex(rng, 12)}`,
    style,
    model,
    serial: `${new Date(installedMs).getUTCFullYear() % 100}${hex(rng, 2).toUpperCase()}${String(Math.floor(rng() * 1e6)).padStart(6, '0')}`,
    installedOn: dateOnly(installedMs),
    warrantyEndsOn: dateOnly(installedMs + YEAR_MS),
    ageYears,
    monitoredFromMs: alignDown(Math.max(rolloutMs(property.kind, nowMs), installedMs + DAY_MS, cursor.historyFloorMs)),
    seed,
    profile: { ...profile, utcOffsetHours: DEMO_UTC_OFFSET_HOURS },
  };
}

function planProperty(cursor: PlanCursor, blueprint: PropertyBlueprint): PlannedProperty {
  const layouts = layoutsOf(blueprint, cursor.rng);
  const units = layouts.map((layout, unitIndex) => ({
    label: layout.label,
    floor: layout.floor,
    appliances: layout.styles.map((style, position) => planAppliance(cursor, blueprint, layout, style, { position, unitIndex, unitCount: layouts.length })),
  }));
  return { ...blueprint, city: DEMO_CITY, region: DEMO_REGION, timeZone: DEMO_TIME_ZONE, utcOffsetHours: DEMO_UTC_OFFSET_HOURS, units };
}

const TENANT_UNITS = ['p1/207', 'p1/502', 'p2/6', 'p3/2B', 'p3/4A'];

/**
 * `nowMs` is rounded down to the sensors' interval so every reading falls on the same grid.
 * `historyDays` cuts the history to that many days before now (quick seeds for specs).
 */
export function planScenario(seed: number, nowMs: number, historyDays?: number): ScenarioPlan {
  const alignedNowMs = alignDown(nowMs);
  const historyFloorMs = historyDays === undefined ? 0 : alignedNowMs - historyDays * DAY_MS;
  const cursor: PlanCursor = { seed, nowMs: alignedNowMs, historyFloorMs, rng: createRng(deriveSeed(seed, 88)), index: 0 };
  const properties = PROPERTY_BLUEPRINTS.map((blueprint) => planProperty(cursor, blueprint));
  const tenants = OTHER_TENANTS.map((person, index) => ({ ...person, unitKey: TENANT_UNITS[index] }));
  return { seed, nowMs: alignedNowMs, properties, tenants, demoTenantUnitKey: 'p1/304' };
}

export function appliancesOf(plan: ScenarioPlan): PlannedAppliance[] {
  return plan.properties.flatMap((property) => property.units.flatMap((unit) => unit.appliances));
}

export function applianceByKey(plan: ScenarioPlan, key: string): PlannedAppliance {
  const found = appliancesOf(plan).find((appliance) => appliance.key === key);
  if (!found) throw new Error(`the scenario has no appliance ${key}`);
  return found;
}
