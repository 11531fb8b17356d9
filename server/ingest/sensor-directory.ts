import type { Pool, PoolClient } from 'pg';

export interface SensorRef {
  sensorId: string;
  applianceId: string | null;
}

interface CacheEntry {
  ref: SensorRef | null;
  expiresAtMs: number;
}

/**
 * Device id → sensor and appliance, cached so a batch of known sensors costs no query.
 * Entries expire so a re-paired or archived sensor is picked up within `ttlMs`; unknown
 * ids are cached too (as null, for `unknownTtlMs`) so a flood from one unregistered device
 * stays cheap while a newly registered one is not refused for long.
 */
export class SensorDirectory {
  private readonly cache = new Map<string, CacheEntry>();

  constructor(
    private readonly ttlMs = 5 * 60_000,
    private readonly unknownTtlMs = 30_000,
    private readonly maxEntries = 200_000,
    private readonly nowMs: () => number = Date.now,
  ) {}

  /** Resolves every device id of a batch with at most one query. */
  async resolve(db: Pool | PoolClient, deviceIds: Iterable<string>): Promise<Map<string, SensorRef | null>> {
    const now = this.nowMs();
    const result = new Map<string, SensorRef | null>();
    const missing: string[] = [];
    for (const deviceId of new Set(deviceIds)) {
      const entry = this.cache.get(deviceId);
      if (entry && entry.expiresAtMs > now) result.set(deviceId, entry.ref);
      else missing.push(deviceId);
    }
    if (missing.length) await this.load(db, missing, now, result);
    return result;
  }

  forget(deviceId: string): void {
    this.cache.delete(deviceId);
  }

  private async load(db: Pool | PoolClient, deviceIds: string[], now: number, result: Map<string, SensorRef | null>): Promise<void> {
    const { rows } = await db.query<{ id: string; device_id: string; appliance_id: string | null }>(
      'SELECT id, device_id, appliance_id FROM sensor WHERE device_id = ANY($1::text[]) AND archived_at IS NULL',
      [deviceIds],
    );
    const found = new Map(rows.map((row) => [row.device_id, { sensorId: row.id, applianceId: row.appliance_id }]));
    if (this.cache.size + deviceIds.length > this.maxEntries) this.cache.clear();
    for (const deviceId of deviceIds) {
      const ref = found.get(deviceId) ?? null;
      this.cache.set(deviceId, { ref, expiresAtMs: now + (ref ? this.ttlMs : this.unknownTtlMs) });
      result.set(deviceId, ref);
    }
  }
}
