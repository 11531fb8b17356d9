import type { MigrationInterface, QueryRunner } from 'typeorm';

/** The core tables of the design brief: organization, user, property, unit, appliance, sensor. */
export class CoreSchema1764633600000 implements MigrationInterface {
  name = 'CoreSchema1764633600000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE organization (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`
      CREATE TABLE property (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        name text NOT NULL,
        address_line1 text NOT NULL,
        address_line2 text,
        city text NOT NULL,
        region text NOT NULL DEFAULT '',
        postal_code text NOT NULL DEFAULT '',
        country text NOT NULL DEFAULT 'US',
        time_zone text NOT NULL,
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`CREATE INDEX property_organization_idx ON property (organization_id)`);
    await queryRunner.query(`
      CREATE TABLE unit (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        property_id uuid NOT NULL REFERENCES property(id) ON DELETE CASCADE,
        label text NOT NULL,
        floor integer,
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (property_id, label)
      )`);
    await queryRunner.query(`
      CREATE TABLE appliance (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        unit_id uuid NOT NULL REFERENCES unit(id) ON DELETE CASCADE,
        style text NOT NULL CHECK (style IN ('top-freezer','bottom-freezer','side-by-side','fresh-food-only','upright-freezer','chest-freezer')),
        model text NOT NULL DEFAULT '',
        serial text NOT NULL DEFAULT '',
        installed_on date,
        warranty_ends_on date,
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`CREATE INDEX appliance_unit_idx ON appliance (unit_id)`);
    await queryRunner.query(`
      CREATE TABLE sensor (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        device_id text NOT NULL UNIQUE,
        appliance_id uuid REFERENCES appliance(id) ON DELETE SET NULL,
        secret_hash text NOT NULL,
        interval_seconds integer NOT NULL DEFAULT 300 CHECK (interval_seconds > 0),
        last_seen_at timestamptz,
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`CREATE INDEX sensor_appliance_idx ON sensor (appliance_id)`);
    await queryRunner.query(`
      CREATE TABLE app_user (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL UNIQUE,
        display_name text NOT NULL,
        role text NOT NULL CHECK (role IN ('manager','contractor','tenant')),
        is_admin boolean NOT NULL DEFAULT false,
        organization_id uuid REFERENCES organization(id) ON DELETE CASCADE,
        unit_id uuid REFERENCES unit(id) ON DELETE SET NULL,
        password_hash text,
        temperature_unit text NOT NULL DEFAULT 'F' CHECK (temperature_unit IN ('C','F')),
        time_zone text,
        phone text NOT NULL DEFAULT '',
        deactivated_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await queryRunner.query(`CREATE INDEX app_user_organization_idx ON app_user (organization_id)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['app_user', 'sensor', 'appliance', 'unit', 'property', 'organization']) {
      await queryRunner.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}
