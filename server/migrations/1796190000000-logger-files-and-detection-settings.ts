import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Logger files a manager analysed (with their text, so one can be attached to an
 * appliance's history later) and the manager's detection-setting overrides per appliance style.
 */
export class LoggerFilesAndDetectionSettings1796190000000 implements MigrationInterface {
  name = 'LoggerFilesAndDetectionSettings1796190000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`
      CREATE TABLE logger_file (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        uploaded_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        file_name text NOT NULL,
        size_bytes integer NOT NULL CHECK (size_bytes >= 0),
        content_sha256 text NOT NULL,
        content text NOT NULL,
        style text NOT NULL CHECK (style IN ('top-freezer','bottom-freezer','side-by-side','fresh-food-only','upright-freezer','chest-freezer')),
        readings integer NOT NULL,
        first_at timestamptz,
        last_at timestamptz,
        analysis jsonb NOT NULL,
        chart jsonb NOT NULL,
        attached_appliance_id uuid REFERENCES appliance(id) ON DELETE SET NULL,
        attached_at timestamptz,
        attached_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        attached_readings integer,
        uploaded_at timestamptz NOT NULL DEFAULT now(),
        UNIQUE (organization_id, content_sha256)
      )`);
    await queryRunner.query(`CREATE INDEX logger_file_organization_uploaded_idx ON logger_file (organization_id, uploaded_at DESC)`);
    await queryRunner.query(`
      CREATE TABLE detection_style_settings (
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        style text NOT NULL CHECK (style IN ('top-freezer','bottom-freezer','side-by-side','fresh-food-only','upright-freezer','chest-freezer')),
        overrides jsonb NOT NULL DEFAULT '{}',
        updated_at timestamptz NOT NULL DEFAULT now(),
        updated_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        PRIMARY KEY (organization_id, style)
      )`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    await queryRunner.query(`DROP TABLE IF EXISTS detection_style_settings`);
    await queryRunner.query(`DROP TABLE IF EXISTS logger_file`);
  }
}
