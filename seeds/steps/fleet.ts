import type { QueryRunner } from 'typeorm';
import { generateDeviceSecret, hashDeviceSecret } from '../../server/telemetry/device-secret';
import { demoFaults, planFleet, writeFleetFile, type FleetDevice, type FleetFile, type FleetProperty } from '../../simulator/cli/fleet';
import type { SeedContext, SeedStep } from '../context';
import { DEMO_ORGANIZATION_NAME } from '../scenario/catalogue';

/**
 * A small fleet (specs of the simulator CLI use it; the demo itself is the scenario step,
 * seeds/steps/scenario.ts): one invented organization, two properties, three appliances each (every
 * style once), a sensor per appliance with its own secret, and the simulator's fleet file.
 * Deterministic from the seed except the secrets, which are random: they only live in
 * the git-ignored fleet file and, hashed, in the database.
 *
 * Facts for later steps: organizationId, propertyIds, unitIds and applianceIds (by
 * property key / device id), fleetFile.
 */
export { DEMO_ORGANIZATION_NAME };
const DEMO_PROPERTIES = 2;
const DEMO_APPLIANCES_PER_PROPERTY = 3;
const DEMO_INTERVAL_SECONDS = 300;

async function insertOne(runner: QueryRunner, sql: string, params: unknown[]): Promise<string> {
  const rows = (await runner.query(sql, params)) as { id: string }[];
  return rows[0].id;
}

async function insertProperty(runner: QueryRunner, organizationId: string, property: FleetProperty): Promise<string> {
  return insertOne(
    runner,
    `INSERT INTO property (organization_id, name, address_line1, city, region, postal_code, country, time_zone)
     VALUES ($1, $2, $3, $4, $5, $6, 'US', $7) RETURNING id`,
    [organizationId, property.name, property.addressLine1, property.city, property.region, property.postalCode, property.timeZone],
  );
}

async function insertAppliance(runner: QueryRunner, unitId: string, device: FleetDevice, index: number, nowMs: number): Promise<string> {
  const installedOn = new Date(nowMs - (400 + index * 290) * 86_400_000).toISOString().slice(0, 10);
  const warrantyEndsOn = new Date(Date.parse(installedOn) + 365 * 86_400_000).toISOString().slice(0, 10);
  return insertOne(
    runner,
    `INSERT INTO appliance (unit_id, style, model, serial, installed_on, warranty_ends_on) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    [unitId, device.style, device.model, `SN-${device.deviceId.slice(3).toUpperCase()}`, installedOn, warrantyEndsOn],
  );
}

async function registerFleet(runner: QueryRunner, organizationId: string, fleet: FleetFile, nowMs: number): Promise<Record<string, unknown>> {
  const propertyIds: Record<string, string> = {};
  const unitIds: Record<string, string> = {};
  const applianceIds: Record<string, string> = {};
  for (const property of fleet.properties) propertyIds[property.key] = await insertProperty(runner, organizationId, property);
  for (const [index, device] of fleet.devices.entries()) {
    const unitKey = `${device.propertyKey}/${device.unitLabel}`;
    unitIds[unitKey] ??= await insertOne(runner, `INSERT INTO unit (property_id, label, floor) VALUES ($1, $2, $3) RETURNING id`, [
      propertyIds[device.propertyKey],
      device.unitLabel,
      Number.parseInt(device.unitLabel, 10),
    ]);
    device.applianceId = await insertAppliance(runner, unitIds[unitKey], device, index, nowMs);
    applianceIds[device.deviceId] = device.applianceId;
    await runner.query(`INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds) VALUES ($1, $2, $3, $4)`, [
      device.deviceId,
      device.applianceId,
      await hashDeviceSecret(device.secret),
      device.intervalSeconds,
    ]);
  }
  return { propertyIds, unitIds, applianceIds };
}

export const fleetStep: SeedStep = {
  name: 'demo fleet: properties, units, appliances, sensors and the simulator fleet file',
  async run(context: SeedContext): Promise<void> {
    const fleet = planFleet({
      seed: context.seed,
      properties: DEMO_PROPERTIES,
      appliancesPerProperty: DEMO_APPLIANCES_PER_PROPERTY,
      intervalSeconds: DEMO_INTERVAL_SECONDS,
      newSecret: () => generateDeviceSecret(),
    });
    fleet.faults = demoFaults(fleet, context.nowMs);
    const runner = context.dataSource.createQueryRunner();
    await runner.startTransaction();
    try {
      const existing = context.facts.organizationId as string | undefined;
      const organizationId = existing ?? (await insertOne(runner, `INSERT INTO organization (name) VALUES ($1) RETURNING id`, [DEMO_ORGANIZATION_NAME]));
      const ids = await registerFleet(runner, organizationId, fleet, context.nowMs);
      await runner.commitTransaction();
      Object.assign(context.facts, { organizationId, ...ids });
    } catch (error) {
      await runner.rollbackTransaction();
      throw error;
    } finally {
      await runner.release();
    }
    context.facts.fleetFile = writeFleetFile(context.dataDir, fleet);
    context.log(`${fleet.devices.length} sensors in ${fleet.properties.length} properties; fleet file ${context.facts.fleetFile}`);
  },
};
