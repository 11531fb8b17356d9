import { randomBytes } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { Page, PairSensorRequest, SensorChange, SensorCredentials, SensorQuery, SensorView } from '../../shared/api/inventory';
import type { Actor } from '../auth/actor';
import { conflict, notFound } from '../errors';
import { generateDeviceSecret, hashDeviceSecret } from '../telemetry/device-secret';
import { SENSOR_SELECT, toSensorView, type SensorRow } from './appliance-views';
import { archiveCondition, containsPattern, isUniqueViolation, organizationOf } from './inventory-support';

const SORT_COLUMNS: Record<SensorQuery['sort'], string> = {
  deviceId: 's.device_id',
  lastSeenAt: 's.last_seen_at',
  createdAt: 's.created_at',
};

/** Made-up device ids look like the simulator's: "cw-" and 12 hex digits (48 random bits). */
export function newDeviceId(): string {
  return `cw-${randomBytes(6).toString('hex')}`;
}

/**
 * Sensors of the organization's appliances. Pairing registers a sensor with a fresh secret
 * that is returned once and stored only as a hash (server/telemetry/device-secret.ts); the
 * broker checks the sensor table at every connect, so an archived sensor or a new secret
 * takes effect at the device's next connection.
 */
export class SensorsService {
  constructor(private readonly dataSource: DataSource) {}

  async list(actor: Actor, query: SensorQuery): Promise<Page<SensorView>> {
    const organizationId = organizationOf(actor);
    const params: unknown[] = [organizationId];
    let where = `p.organization_id = $1 AND ${archiveCondition('s.archived_at', query.status)}`;
    if (query.q) {
      params.push(containsPattern(query.q));
      where += ` AND (s.device_id ILIKE $2 OR u.label ILIKE $2 OR p.name ILIKE $2)`;
    }
    const direction = query.direction === 'asc' ? 'ASC' : 'DESC';
    const [{ total }] = await this.dataSource.query(`SELECT count(*)::int AS total FROM (${SENSOR_SELECT} WHERE ${where}) matched`, params);
    const rows: SensorRow[] = await this.dataSource.query(
      `${SENSOR_SELECT} WHERE ${where} ORDER BY ${SORT_COLUMNS[query.sort]} ${direction} NULLS LAST, s.id
       LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      params,
    );
    return { items: rows.map(toSensorView), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, sensorId: string): Promise<SensorView> {
    return this.view(this.dataSource.manager, organizationOf(actor), sensorId);
  }

  async pair(actor: Actor, applianceId: string, request: PairSensorRequest): Promise<SensorCredentials> {
    const organizationId = organizationOf(actor);
    const secret = generateDeviceSecret();
    const secretHash = await hashDeviceSecret(secret);
    const deviceId = request.deviceId ?? newDeviceId();
    return this.dataSource.transaction(async (manager) => {
      const current = await this.requireActiveAppliance(manager, organizationId, applianceId);
      if (current && !request.replace) throw conflict(`the appliance already has sensor ${current}: replace it, or archive or move it first`);
      if (current) await manager.query(`UPDATE sensor SET archived_at = now() WHERE appliance_id = $1 AND archived_at IS NULL`, [applianceId]);
      const [row] = await this.uniqueDevice(deviceId, () =>
        manager.query(`INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds) VALUES ($1, $2, $3, $4) RETURNING id`, [
          deviceId,
          applianceId,
          secretHash,
          request.intervalSeconds,
        ]),
      );
      const sensor = await this.view(manager, organizationId, row.id);
      return { sensor, deviceId, secret };
    });
  }

  /** A new secret replaces the old one at once; the device must be given it before it reconnects. */
  async newSecret(actor: Actor, sensorId: string): Promise<SensorCredentials> {
    const organizationId = organizationOf(actor);
    const secret = generateDeviceSecret();
    const secretHash = await hashDeviceSecret(secret);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, sensorId, true);
      if (current.archivedAt) throw conflict('the sensor is archived');
      await manager.query(`UPDATE sensor SET secret_hash = $2 WHERE id = $1`, [sensorId, secretHash]);
      return { sensor: await this.view(manager, organizationId, sensorId), deviceId: current.deviceId, secret };
    });
  }

  /** Moves the sensor to another appliance of the organization, or changes its reporting interval. */
  async change(actor: Actor, sensorId: string, change: SensorChange): Promise<SensorView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, sensorId, true);
      if (current.archivedAt) throw conflict('the sensor is archived');
      if (change.applianceId && change.applianceId !== current.applianceId) {
        await this.requireFreeAppliance(manager, organizationId, change.applianceId);
        await manager.query(`UPDATE sensor SET appliance_id = $2 WHERE id = $1`, [sensorId, change.applianceId]);
      }
      if (change.intervalSeconds !== undefined) await manager.query(`UPDATE sensor SET interval_seconds = $2 WHERE id = $1`, [sensorId, change.intervalSeconds]);
      return this.view(manager, organizationId, sensorId);
    });
  }

  /** Retires the sensor: the broker refuses it from its next connection; its readings stay. */
  async archive(actor: Actor, sensorId: string): Promise<SensorView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      await this.view(manager, organizationId, sensorId, true);
      await manager.query(`UPDATE sensor SET archived_at = now() WHERE id = $1 AND archived_at IS NULL`, [sensorId]);
      return this.view(manager, organizationId, sensorId);
    });
  }

  /** Brings a retired sensor back, with its old secret, if its appliance is active and has no other sensor. */
  async restore(actor: Actor, sensorId: string): Promise<SensorView> {
    const organizationId = organizationOf(actor);
    return this.dataSource.transaction(async (manager) => {
      const current = await this.view(manager, organizationId, sensorId, true);
      if (current.archivedAt) {
        await this.requireFreeAppliance(manager, organizationId, current.applianceId);
        await manager.query(`UPDATE sensor SET archived_at = NULL WHERE id = $1`, [sensorId]);
      }
      return this.view(manager, organizationId, sensorId);
    });
  }

  private async view(manager: EntityManager, organizationId: string, sensorId: string, lock = false): Promise<SensorView> {
    if (lock) await manager.query(`SELECT id FROM sensor WHERE id = $1 FOR UPDATE`, [sensorId]);
    const [row] = await manager.query(`${SENSOR_SELECT} WHERE s.id = $1 AND p.organization_id = $2`, [sensorId, organizationId]);
    if (!row) throw notFound('sensor');
    return toSensorView(row);
  }

  /** An active appliance of the organization, locked; answers the device id of its active sensor, if any. */
  private async requireActiveAppliance(manager: EntityManager, organizationId: string, applianceId: string): Promise<string | null> {
    const [row] = await manager.query(
      `SELECT a.archived_at, (SELECT device_id FROM sensor WHERE appliance_id = a.id AND archived_at IS NULL LIMIT 1) AS paired_device
         FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
        WHERE a.id = $1 AND p.organization_id = $2 FOR UPDATE OF a`,
      [applianceId, organizationId],
    );
    if (!row) throw notFound('appliance');
    if (row.archived_at) throw conflict('the appliance is archived');
    return row.paired_device;
  }

  /** One sensor carries both probes: an appliance takes a second only after the first is archived or moved. */
  private async requireFreeAppliance(manager: EntityManager, organizationId: string, applianceId: string): Promise<void> {
    const paired = await this.requireActiveAppliance(manager, organizationId, applianceId);
    if (paired) throw conflict(`the appliance already has sensor ${paired}: archive or move it first`);
  }

  private async uniqueDevice<T>(deviceId: string, write: () => Promise<T>): Promise<T> {
    try {
      return await write();
    } catch (error) {
      if (isUniqueViolation(error, 'sensor_device_id_key')) throw conflict(`device id ${deviceId} is already registered`);
      throw error;
    }
  }
}
