import type { DataSource } from 'typeorm';
import type { RejectReason, SensorRejectsView, TelemetryRejectView } from '../../shared/api/telemetry';
import { notFound } from '../errors';
import type { TelemetryAccess } from './history-service';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
const LATEST_LIMIT = 20;

/** A sensor's rejected messages: counts per reason and the latest few, for its page. */
export class RejectsService<Actor> {
  constructor(
    private readonly db: DataSource,
    private readonly access: TelemetryAccess<Actor>,
  ) {}

  async sensorRejects(actor: Actor, sensorId: string): Promise<SensorRejectsView> {
    const sensor = UUID.test(sensorId) ? (await this.db.query('SELECT device_id, appliance_id FROM sensor WHERE id = $1', [sensorId]))[0] : undefined;
    // An unpaired sensor belongs to no organization yet: nobody's to read.
    if (!sensor?.appliance_id) throw notFound('sensor');
    await this.access.assertCanReadAppliance(actor, sensor.appliance_id);
    const counts: { reason: RejectReason; count: string }[] = await this.db.query(
      'SELECT reason, count FROM telemetry_reject_count WHERE sensor_id = $1 ORDER BY reason',
      [sensorId],
    );
    const latest: { at: Date; source: 'broker' | 'ingest'; reason: RejectReason; detail: string; payload_excerpt: string | null }[] = await this.db.query(
      'SELECT at, source, reason, detail, payload_excerpt FROM telemetry_reject WHERE sensor_id = $1 ORDER BY at DESC, id DESC LIMIT $2',
      [sensorId, LATEST_LIMIT],
    );
    return {
      sensorId,
      deviceId: sensor.device_id,
      countsByReason: Object.fromEntries(counts.map((row) => [row.reason, Number(row.count)])),
      latest: latest.map((row): TelemetryRejectView => ({ at: row.at.toISOString(), source: row.source, reason: row.reason, detail: row.detail, payloadExcerpt: row.payload_excerpt })),
    };
  }
}
