import type { Pool } from 'pg';
import { DEVICE_ID_PATTERN } from '../shared/telemetry';
import { secretFingerprint, verifyDeviceSecret } from '../server/telemetry/device-secret';

export type DeviceCheck =
  | { ok: true; sensorId: string }
  | { ok: false; reason: 'unknown-device' | 'wrong-secret'; sensorId: string | null };

interface Verified {
  secretHash: string;
  fingerprint: string;
}

/**
 * Checks a device's id and secret against the sensor table. The lookup runs on every
 * connect (an archived sensor or a new secret takes effect at once); the scrypt check is
 * skipped when the same secret already passed against the same stored hash.
 */
export class DeviceAuthenticator {
  private readonly verified = new Map<string, Verified>();

  constructor(
    private readonly pool: Pool,
    private readonly maxCached = 100_000,
  ) {}

  async check(deviceId: string, secret: Buffer | undefined): Promise<DeviceCheck> {
    if (!DEVICE_ID_PATTERN.test(deviceId)) return { ok: false, reason: 'unknown-device', sensorId: null };
    const { rows } = await this.pool.query<{ id: string; secret_hash: string }>(
      'SELECT id, secret_hash FROM sensor WHERE device_id = $1 AND archived_at IS NULL',
      [deviceId],
    );
    if (!rows.length) return { ok: false, reason: 'unknown-device', sensorId: null };
    const { id: sensorId, secret_hash: secretHash } = rows[0];
    if (!secret?.length) return { ok: false, reason: 'wrong-secret', sensorId };
    const fingerprint = secretFingerprint(secret);
    const known = this.verified.get(deviceId);
    if (known && known.secretHash === secretHash && known.fingerprint === fingerprint) return { ok: true, sensorId };
    if (!(await verifyDeviceSecret(secret.toString('utf8'), secretHash))) return { ok: false, reason: 'wrong-secret', sensorId };
    if (this.verified.size >= this.maxCached) this.verified.clear();
    this.verified.set(deviceId, { secretHash, fingerprint });
    return { ok: true, sensorId };
  }
}
