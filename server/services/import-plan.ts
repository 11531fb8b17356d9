import {
  ApplianceStyleSchema,
  CalendarDateSchema,
  PropertyInput,
  UnitInput,
  warrantyBeforeInstall,
  type ImportAction,
  type ImportColumn,
  type ImportCounts,
  type ImportPreviewRow,
  type ImportRowError,
} from '../../shared/api/inventory';
import type { ApplianceStyle } from '../../shared/domain';
import type { ImportRow } from './import-csv';

/** What the organization already has, as the import matches it. */
export interface InventorySnapshot {
  /** Active properties by lower-cased name. */
  properties: Map<string, { id: string; name: string }>;
  /** Units of those properties by unitKey(propertyId, label), archived ones included. */
  units: Map<string, { id: string; archived: boolean }>;
  /** Active appliances with a serial, by serialKey(unitId, serial). */
  serials: Set<string>;
}

export const unitKey = (propertyKey: string, label: string) => `${propertyKey}\u0000${label}`;
export const serialKey = (unitKey: string, serial: string) => `${unitKey}\u0000${serial.toLowerCase()}`;

export interface NewProperty {
  key: string;
  input: PropertyInput;
}

export interface NewUnit {
  key: string;
  propertyKey: string;
  label: string;
  floor: number | null;
}

export interface NewAppliance {
  unitKey: string;
  style: ApplianceStyle;
  model: string;
  serial: string;
  installedOn: string | null;
  warrantyEndsOn: string | null;
}

/** Everything the import would write; existing ids are looked up by key when writing. */
export interface ImportPlan {
  properties: NewProperty[];
  units: NewUnit[];
  appliances: NewAppliance[];
  existingPropertyIds: Map<string, string>;
  existingUnitIds: Map<string, string>;
  existing: ImportCounts;
  rows: ImportPreviewRow[];
  errors: ImportRowError[];
}

const PROPERTY_COLUMNS: Record<string, ImportColumn> = {
  name: 'property_name',
  addressLine1: 'address_line1',
  addressLine2: 'address_line2',
  city: 'city',
  region: 'region',
  postalCode: 'postal_code',
  country: 'country',
  timeZone: 'time_zone',
};
const ADDRESS_COLUMNS = ['address_line1', 'address_line2', 'city', 'region', 'postal_code', 'country', 'time_zone'] as const;
const APPLIANCE_COLUMNS = ['model', 'serial', 'installed_on', 'warranty_ends_on'] as const;

/** "Top freezer", "TOP_FREEZER" and "top-freezer" are one style. */
function normaliseStyle(text: string): string {
  return text.trim().toLowerCase().replace(/[\s_]+/g, '-');
}

class RowChecker {
  readonly errors: ImportRowError[] = [];

  constructor(private readonly row: ImportRow) {}

  fail(column: ImportColumn | null, message: string): void {
    this.errors.push({ line: this.row.line, column, message });
  }

  cell(column: ImportColumn): string {
    return this.row.cells[column];
  }
}

/** The first row of a new property defines it; the columns are checked with the API's own schema. */
function readNewProperty(check: RowChecker): PropertyInput | null {
  const candidate = {
    name: check.cell('property_name'),
    addressLine1: check.cell('address_line1'),
    addressLine2: check.cell('address_line2') || null,
    city: check.cell('city'),
    region: check.cell('region'),
    postalCode: check.cell('postal_code'),
    country: check.cell('country') || 'US',
    timeZone: check.cell('time_zone'),
  };
  const parsed = PropertyInput.safeParse(candidate);
  if (parsed.success) return parsed.data;
  for (const issue of parsed.error.issues) check.fail(PROPERTY_COLUMNS[String(issue.path[0])] ?? null, `new property: ${issue.message}`);
  return null;
}

function readDate(check: RowChecker, column: 'installed_on' | 'warranty_ends_on'): string | null {
  const text = check.cell(column);
  if (!text) return null;
  const parsed = CalendarDateSchema.safeParse(text);
  if (parsed.success) return parsed.data;
  check.fail(column, `"${text}" is not a date: use YYYY-MM-DD`);
  return null;
}

function readAppliance(check: RowChecker, todayIso: string): Omit<NewAppliance, 'unitKey'> | null {
  const styleText = check.cell('appliance_style');
  if (!styleText) {
    const stray = APPLIANCE_COLUMNS.find((column) => check.cell(column));
    if (stray) check.fail('appliance_style', `${stray} is filled in but appliance_style is empty`);
    return null;
  }
  const style = ApplianceStyleSchema.safeParse(normaliseStyle(styleText));
  if (!style.success) check.fail('appliance_style', `"${styleText}" is not a style: use one of ${ApplianceStyleSchema.options.join(', ')}`);
  const installedOn = readDate(check, 'installed_on');
  const warrantyEndsOn = readDate(check, 'warranty_ends_on');
  if (installedOn && installedOn > todayIso) check.fail('installed_on', 'the install date is in the future');
  if (warrantyBeforeInstall(installedOn, warrantyEndsOn)) check.fail('warranty_ends_on', 'the warranty cannot end before the install date');
  for (const column of ['model', 'serial'] as const) if (check.cell(column).length > 120) check.fail(column, `${column} has at most 120 characters`);
  if (!style.success) return null;
  return { style: style.data, model: check.cell('model'), serial: check.cell('serial'), installedOn, warrantyEndsOn };
}

function readUnit(check: RowChecker): { label: string; floor: number | null } | null {
  const label = check.cell('unit_label');
  if (!label) {
    if (check.cell('floor')) check.fail('unit_label', 'floor is filled in but unit_label is empty');
    return null;
  }
  const floorText = check.cell('floor');
  const floor = floorText ? Number(floorText) : null;
  const parsed = UnitInput.safeParse({ label, floor: floor !== null && Number.isFinite(floor) ? floor : floorText ? Number.NaN : null });
  if (parsed.success) return { label: parsed.data.label, floor: parsed.data.floor ?? null };
  for (const issue of parsed.error.issues) check.fail(issue.path[0] === 'floor' ? 'floor' : 'unit_label', issue.path[0] === 'floor' ? `floor "${floorText}" is not a whole number between -10 and 300` : issue.message);
  return null;
}

/**
 * Turns the rows into a plan against the organization's current inventory. Every problem
 * is reported with its line and column; a plan with errors is never written.
 */
export function planImport(rows: ImportRow[], snapshot: InventorySnapshot, todayIso: string): ImportPlan {
  const plan: ImportPlan = {
    properties: [],
    units: [],
    appliances: [],
    existingPropertyIds: new Map(),
    existingUnitIds: new Map(),
    existing: { properties: 0, units: 0, appliances: 0 },
    rows: [],
    errors: [],
  };
  const newProperties = new Map<string, { line: number; cells: ImportRow['cells'] }>();
  const newUnits = new Set<string>();
  const serialLines = new Map<string, number>();
  for (const row of rows) {
    const check = new RowChecker(row);
    if (row.extraCells) check.fail(null, 'the row has more cells than the header row');
    const name = check.cell('property_name');
    const propertyKey = name.toLowerCase();
    let property: ImportAction = 'none';
    if (!name) {
      check.fail('property_name', 'property_name is empty');
    } else if (snapshot.properties.has(propertyKey)) {
      property = 'existing';
      plan.existingPropertyIds.set(propertyKey, snapshot.properties.get(propertyKey)!.id);
    } else if (newProperties.has(propertyKey)) {
      property = 'create';
      const first = newProperties.get(propertyKey)!;
      for (const column of ADDRESS_COLUMNS) {
        if (row.cells[column] && row.cells[column] !== first.cells[column]) check.fail(column, `${column} differs from line ${first.line} for the same property; leave it empty or repeat it`);
      }
    } else {
      const input = readNewProperty(check);
      if (input) {
        property = 'create';
        newProperties.set(propertyKey, { line: row.line, cells: row.cells });
        plan.properties.push({ key: propertyKey, input });
      }
    }

    const unitInput = readUnit(check);
    let unit: ImportAction = 'none';
    const key = unitInput ? unitKey(propertyKey, unitInput.label) : '';
    if (unitInput && name) {
      const existingPropertyId = snapshot.properties.get(propertyKey)?.id;
      const existingUnit = existingPropertyId ? snapshot.units.get(unitKey(existingPropertyId, unitInput.label)) : undefined;
      if (existingUnit?.archived) {
        check.fail('unit_label', `unit "${unitInput.label}" of ${name} is archived: restore it in the inventory first`);
      } else if (existingUnit) {
        unit = 'existing';
        plan.existingUnitIds.set(key, existingUnit.id);
      } else if (newUnits.has(key)) {
        unit = 'create';
      } else {
        unit = 'create';
        newUnits.add(key);
        plan.units.push({ key, propertyKey, label: unitInput.label, floor: unitInput.floor });
      }
    }

    const appliance = readAppliance(check, todayIso);
    let applianceAction: ImportAction = 'none';
    if (appliance && !unitInput && !check.cell('unit_label')) check.fail('unit_label', 'an appliance needs the unit_label of the unit it stands in');
    if (appliance && unitInput) {
      const existingUnitId = plan.existingUnitIds.get(key);
      const serialSeen = appliance.serial ? serialLines.get(serialKey(key, appliance.serial)) : undefined;
      if (serialSeen !== undefined) {
        check.fail('serial', `serial ${appliance.serial} appears on line ${serialSeen} for the same unit`);
      } else if (appliance.serial && existingUnitId && snapshot.serials.has(serialKey(existingUnitId, appliance.serial))) {
        applianceAction = 'existing';
      } else {
        applianceAction = 'create';
        plan.appliances.push({ unitKey: key, ...appliance });
      }
      if (appliance.serial) serialLines.set(serialKey(key, appliance.serial), row.line);
    }
    plan.errors.push(...check.errors);
    plan.rows.push({
      line: row.line,
      propertyName: name,
      property,
      unitLabel: unitInput?.label ?? check.cell('unit_label'),
      unit,
      style: appliance?.style ?? null,
      model: check.cell('model'),
      serial: check.cell('serial'),
      appliance: applianceAction,
    });
  }
  plan.existing = {
    properties: plan.existingPropertyIds.size,
    units: plan.existingUnitIds.size,
    appliances: plan.rows.filter((row) => row.appliance === 'existing').length,
  };
  return plan;
}
