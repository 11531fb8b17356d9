import type { World } from '../../auth/support/world';
import { upload } from './inventory-world';

/**
 * The inventory's rows of the access matrix (spec/auth/access-matrix.spec.ts). The matrix
 * calls every route once per caller, in route-table order, on one database, so each case
 * must answer the same for every caller the rules let through: archive is followed by
 * restore, pairing replaces, creates take a fresh name each time and a deletion takes the
 * next file of a pool.
 */
export interface InventoryMatrixCase {
  params?: Record<string, string>;
  body?: unknown;
  target?: { organizationId: string; unitId?: string };
  ok: number;
}

export interface InventoryMatrixSeed {
  organizationId: string;
  propertyId: string;
  unitId: string;
  applianceId: string;
  sensorId: string;
  importId: string;
  loggerFileId: string;
  attachApplianceId: string;
  deletableLoggerFileIds: string[];
}

const LOGGER_CSV = 'timestamp,fresh_food_c,freezer_c\n2026-01-05T00:00:00Z,3.1,-18.2\n2026-01-05T00:05:00Z,3.2,-18.1\n';
/** One more file than there are callers in the matrix. */
const DELETABLE_FILES = 9;

async function one(world: World, sql: string, params: unknown[]): Promise<string> {
  const [row] = await world.db.dataSource.query(sql, params);
  return row.id;
}

/** Records of org 1 that only the matrix uses, so its archives and deletions touch nothing else. */
export async function seedInventoryMatrix(world: World): Promise<InventoryMatrixSeed> {
  const organizationId = world.fixtures.org1.id;
  const propertyId = await one(world, `INSERT INTO property (organization_id, name, address_line1, city, time_zone) VALUES ($1, 'Matrix Mews', '3 Example Row', 'Springfield', 'America/Chicago') RETURNING id`, [organizationId]);
  const unitId = await one(world, `INSERT INTO unit (property_id, label) VALUES ($1, 'M1') RETURNING id`, [propertyId]);
  const appliance = () => one(world, `INSERT INTO appliance (unit_id, style) VALUES ($1, 'top-freezer') RETURNING id`, [unitId]);
  const applianceId = await appliance();
  const sensorApplianceId = await appliance();
  const attachApplianceId = await appliance();
  const sensorId = await one(world, `INSERT INTO sensor (device_id, appliance_id, secret_hash) VALUES ('matrix-sensor', $1, 'scrypt$1024$8$1$AAAA$AAAA') RETURNING id`, [sensorApplianceId]);
  const manager = await world.signedIn('managerOrg1');
  const imported = await upload(manager, '/api/inventory/import', { name: 'matrix.csv', content: 'property_name,address_line1,city,time_zone\nMatrix Import,4 Example Row,Springfield,America/Chicago\n' });
  const logger = await upload(manager, '/api/logger-files', { name: 'matrix.csv', content: LOGGER_CSV });
  const deletableLoggerFileIds: string[] = [];
  for (let i = 0; i < DELETABLE_FILES; i++) {
    deletableLoggerFileIds.push(
      await one(
        world,
        `INSERT INTO logger_file (organization_id, file_name, size_bytes, content_sha256, content, style, readings, analysis, chart)
         SELECT organization_id, file_name, size_bytes, content_sha256 || $2, content, style, readings, analysis, chart FROM logger_file WHERE id = $1 RETURNING id`,
        [logger.body.id, `-copy-${i}`],
      ),
    );
  }
  return { organizationId, propertyId, unitId, applianceId, sensorId, importId: imported.body.id, loggerFileId: logger.body.id, attachApplianceId, deletableLoggerFileIds };
}

export function inventoryMatrixCases(seed: InventoryMatrixSeed): Record<string, InventoryMatrixCase> {
  const target = { organizationId: seed.organizationId };
  const property = { params: { propertyId: seed.propertyId }, target };
  const unit = { params: { unitId: seed.unitId }, target };
  const appliance = { params: { applianceId: seed.applianceId }, target };
  const sensor = { params: { sensorId: seed.sensorId }, target };
  let created = 0;
  let deleted = 0;
  return {
    'GET /api/inventory/properties': { ok: 200 },
    'POST /api/inventory/properties': {
      get body() {
        return { name: `Matrix Property ${++created}`, addressLine1: '5 Example Row', city: 'Springfield', timeZone: 'America/Chicago' };
      },
      ok: 201,
    },
    'GET /api/inventory/properties/:propertyId': { ...property, ok: 200 },
    'PATCH /api/inventory/properties/:propertyId': { ...property, body: { region: 'IL' }, ok: 200 },
    'POST /api/inventory/properties/:propertyId/archive': { ...property, ok: 200 },
    'POST /api/inventory/properties/:propertyId/restore': { ...property, ok: 200 },
    'GET /api/inventory/properties/:propertyId/units': { ...property, ok: 200 },
    'POST /api/inventory/properties/:propertyId/units': {
      ...property,
      get body() {
        return { label: `MX${++created}` };
      },
      ok: 201,
    },
    'GET /api/inventory/units/:unitId': { ...unit, ok: 200 },
    'PATCH /api/inventory/units/:unitId': { ...unit, body: { floor: 1 }, ok: 200 },
    'POST /api/inventory/units/:unitId/archive': { ...unit, ok: 200 },
    'POST /api/inventory/units/:unitId/restore': { ...unit, ok: 200 },
    'GET /api/inventory/appliances': { ok: 200 },
    'POST /api/inventory/appliances': { body: { unitId: seed.unitId, style: 'chest-freezer' }, target, ok: 201 },
    'GET /api/inventory/appliances/:applianceId': { ...appliance, ok: 200 },
    'PATCH /api/inventory/appliances/:applianceId': { ...appliance, body: { model: 'Matrix MX-1' }, ok: 200 },
    'POST /api/inventory/appliances/:applianceId/archive': { ...appliance, ok: 200 },
    'POST /api/inventory/appliances/:applianceId/restore': { ...appliance, ok: 200 },
    'POST /api/inventory/appliances/:applianceId/sensor': { ...appliance, body: { replace: true }, ok: 201 },
    'GET /api/inventory/sensors': { ok: 200 },
    'GET /api/inventory/sensors/:sensorId': { ...sensor, ok: 200 },
    'PATCH /api/inventory/sensors/:sensorId': { ...sensor, body: { intervalSeconds: 300 }, ok: 200 },
    'POST /api/inventory/sensors/:sensorId/secret': { ...sensor, ok: 200 },
    'POST /api/inventory/sensors/:sensorId/archive': { ...sensor, ok: 200 },
    'POST /api/inventory/sensors/:sensorId/restore': { ...sensor, ok: 200 },
    // The sensor's page shows its rejected messages (the telemetry routes call the id :id).
    'GET /api/sensors/:id/rejects': { params: { id: seed.sensorId }, target, ok: 200 },
    // The matrix sends JSON, not a file: a caller who gets through is told to choose one.
    'POST /api/inventory/import/preview': { ok: 400 },
    'POST /api/inventory/import': { ok: 400 },
    'GET /api/inventory/import/:importId': { params: { importId: seed.importId }, target, ok: 200 },
    'GET /api/logger-files': { ok: 200 },
    'POST /api/logger-files': { ok: 400 },
    'GET /api/logger-files/:loggerFileId': { params: { loggerFileId: seed.loggerFileId }, target, ok: 200 },
    'DELETE /api/logger-files/:loggerFileId': {
      get params() {
        return { loggerFileId: seed.deletableLoggerFileIds[Math.min(deleted++, seed.deletableLoggerFileIds.length - 1)] };
      },
      target,
      ok: 204,
    },
    'POST /api/logger-files/:loggerFileId/attach': { params: { loggerFileId: seed.loggerFileId }, body: { applianceId: seed.attachApplianceId }, target, ok: 200 },
    'GET /api/settings/detection': { ok: 200 },
    'PUT /api/settings/detection/:style': { params: { style: 'top-freezer' }, body: { freshOverTempGraceMinutes: 60 }, ok: 200 },
    'DELETE /api/settings/detection/:style': { params: { style: 'top-freezer' }, ok: 200 },
  };
}
