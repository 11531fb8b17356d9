import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Telemetry storage: readings partitioned by month, 5-minute and hourly rollups, and the
 * rejects the broker and the ingest turned away. Partitions are created by the ingest
 * (server/ingest/partitions.ts) ahead of time and on demand, never here.
 *
 * The reading key is (sensor_id, at): PostgreSQL needs the partition key in every unique
 * key of a partitioned table, and "a reading" is one timestamped report, so a redelivered
 * or duplicated message is stored once. seq is kept for gap counting.
 * No foreign key to sensor: the ingest checks the sensor exists, and a per-row key check
 * on a hot insert path costs throughput; sensors are archived, not deleted.
 */
export class TelemetryStorage1796163938389 implements MigrationInterface {
  name = 'TelemetryStorage1796163938389';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE reading (
        sensor_id uuid NOT NULL,
        appliance_id uuid,
        at timestamptz NOT NULL,
        seq bigint NOT NULL,
        fresh_food_c real,
        freezer_c real,
        fresh_food_flag text CHECK (fresh_food_flag IN ('disconnected','power-on')),
        freezer_flag text CHECK (freezer_flag IN ('disconnected','power-on')),
        battery_v real,
        door_open boolean,
        received_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (sensor_id, at)
      ) PARTITION BY RANGE (at)`);
    await queryRunner.query(`CREATE INDEX reading_appliance_at_idx ON reading (appliance_id, at)`);
    await queryRunner.query(rollupTable('reading_rollup_5m', 'PARTITION BY RANGE (bucket)'));
    await queryRunner.query(rollupTable('reading_rollup_1h', ''));
    await queryRunner.query(`
      CREATE TABLE telemetry_reject (
        id bigserial PRIMARY KEY,
        at timestamptz NOT NULL DEFAULT now(),
        source text NOT NULL CHECK (source IN ('broker','ingest')),
        reason text NOT NULL,
        sensor_id uuid REFERENCES sensor(id) ON DELETE CASCADE,
        device_id text,
        topic text,
        detail text NOT NULL DEFAULT '',
        payload_excerpt text
      )`);
    await queryRunner.query(`CREATE INDEX telemetry_reject_sensor_at_idx ON telemetry_reject (sensor_id, at DESC)`);
    await queryRunner.query(`CREATE INDEX telemetry_reject_at_idx ON telemetry_reject (at)`);
    await queryRunner.query(`
      CREATE TABLE telemetry_reject_count (
        reason text NOT NULL,
        sensor_id uuid REFERENCES sensor(id) ON DELETE CASCADE,
        count bigint NOT NULL DEFAULT 0,
        last_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE NULLS NOT DISTINCT (reason, sensor_id)
      )`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['telemetry_reject_count', 'telemetry_reject', 'reading_rollup_1h', 'reading_rollup_5m', 'reading']) {
      await queryRunner.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}

/** min, max, sum and count per probe; the mean is sum / count, so buckets merge exactly. */
function rollupTable(name: string, partitioning: string): string {
  return `
    CREATE TABLE ${name} (
      appliance_id uuid NOT NULL,
      bucket timestamptz NOT NULL,
      fresh_food_min real,
      fresh_food_max real,
      fresh_food_sum double precision NOT NULL DEFAULT 0,
      fresh_food_count integer NOT NULL DEFAULT 0,
      freezer_min real,
      freezer_max real,
      freezer_sum double precision NOT NULL DEFAULT 0,
      freezer_count integer NOT NULL DEFAULT 0,
      reading_count integer NOT NULL DEFAULT 0,
      door_open_count integer NOT NULL DEFAULT 0,
      PRIMARY KEY (appliance_id, bucket)
    ) ${partitioning}`;
}
