import type { Pool } from 'pg';
import type { DataSource } from 'typeorm';
import { probesOf, type ApplianceStyle } from '../../shared/domain';
import { PartitionManager } from '../ingest/partitions';
import { insertReadings, type StoredReading } from '../ingest/store';
import { conflict, notFound } from '../errors';
import { parseOrReject } from './logger-parse';

/** Rows per INSERT; the store writes a batch and its rollups in one statement. */
const ATTACH_BATCH = 5000;
/** A reading later than this past now is a logger with a wrong clock, not history. */
const FUTURE_SKEW_MS = 5 * 60_000;

export interface AttachOutcome {
  inserted: number;
  skippedInFuture: number;
}

/** The pg pool TypeORM already holds. */
function poolOf(dataSource: DataSource): Pool {
  return (dataSource.driver as unknown as { master: Pool }).master;
}

function requireAttachable(attachedApplianceId: string | null, applianceId: string): void {
  if (attachedApplianceId && attachedApplianceId !== applianceId) {
    throw conflict('the file is already attached to another appliance: a logger records one appliance');
  }
}

interface FileForAttach {
  content: string;
  attached_appliance_id: string | null;
}

/**
 * Writes a logger file's readings into an appliance's history through the ingest's store,
 * so the rollups and the history API include them. The readings carry the logger file's id
 * in place of a sensor id: that is the mark of an imported reading (no sensor has that id),
 * and with the store's (sensor_id, at) key it makes attaching the same file again write
 * nothing new. A file is attached to one appliance only.
 */
export class LoggerHistoryImporter {
  private readonly partitions: PartitionManager;

  constructor(
    private readonly dataSource: DataSource,
    private readonly nowMs: () => number = Date.now,
  ) {
    this.partitions = new PartitionManager(poolOf(dataSource));
  }

  async attach(organizationId: string, userId: string, loggerFileId: string, applianceId: string): Promise<AttachOutcome> {
    const file = await this.fileOf(organizationId, loggerFileId);
    const style = await this.applianceStyle(organizationId, applianceId);
    requireAttachable(file.attached_appliance_id, applianceId);
    const { readings, skippedInFuture } = this.readingsOf(file.content, loggerFileId, applianceId, style);
    // Partition DDL runs in its own transaction (PartitionManager), before ours.
    await this.partitions.ensureFor(poolOf(this.dataSource), readings.map((reading) => reading.atMs));
    const inserted = await this.write({ loggerFileId, applianceId, userId }, readings);
    return { inserted, skippedInFuture };
  }

  /** One transaction: the readings (duplicates skipped by the store's key) and the file's attachment. */
  private async write(target: { loggerFileId: string; applianceId: string; userId: string }, readings: StoredReading[]): Promise<number> {
    const client = await poolOf(this.dataSource).connect();
    try {
      await client.query('BEGIN');
      // Re-checked under a row lock: a concurrent attach to another appliance must not win silently.
      const { rows } = await client.query(`SELECT attached_appliance_id FROM logger_file WHERE id = $1 FOR UPDATE`, [target.loggerFileId]);
      requireAttachable(rows[0]?.attached_appliance_id ?? null, target.applianceId);
      let inserted = 0;
      for (let i = 0; i < readings.length; i += ATTACH_BATCH) inserted += await insertReadings(client, readings.slice(i, i + ATTACH_BATCH));
      await client.query(
        `UPDATE logger_file SET attached_appliance_id = $2, attached_at = coalesce(attached_at, now()),
                attached_by_user_id = coalesce(attached_by_user_id, $3), attached_readings = coalesce(attached_readings, 0) + $4
          WHERE id = $1`,
        [target.loggerFileId, target.applianceId, target.userId, inserted],
      );
      await client.query('COMMIT');
      return inserted;
    } catch (error) {
      await client.query('ROLLBACK').catch(() => undefined);
      throw error;
    } finally {
      client.release();
    }
  }

  /** Only the probes the appliance has; rows with neither value carry nothing to store. */
  private readingsOf(text: string, loggerFileId: string, applianceId: string, style: ApplianceStyle): { readings: StoredReading[]; skippedInFuture: number } {
    const { series } = parseOrReject(text);
    const probes = probesOf(style);
    const latestMs = this.nowMs() + FUTURE_SKEW_MS;
    const readings: StoredReading[] = [];
    let skippedInFuture = 0;
    for (let i = 0; i < series.atMs.length; i++) {
      const fresh = probes.includes('fresh_food') ? series.freshFoodC[i] : NaN;
      const freezer = probes.includes('freezer') ? series.freezerC[i] : NaN;
      if (fresh !== fresh && freezer !== freezer) continue;
      if (series.atMs[i] > latestMs) {
        skippedInFuture++;
        continue;
      }
      readings.push({
        deviceId: `logger-file:${loggerFileId}`,
        sensorId: loggerFileId,
        applianceId,
        seq: i,
        atMs: series.atMs[i],
        freshFoodC: fresh === fresh ? fresh : null,
        freezerC: freezer === freezer ? freezer : null,
        freshFoodFlag: null,
        freezerFlag: null,
        batteryV: null,
        doorOpen: null,
      });
    }
    return { readings, skippedInFuture };
  }

  private async fileOf(organizationId: string, loggerFileId: string): Promise<FileForAttach> {
    const [row] = await this.dataSource.query(`SELECT content, attached_appliance_id FROM logger_file WHERE id = $1 AND organization_id = $2`, [loggerFileId, organizationId]);
    if (!row) throw notFound('logger file');
    return row;
  }

  private async applianceStyle(organizationId: string, applianceId: string): Promise<ApplianceStyle> {
    const [row] = await this.dataSource.query(
      `SELECT a.style, a.archived_at FROM appliance a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
        WHERE a.id = $1 AND p.organization_id = $2`,
      [applianceId, organizationId],
    );
    if (!row) throw notFound('appliance');
    if (row.archived_at) throw conflict('the appliance is archived');
    return row.style;
  }
}
