import type { QueryRunner } from 'typeorm';
import { generateDeviceSecret, hashDeviceSecret } from '../../server/telemetry/device-secret';
import { writeFleetFile } from '../../simulator/cli/fleet';
import type { SeedContext, SeedStep } from '../context';
import { DEMO_ORG_SETTINGS, DEMO_ORGANIZATION_NAME } from '../scenario/catalogue';
import { scenarioFleetFile } from '../scenario/faults';
import { appliancesOf, planScenario, SENSOR_INTERVAL_SECONDS, type PlannedProperty, type ScenarioPlan } from '../scenario/plan';

/**
 * The demo company's world: its properties, units, appliances with one sensor each, the
 * tenants other than the demo sign-in, and the simulator's fleet file. Deterministic from
 * the seed except the device secrets, which are random and live only in the git-ignored
 * fleet file and, hashed, in the database.
 *
 * Facts for later steps: plan, organizationId, propertyIds (by key), unitIds (by
 * `property/unit`), applianceIds and sensorIds (by appliance key), demoTenantUnitId,
 * primaryContractorByProperty, orgSettings, fleetFile.
 */
async function insertOne(runner: QueryRunner, sql: string, params: unknown[]): Promise<string> {
  const rows = (await runner.query(sql, params)) as { id: string }[];
  return rows[0].id;
}

interface Ids {
  propertyIds: Record<string, string>;
  unitIds: Record<string, string>;
  applianceIds: Record<string, string>;
  sensorIds: Record<string, string>;
}

async function insertProperty(runner: QueryRunner, organizationId: string, property: PlannedProperty, ids: Ids, hashes: Record<string, string>): Promise<void> {
  const propertyId = await insertOne(
    runner,
    `INSERT INTO property (organization_id, name, address_line1, city, region, postal_code, country, time_zone) VALUES ($1, $2, $3, $4, $5, $6, 'US', $7) RETURNING id`,
    [organizationId, property.name, property.addressLine1, property.city, property.region, property.postalCode, property.timeZone],
  );
  ids.propertyIds[property.key] = propertyId;
  for (const unit of property.units) {
    const unitId = await insertOne(runner, `INSERT INTO unit (property_id, label, floor) VALUES ($1, $2, $3) RETURNING id`, [propertyId, unit.label, unit.floor]);
    ids.unitIds[`${property.key}/${unit.label}`] = unitId;
    for (const appliance of unit.appliances) {
      const applianceId = await insertOne(
        runner,
        // In the inventory since its history starts: reports count an appliance from then.
        `INSERT INTO appliance (unit_id, style, model, serial, installed_on, warranty_ends_on, created_at) VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
        [unitId, appliance.style, appliance.model, appliance.serial, appliance.installedOn, appliance.warrantyEndsOn, new Date(appliance.monitoredFromMs)],
      );
      ids.applianceIds[appliance.key] = applianceId;
      ids.sensorIds[appliance.key] = await insertOne(
        runner,
        `INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds, created_at) VALUES ($1, $2, $3, $4, $5) RETURNING id`,
        [appliance.deviceId, applianceId, hashes[appliance.key], SENSOR_INTERVAL_SECONDS, new Date(appliance.monitoredFromMs)],
      );
    }
  }
}

async function insertTenants(runner: QueryRunner, organizationId: string, plan: ScenarioPlan, ids: Ids): Promise<void> {
  for (const tenant of plan.tenants) {
    await runner.query(
      `INSERT INTO app_user (email, display_name, role, organization_id, unit_id, phone, time_zone) VALUES ($1, $2, 'tenant', $3, $4, $5, $6)`,
      [tenant.email, tenant.displayName, organizationId, ids.unitIds[tenant.unitKey], tenant.phone, plan.properties[0].timeZone],
    );
  }
}

async function hashSecrets(secrets: Record<string, string>): Promise<Record<string, string>> {
  const entries = await Promise.all(Object.entries(secrets).map(async ([key, secret]) => [key, await hashDeviceSecret(secret)] as const));
  return Object.fromEntries(entries);
}

async function writeWorld(context: SeedContext, plan: ScenarioPlan, hashes: Record<string, string>): Promise<Ids & { organizationId: string }> {
  const runner = context.dataSource.createQueryRunner();
  await runner.startTransaction();
  try {
    const organizationId = await insertOne(runner, `INSERT INTO organization (name) VALUES ($1) RETURNING id`, [DEMO_ORGANIZATION_NAME]);
    const ids: Ids = { propertyIds: {}, unitIds: {}, applianceIds: {}, sensorIds: {} };
    for (const property of plan.properties) await insertProperty(runner, organizationId, property, ids, hashes);
    await insertTenants(runner, organizationId, plan, ids);
    await runner.commitTransaction();
    return { organizationId, ...ids };
  } catch (error) {
    await runner.rollbackTransaction();
    throw error;
  } finally {
    await runner.release();
  }
}

export const scenarioStep: SeedStep = {
  name: 'the demo company: properties, units, appliances, sensors, tenants and the simulator fleet file',
  async run(context: SeedContext): Promise<void> {
    const plan = planScenario(context.seed, context.nowMs, context.historyDays);
    const appliances = appliancesOf(plan);
    const secrets = Object.fromEntries(appliances.map((appliance) => [appliance.key, generateDeviceSecret()]));
    const ids = await writeWorld(context, plan, await hashSecrets(secrets));
    const primaryContractorByProperty = Object.fromEntries(plan.properties.map((property) => [ids.propertyIds[property.key], property.primaryContractor]));
    Object.assign(context.facts, { plan, ...ids, demoTenantUnitId: ids.unitIds[plan.demoTenantUnitKey], primaryContractorByProperty, orgSettings: DEMO_ORG_SETTINGS });
    context.facts.fleetFile = writeFleetFile(context.dataDir, scenarioFleetFile(plan, secrets, ids.applianceIds));
    const units = plan.properties.reduce((sum, property) => sum + property.units.length, 0);
    context.log(`${plan.properties.length} properties, ${units} units, ${appliances.length} appliances with sensors, ${plan.tenants.length} more tenants; fleet file ${context.facts.fleetFile}`);
  },
};
