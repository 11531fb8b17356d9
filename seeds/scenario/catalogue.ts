/**
 * The invented world of the demo: one property-management company, its buildings, the
 * people in them and the parts its contractors fit. Every name is made up; streets are
 * fictional, e-mail uses reserved example domains, phones the 555-01xx fiction range.
 */
import type { ApplianceStyle } from '../../shared/domain';

/** The demo sign-ins (seeds/demo-accounts.ts) use this organization's domain. */
export const DEMO_ORGANIZATION_NAME = 'Lindenfield Rentals (demo)';
export const DEMO_CITY = 'Millbrook';
export const DEMO_REGION = 'ZZ';
export const DEMO_TIME_ZONE = 'America/Chicago';
/** Standard-time offset of DEMO_TIME_ZONE, for the households' day/night habits. */
export const DEMO_UTC_OFFSET_HOURS = -6;

export type PropertyKind = 'mid-rise' | 'townhouses' | 'older-walk-up';

export interface PropertyBlueprint {
  key: string;
  kind: PropertyKind;
  name: string;
  addressLine1: string;
  postalCode: string;
  builtYear: number;
  /** Index into DEMO_CONTRACTORS of the company that is called first here; the other is the backup. */
  primaryContractor: 0 | 1;
}

export const PROPERTY_BLUEPRINTS: readonly PropertyBlueprint[] = [
  { key: 'p1', kind: 'mid-rise', name: 'Harrowgate Commons', addressLine1: '48 Quillfeather Avenue', postalCode: '01012', builtYear: 2009, primaryContractor: 0 },
  { key: 'p2', kind: 'townhouses', name: 'Bramblewick Row', addressLine1: '2–12 Bramblewick Row', postalCode: '01014', builtYear: 2016, primaryContractor: 1 },
  { key: 'p3', kind: 'older-walk-up', name: 'The Ostler Building', addressLine1: '7 Tinsmith Lane', postalCode: '01009', builtYear: 1962, primaryContractor: 0 },
];

/** Model codes are free text on a data plate; these are invented, per style. */
export const MODEL_CODES: Record<ApplianceStyle, readonly string[]> = {
  'top-freezer': ['TF-180W', 'TF-214S', 'TF-160E'],
  'bottom-freezer': ['BF-221X', 'BF-248N', 'BF-196C'],
  'side-by-side': ['SX-262P', 'SX-255T'],
  'fresh-food-only': ['RO-110K'],
  'upright-freezer': ['UF-140D', 'UF-172H'],
  'chest-freezer': ['CF-070M', 'CF-090A'],
};

export interface PersonBlueprint {
  displayName: string;
  email: string;
  phone: string;
}

/** Tenants besides the demo tenant: invited, not yet signed up (no password). */
export const OTHER_TENANTS: readonly PersonBlueprint[] = [
  { displayName: 'Amara Quillon', email: 'amara.quillon@example.com', phone: '555-0121' },
  { displayName: 'Teodor Brask', email: 'teodor.brask@example.com', phone: '555-0124' },
  { displayName: 'Wren Hollister', email: 'wren.hollister@example.com', phone: '555-0127' },
  { displayName: 'Ines Marlowe', email: 'ines.marlowe@example.com', phone: '555-0131' },
  { displayName: 'Obi Castellan', email: 'obi.castellan@example.com', phone: '555-0135' },
];

/** Parts a household-refrigeration technician carries, with invented but typical prices (cents). */
export const PARTS = {
  evaporatorFanMotor: { name: 'Evaporator fan motor', unitCostCents: 6_850 },
  condenserFanMotor: { name: 'Condenser fan motor', unitCostCents: 5_920 },
  coilCleaning: { name: 'Condenser coil brush and cleaner', unitCostCents: 1_450 },
  startRelay: { name: 'Compressor start relay', unitCostCents: 3_480 },
  overload: { name: 'Compressor overload protector', unitCostCents: 2_690 },
  defrostHeater: { name: 'Defrost heater', unitCostCents: 4_710 },
  defrostTerminator: { name: 'Defrost termination thermostat', unitCostCents: 2_230 },
  damperControl: { name: 'Air damper control assembly', unitCostCents: 7_360 },
} as const;

/** Hourly labour rates of the two companies (cents), invented. */
export const HOURLY_RATE_CENTS: readonly [number, number] = [11_500, 12_800];

/**
 * The demo company's own settings (a manager can change them on the settings page). Its
 * dispatch hold is longer than the default 45 minutes: in the simulator, the appliances of
 * a townhouse row cut off from power conclude their findings over about two hours (freezers
 * first, chest freezers last), and a unit's trouble should wait for its neighbours' before
 * a technician goes to each door (measured in the storyline run; the figure is ours).
 *
 * Its urgent jobs pass to the backup contractor after four hours unaccepted instead of 30
 * minutes, so a visitor has time to sign in as the primary contractor and take the job.
 */
export const DEMO_ORG_SETTINGS = { dispatchHoldMinutes: 150, escalateAfterMinutes: 240 } as const;
