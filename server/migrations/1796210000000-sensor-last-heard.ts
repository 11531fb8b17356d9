import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * When the ingest last received a reading from the sensor (its commit time), beside
 * `last_seen_at`, the newest reading's own time. They differ when a sensor sends old
 * readings: after an outage it uploads its buffer, and the demo replays hours at speed.
 * Detection judges by reading time; "is it still reporting?" by receipt.
 */
export class SensorLastHeard1796210000000 implements MigrationInterface {
  name = 'SensorLastHeard1796210000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE sensor ADD COLUMN last_heard_at timestamptz`);
    await queryRunner.query(`UPDATE sensor SET last_heard_at = last_seen_at`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`ALTER TABLE sensor DROP COLUMN last_heard_at`);
  }
}
