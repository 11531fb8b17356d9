import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * The live monitor: each appliance's detection state (engine snapshot and incident
 * tracker, jsonb, one row per appliance written once per ingest batch), its current
 * health, and the findings and incidents it concluded. Engine ids are unique per
 * appliance (or per property for a power loss), so findings and incidents are upserted.
 */
export class Monitor1796170000000 implements MigrationInterface {
  name = 'Monitor1796170000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE appliance_monitor (
        appliance_id uuid PRIMARY KEY REFERENCES appliance(id) ON DELETE CASCADE,
        style text NOT NULL,
        engine_state jsonb NOT NULL,
        tracker_state jsonb NOT NULL,
        health text NOT NULL CHECK (health IN ('cold','drifting','warm','no-cooling','silent')),
        health_since timestamptz NOT NULL,
        last_reading_at timestamptz,
        fresh_food_c real,
        freezer_c real,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);

    await queryRunner.query(`
      CREATE TABLE incident (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        property_id uuid NOT NULL REFERENCES property(id) ON DELETE CASCADE,
        unit_id uuid REFERENCES unit(id) ON DELETE CASCADE,
        appliance_id uuid REFERENCES appliance(id) ON DELETE CASCADE,
        level text NOT NULL CHECK (level IN ('appliance','property')),
        engine_incident_id text NOT NULL,
        lane text NOT NULL CHECK (lane IN ('repair','sensor','power')),
        kind text NOT NULL,
        kinds text[] NOT NULL DEFAULT '{}',
        started_at timestamptz NOT NULL,
        opened_at timestamptz NOT NULL,
        closed_at timestamptz,
        severity text NOT NULL CHECK (severity IN ('info','watch','urgent','critical')),
        top_cause text,
        probable_causes jsonb NOT NULL DEFAULT '[]',
        minutes_above_4c integer NOT NULL DEFAULT 0,
        property_incident_id uuid REFERENCES incident(id) ON DELETE SET NULL,
        appliance_ids uuid[] NOT NULL DEFAULT '{}',
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((level = 'appliance') = (appliance_id IS NOT NULL))
      )`);
    await queryRunner.query(`CREATE UNIQUE INDEX incident_appliance_engine_idx ON incident (appliance_id, engine_incident_id) WHERE appliance_id IS NOT NULL`);
    await queryRunner.query(`CREATE INDEX incident_property_idx ON incident (property_id, opened_at DESC)`);
    await queryRunner.query(`CREATE INDEX incident_open_idx ON incident (organization_id, opened_at DESC) WHERE closed_at IS NULL`);

    await queryRunner.query(`
      CREATE TABLE finding (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        property_id uuid NOT NULL REFERENCES property(id) ON DELETE CASCADE,
        appliance_id uuid REFERENCES appliance(id) ON DELETE CASCADE,
        incident_id uuid REFERENCES incident(id) ON DELETE SET NULL,
        engine_finding_id text NOT NULL,
        kind text NOT NULL CHECK (kind IN ('over-temperature','warming-trend','no-cooling','sensor-fault','power-loss')),
        compartment text NOT NULL CHECK (compartment IN ('fresh_food','freezer','both')),
        started_at timestamptz NOT NULL,
        detected_at timestamptz NOT NULL,
        ended_at timestamptz,
        severity text NOT NULL CHECK (severity IN ('info','watch','urgent','critical')),
        probable_causes jsonb NOT NULL DEFAULT '[]',
        minutes_above_4c integer NOT NULL DEFAULT 0,
        forecast_crossing_at timestamptz,
        summary text NOT NULL DEFAULT '',
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`CREATE UNIQUE INDEX finding_appliance_engine_idx ON finding (appliance_id, engine_finding_id) WHERE appliance_id IS NOT NULL`);
    await queryRunner.query(`CREATE UNIQUE INDEX finding_property_engine_idx ON finding (property_id, engine_finding_id) WHERE appliance_id IS NULL`);
    await queryRunner.query(`CREATE INDEX finding_property_recent_idx ON finding (property_id, started_at DESC)`);
    await queryRunner.query(`CREATE INDEX finding_incident_idx ON finding (incident_id)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['finding', 'incident', 'appliance_monitor']) {
      await queryRunner.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}
