/**
 * The simulator's fleet file: which sensors to play, with their credentials and the
 * appliance each one sits in. The seed step writes it (git-ignored, in the data folder);
 * planFleet makes the invented demo fleet deterministically from a seed.
 */
import fs from 'node:fs';
import path from 'node:path';
import type { ApplianceStyle, CauseCode, Probe } from '../../shared/domain';
import { createRng, defaultProfile, deriveSeed, randomProfile, type ApplianceProfile, type FaultCode, type Rng } from '../model';

export const FLEET_FILE_NAME = 'fleet.json';
/** Where the simulator notes how far each device got (see fleet-runner.ts). */
export const SIMULATOR_STATE_FILE_NAME = 'simulator-state.json';

export interface FleetProperty {
  key: string;
  name: string;
  addressLine1: string;
  city: string;
  region: string;
  postalCode: string;
  timeZone: string;
  /** Standard-time offset used for the households' day/night habits. */
  utcOffsetHours: number;
}

export interface FleetDevice {
  deviceId: string;
  secret: string;
  propertyKey: string;
  unitLabel: string;
  /** The appliance's id in the database (null in a fleet planned without one). */
  applianceId: string | null;
  style: ApplianceStyle;
  model: string;
  intervalSeconds: number;
  /** Seed of this appliance's physics, doors and sensor noise. */
  seed: number;
  profile: ApplianceProfile;
}

/** A fault on one device, or on every device of a property (a power cut hits the building). */
export interface FleetFault {
  fault: FaultCode;
  deviceId?: string;
  propertyKey?: string;
  startMs: number;
  endMs?: number | null;
  severity?: number;
  /** Sensor faults only: the probe affected (default every probe). */
  probe?: Probe;
}

export interface FleetFile {
  version: 1;
  seed: number;
  properties: FleetProperty[];
  devices: FleetDevice[];
  faults: FleetFault[];
}

export interface FleetPlanOptions {
  seed: number;
  properties: number;
  appliancesPerProperty: number;
  intervalSeconds: number;
  /** Secrets are random (crypto), never derived from the seed. */
  newSecret: () => string;
}

/** Invented buildings on reserved-looking streets of an invented town. */
const PROPERTY_NAMES = ['Juniper Court', 'Larkspur Flats', 'Quarry Hill Lofts', 'Tamarack House', 'Wrenfield Terrace', 'Osprey Commons'];
const STREETS = ['Alder Row', 'Cobble Lane', 'Fennel Street', 'Heron Way', 'Millrace Road', 'Sorrel Avenue'];
const TIME_ZONES: [string, number][] = [
  ['America/New_York', -5],
  ['America/Chicago', -6],
  ['America/Denver', -7],
  ['America/Los_Angeles', -8],
];
/** The demo cycles through these so every style appears in a small fleet. */
const STYLE_CYCLE: ApplianceStyle[] = ['top-freezer', 'bottom-freezer', 'side-by-side', 'fresh-food-only', 'upright-freezer', 'chest-freezer'];
const MODEL_PREFIX: Record<ApplianceStyle, string> = {
  'top-freezer': 'TF',
  'bottom-freezer': 'BF',
  'side-by-side': 'SX',
  'fresh-food-only': 'RO',
  'upright-freezer': 'UF',
  'chest-freezer': 'CF',
};

function hex(rng: Rng, digits: number): string {
  let text = '';
  while (text.length < digits) text += Math.floor(rng() * 16).toString(16);
  return text;
}

function planProperty(index: number, rng: Rng): FleetProperty {
  const [timeZone, utcOffsetHours] = TIME_ZONES[index % TIME_ZONES.length];
  return {
    key: `p${index + 1}`,
    name: PROPERTY_NAMES[index % PROPERTY_NAMES.length] + (index >= PROPERTY_NAMES.length ? ` ${index + 1}` : ''),
    addressLine1: `${100 + Math.floor(rng() * 800)} ${STREETS[index % STREETS.length]}`,
    city: 'Millbrook',
    region: 'ZZ',
    postalCode: `0${String(1000 + index).padStart(4, '0')}`,
    timeZone,
    utcOffsetHours,
  };
}

function planDevice(property: FleetProperty, index: number, globalIndex: number, options: FleetPlanOptions, rng: Rng): FleetDevice {
  const style = STYLE_CYCLE[globalIndex % STYLE_CYCLE.length];
  const seed = deriveSeed(options.seed, 1000 + globalIndex);
  const profile = { ...randomProfile(createRng(seed), style), utcOffsetHours: property.utcOffsetHours };
  return {
    deviceId: `cw-${hex(rng, 12)}`,
    secret: options.newSecret(),
    propertyKey: property.key,
    unitLabel: `${Math.floor(index / 2) + 1}${'AB'[index % 2]}`,
    applianceId: null,
    style,
    model: `${MODEL_PREFIX[style]}-${200 + Math.floor(rng() * 700)}`,
    intervalSeconds: options.intervalSeconds,
    seed,
    profile,
  };
}

export function planFleet(options: FleetPlanOptions): FleetFile {
  const rng = createRng(deriveSeed(options.seed, 77));
  const properties = Array.from({ length: options.properties }, (_, index) => planProperty(index, rng));
  const devices: FleetDevice[] = [];
  for (const property of properties) {
    for (let i = 0; i < options.appliancesPerProperty; i++) devices.push(planDevice(property, i, devices.length, options, rng));
  }
  return { version: 1, seed: options.seed, properties, devices, faults: [] };
}

/** The demo's faults: causes the trade knows, developing in the backfilled history. */
export function demoFaults(fleet: FleetFile, nowMs: number): FleetFault[] {
  const hourMs = 3_600_000;
  const withFan = fleet.devices.find((device) => device.profile.hasEvaporatorFan && device.style !== 'upright-freezer');
  const withDefrost = fleet.devices.find((device) => device !== withFan && device.profile.defrostIntervalH !== null);
  const faults: FleetFault[] = [];
  const cause = (fault: CauseCode & FaultCode, device: FleetDevice | undefined, startMs: number) =>
    device && faults.push({ fault, deviceId: device.deviceId, startMs, endMs: null });
  cause('evaporator-fan', withFan, nowMs - 30 * hourMs);
  cause('defrost-system', withDefrost, nowMs - 6 * 24 * hourMs);
  return faults;
}

export function writeFleetFile(dataDir: string, fleet: FleetFile): string {
  fs.mkdirSync(dataDir, { recursive: true });
  const file = path.join(dataDir, FLEET_FILE_NAME);
  // It holds device secrets: readable by the owner only.
  fs.writeFileSync(file, `${JSON.stringify(fleet, null, 2)}\n`, { mode: 0o600 });
  fs.chmodSync(file, 0o600);
  // A new fleet starts its history afresh, even where device ids repeat (same seed).
  fs.rmSync(path.join(dataDir, SIMULATOR_STATE_FILE_NAME), { force: true });
  return file;
}

export function readFleetFile(file: string): FleetFile {
  const fleet = JSON.parse(fs.readFileSync(file, 'utf8')) as FleetFile;
  if (fleet.version !== 1 || !Array.isArray(fleet.devices)) throw new Error(`${file} is not a fleet file (version 1)`);
  // Fields a newer model added get their style's default.
  for (const device of fleet.devices) device.profile = { ...defaultProfile(device.style), ...device.profile, style: device.style };
  return fleet;
}
