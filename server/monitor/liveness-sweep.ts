/**
 * Silence is the absence of readings, so no batch reports it: this sweep finds appliances
 * whose every sensor is past its liveness limit (telemetry/liveness.ts: three of its own
 * intervals, judged on sensor.last_seen_at) and marks them silent.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Health } from '../../shared/domain';
import type { EventBus } from '../events/bus';
import { isSilent, SILENT_AFTER_INTERVALS } from '../telemetry/liveness';
import type { MonitoredAppliance } from './monitored-appliance';
import { saveHealth } from './monitor-store';

export interface LivenessDeps {
  dataSource: DataSource;
  bus: EventBus;
  logger: Logger;
  cached(applianceId: string): MonitoredAppliance | undefined;
}

export class LivenessSweep {
  constructor(private readonly deps: LivenessDeps) {}

  /** Returns how many appliances turned silent. */
  async sweep(nowMs: number): Promise<number> {
    const rows: Record<string, unknown>[] = await this.deps.dataSource.query(
      `SELECT m.appliance_id, m.health, a.unit_id, u.property_id, p.organization_id
         FROM appliance_monitor m JOIN appliance a ON a.id = m.appliance_id JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
        WHERE m.health <> 'silent' AND a.archived_at IS NULL
          AND NOT EXISTS (SELECT 1 FROM sensor s WHERE s.appliance_id = a.id AND s.archived_at IS NULL
                            AND s.last_seen_at >= $1::timestamptz - make_interval(secs => $2 * s.interval_seconds))`,
      [new Date(nowMs), SILENT_AFTER_INTERVALS],
    );
    let silenced = 0;
    for (const row of rows) if (await this.silence(row, nowMs)) silenced++;
    return silenced;
  }

  /** False for an appliance this process heard from lately: a replay or a backlog carries old reading times. */
  private async silence(row: Record<string, unknown>, nowMs: number): Promise<boolean> {
    const applianceId = row.appliance_id as string;
    const heard = this.deps.cached(applianceId);
    if (heard?.lastHeardMs != null && !isSilent(heard.lastHeardMs, heard.ref.intervalSeconds, nowMs)) return false;
    await saveHealth(this.deps.dataSource, applianceId, 'silent', nowMs);
    const cached = this.deps.cached(applianceId);
    if (cached) {
      cached.health = 'silent';
      cached.healthSinceMs = nowMs;
    }
    await this.deps.bus.publish({
      type: 'appliance.health-changed',
      organizationId: row.organization_id as string,
      propertyId: row.property_id as string,
      unitId: row.unit_id as string,
      applianceId,
      atMs: nowMs,
      health: 'silent',
      previous: row.health as Health,
    });
    return true;
  }
}
