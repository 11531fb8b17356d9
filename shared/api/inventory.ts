/**
 * Inventory contracts shared by client and server: properties, units, appliances, sensors
 * (with pairing) and the CSV import. The server validates every request with these schemas.
 */
import { z } from 'zod';
import { APPLIANCE_STYLES, type ApplianceStyle } from '../domain';
import { DEVICE_ID_PATTERN } from '../telemetry';

export type { Page } from './users';

export const ARCHIVE_FILTERS = ['active', 'archived', 'all'] as const;
export type ArchiveFilter = (typeof ARCHIVE_FILTERS)[number];

export const ApplianceStyleSchema = z.enum(APPLIANCE_STYLES, 'choose one of the appliance styles');

/** The IANA name as the runtime spells it (e.g. "america/chicago" → "America/Chicago"), or null. */
export function canonicalTimeZone(name: string): string | null {
  if (!name.trim()) return null;
  try {
    return new Intl.DateTimeFormat('en-US', { timeZone: name.trim() }).resolvedOptions().timeZone;
  } catch {
    return null;
  }
}

export const TimeZoneSchema = z
  .string()
  .trim()
  .transform((name, context) => {
    const canonical = canonicalTimeZone(name);
    if (!canonical) context.addIssue({ code: 'custom', message: 'not a time zone: use an IANA name such as America/Chicago' });
    return canonical ?? name;
  });

/** A calendar date, YYYY-MM-DD, that exists. */
export const CalendarDateSchema = z.iso.date('use a date like 2024-03-31');

const text = (max: number, what: string) => z.string().trim().max(max, `${what} has at most ${max} characters`);
const required = (max: number, what: string) => text(max, what).min(1, `enter the ${what}`);

const ListQuery = {
  q: z.string().trim().max(100).optional(),
  status: z.enum(ARCHIVE_FILTERS).default('active'),
  direction: z.enum(['asc', 'desc']).default('asc'),
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(200).default(25),
};

// ---- properties -------------------------------------------------------------------------

const CountrySchema = z
  .string()
  .trim()
  .toUpperCase()
  .regex(/^[A-Z]{2}$/, 'use the two-letter country code, e.g. US');

export const PropertyFields = {
  name: required(120, 'property name'),
  addressLine1: required(200, 'street address'),
  addressLine2: text(200, 'second address line').nullable().optional(),
  city: required(100, 'city'),
  region: text(100, 'state or region').default(''),
  postalCode: text(20, 'postal code').default(''),
  country: CountrySchema.default('US'),
  timeZone: TimeZoneSchema,
};

export const PropertyInput = z.object(PropertyFields).strict();
export type PropertyInput = z.infer<typeof PropertyInput>;
export type PropertyInputFields = z.input<typeof PropertyInput>;

export const PropertyChange = z
  .object({
    name: PropertyFields.name,
    addressLine1: PropertyFields.addressLine1,
    addressLine2: PropertyFields.addressLine2,
    city: PropertyFields.city,
    region: text(100, 'state or region'),
    postalCode: text(20, 'postal code'),
    country: CountrySchema,
    timeZone: PropertyFields.timeZone,
  })
  .partial()
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type PropertyChange = z.infer<typeof PropertyChange>;

export const PROPERTY_SORTS = ['name', 'city', 'createdAt'] as const;
export const PropertyQuery = z.object({ ...ListQuery, sort: z.enum(PROPERTY_SORTS).default('name') });
export type PropertyQuery = z.infer<typeof PropertyQuery>;
export type PropertyQueryInput = z.input<typeof PropertyQuery>;

export interface PropertyView {
  id: string;
  name: string;
  addressLine1: string;
  addressLine2: string | null;
  city: string;
  region: string;
  postalCode: string;
  country: string;
  timeZone: string;
  archivedAt: string | null;
  createdAt: string;
  unitCount: number;
  applianceCount: number;
  sensorCount: number;
}

export const PropertyIdParams = z.object({ propertyId: z.uuid('not a property id') });

// ---- units ------------------------------------------------------------------------------

export const UnitInput = z
  .object({
    label: required(40, 'unit label'),
    floor: z.number().int('the floor is a whole number').min(-10).max(300).nullable().optional(),
  })
  .strict();
export type UnitInput = z.infer<typeof UnitInput>;

export const UnitChange = UnitInput.partial()
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type UnitChange = z.infer<typeof UnitChange>;

export const UNIT_SORTS = ['label', 'floor', 'createdAt'] as const;
export const UnitQuery = z.object({ ...ListQuery, sort: z.enum(UNIT_SORTS).default('label') });
export type UnitQuery = z.infer<typeof UnitQuery>;
export type UnitQueryInput = z.input<typeof UnitQuery>;

export interface UnitView {
  id: string;
  propertyId: string;
  label: string;
  floor: number | null;
  archivedAt: string | null;
  createdAt: string;
  appliances: ApplianceView[];
}

export const UnitIdParams = z.object({ unitId: z.uuid('not a unit id') });

// ---- appliances -------------------------------------------------------------------------

const ApplianceFields = {
  unitId: z.uuid('choose the unit'),
  style: ApplianceStyleSchema,
  model: text(120, 'model').default(''),
  serial: text(120, 'serial number').default(''),
  installedOn: CalendarDateSchema.nullable().optional(),
  warrantyEndsOn: CalendarDateSchema.nullable().optional(),
};

/** ISO dates compare correctly as strings. */
export function warrantyBeforeInstall(installedOn: string | null | undefined, warrantyEndsOn: string | null | undefined): boolean {
  return !!installedOn && !!warrantyEndsOn && warrantyEndsOn < installedOn;
}

const WARRANTY_ORDER = { message: 'the warranty cannot end before the install date', path: ['warrantyEndsOn'] };

export const ApplianceInput = z
  .object(ApplianceFields)
  .strict()
  .refine((a) => !warrantyBeforeInstall(a.installedOn, a.warrantyEndsOn), WARRANTY_ORDER);
export type ApplianceInput = z.infer<typeof ApplianceInput>;
export type ApplianceInputFields = z.input<typeof ApplianceInput>;

export const ApplianceChange = z
  .object({ ...ApplianceFields, model: text(120, 'model'), serial: text(120, 'serial number') })
  .partial()
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change')
  .refine((a) => !warrantyBeforeInstall(a.installedOn, a.warrantyEndsOn), WARRANTY_ORDER);
export type ApplianceChange = z.infer<typeof ApplianceChange>;

export const APPLIANCE_SORTS = ['property', 'unit', 'style', 'installedOn', 'createdAt'] as const;
export const ApplianceQuery = z.object({
  ...ListQuery,
  propertyId: z.uuid().optional(),
  style: ApplianceStyleSchema.optional(),
  sort: z.enum(APPLIANCE_SORTS).default('property'),
});
export type ApplianceQuery = z.infer<typeof ApplianceQuery>;
export type ApplianceQueryInput = z.input<typeof ApplianceQuery>;

export interface SensorBrief {
  id: string;
  deviceId: string;
  intervalSeconds: number;
  lastSeenAt: string | null;
}

export interface ApplianceView {
  id: string;
  unitId: string;
  unitLabel: string;
  propertyId: string;
  propertyName: string;
  style: ApplianceStyle;
  model: string;
  serial: string;
  installedOn: string | null;
  warrantyEndsOn: string | null;
  archivedAt: string | null;
  createdAt: string;
  /** The active sensor paired to it, if any. */
  sensor: SensorBrief | null;
}

export const ApplianceIdParams = z.object({ applianceId: z.uuid('not an appliance id') });

// ---- sensors ----------------------------------------------------------------------------

/** How often a sensor may report: from every 10 s to every hour (a 5-minute default). */
export const SENSOR_INTERVAL_MIN_SECONDS = 10;
export const SENSOR_INTERVAL_MAX_SECONDS = 3600;
export const SENSOR_INTERVAL_DEFAULT_SECONDS = 300;

const IntervalSchema = z
  .number()
  .int('a whole number of seconds')
  .min(SENSOR_INTERVAL_MIN_SECONDS, `at least ${SENSOR_INTERVAL_MIN_SECONDS} seconds`)
  .max(SENSOR_INTERVAL_MAX_SECONDS, `at most ${SENSOR_INTERVAL_MAX_SECONDS} seconds`);

export const DeviceIdSchema = z
  .string()
  .trim()
  .regex(DEVICE_ID_PATTERN, '3 to 48 letters, digits, "-" or "_", starting with a letter or digit');

/**
 * `POST /api/inventory/appliances/:applianceId/sensor`: without a device id, one is made up.
 * An appliance carries one sensor; `replace` retires the current one (a broken sensor swapped).
 */
export const PairSensorRequest = z
  .object({
    deviceId: DeviceIdSchema.optional(),
    intervalSeconds: IntervalSchema.default(SENSOR_INTERVAL_DEFAULT_SECONDS),
    replace: z.boolean().default(false),
  })
  .strict();
export type PairSensorRequest = z.infer<typeof PairSensorRequest>;
export type PairSensorFields = z.input<typeof PairSensorRequest>;

export const SensorChange = z
  .object({ applianceId: z.uuid('choose the appliance'), intervalSeconds: IntervalSchema })
  .partial()
  .strict()
  .refine((change) => Object.keys(change).length > 0, 'nothing to change');
export type SensorChange = z.infer<typeof SensorChange>;

export const SENSOR_SORTS = ['deviceId', 'lastSeenAt', 'createdAt'] as const;
export const SensorQuery = z.object({ ...ListQuery, sort: z.enum(SENSOR_SORTS).default('deviceId') });
export type SensorQuery = z.infer<typeof SensorQuery>;
export type SensorQueryInput = z.input<typeof SensorQuery>;

export interface SensorView extends SensorBrief {
  /** When the ingest last stored a reading of it; `lastSeenAt` is that reading's own time. */
  lastHeardAt: string | null;
  applianceId: string;
  style: ApplianceStyle;
  unitLabel: string;
  propertyName: string;
  archivedAt: string | null;
  createdAt: string;
}

/** The answer to pairing or a new secret: the secret is shown this once and never stored. */
export interface SensorCredentials {
  sensor: SensorView;
  deviceId: string;
  secret: string;
}

export const SensorIdParams = z.object({ sensorId: z.uuid('not a sensor id') });

// ---- CSV import -------------------------------------------------------------------------

/**
 * The import file: one row per appliance (or per unit, or per property, with the later
 * columns empty). Properties are matched by name and units by label within the
 * organization, so a file may add appliances to buildings that already exist.
 */
export const IMPORT_COLUMNS = [
  'property_name',
  'address_line1',
  'address_line2',
  'city',
  'region',
  'postal_code',
  'country',
  'time_zone',
  'unit_label',
  'floor',
  'appliance_style',
  'model',
  'serial',
  'installed_on',
  'warranty_ends_on',
] as const;
export type ImportColumn = (typeof IMPORT_COLUMNS)[number];

export const IMPORT_REQUIRED_COLUMNS: readonly ImportColumn[] = ['property_name'];
export const IMPORT_MAX_ROWS = 5000;
export const IMPORT_MAX_BYTES = 2 * 1024 * 1024;

export interface ImportRowError {
  /** The line of the file, counting the header as line 1; null for the file as a whole. */
  line: number | null;
  column: ImportColumn | null;
  message: string;
}

export type ImportAction = 'create' | 'existing' | 'none';

/** One data row as the import will treat it. */
export interface ImportPreviewRow {
  line: number;
  propertyName: string;
  property: ImportAction;
  unitLabel: string;
  unit: ImportAction;
  style: ApplianceStyle | null;
  model: string;
  serial: string;
  appliance: ImportAction;
}

export interface ImportCounts {
  properties: number;
  units: number;
  appliances: number;
}

export interface ImportPreview {
  fileName: string;
  rows: number;
  /** What would be created; existing records are reused, never changed. */
  create: ImportCounts;
  existing: ImportCounts;
  errors: ImportRowError[];
  /** The first rows, so the manager sees how the columns were read. */
  sample: ImportPreviewRow[];
  ok: boolean;
}

export const IMPORT_STATES = ['running', 'done', 'failed'] as const;
export type ImportState = (typeof IMPORT_STATES)[number];

export interface ImportJob {
  id: string;
  fileName: string;
  state: ImportState;
  /** Rows written so far, of total; nothing is kept unless the state reaches `done`. */
  processed: number;
  total: number;
  created: ImportCounts | null;
  error: string | null;
  startedAt: string;
  finishedAt: string | null;
}

export const ImportIdParams = z.object({ importId: z.uuid('not an import id') });
