import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Accounts: the session store's table, invitation and password-reset links (token hashes
 * only), the audit log, and case-insensitive uniqueness of e-mail addresses.
 */
export class Accounts1796164600000 implements MigrationInterface {
  name = 'Accounts1796164600000';

  async up(queryRunner: QueryRunner): Promise<void> {
    // connect-pg-simple's own layout (its table.sql), created here so the store never
    // creates tables at run time; timestamptz instead of timestamp so expiry does not
    // depend on the server's time zone setting.
    await queryRunner.query(`
      CREATE TABLE http_session (
        sid varchar PRIMARY KEY,
        sess json NOT NULL,
        expire timestamptz NOT NULL
      )`);
    await queryRunner.query(`CREATE INDEX http_session_expire_idx ON http_session (expire)`);
    // Signing a user out everywhere (password reset, deactivation) finds their sessions by user id.
    await queryRunner.query(`CREATE INDEX http_session_user_idx ON http_session ((sess->'passport'->>'user'))`);

    await queryRunner.query(`CREATE UNIQUE INDEX app_user_email_lower_idx ON app_user (lower(email))`);

    await queryRunner.query(`
      CREATE TABLE invitation (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        email text NOT NULL,
        display_name text NOT NULL,
        role text NOT NULL CHECK (role IN ('manager','contractor','tenant')),
        is_admin boolean NOT NULL DEFAULT false,
        unit_id uuid REFERENCES unit(id) ON DELETE CASCADE,
        token_hash text NOT NULL UNIQUE,
        invited_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        accepted_at timestamptz,
        accepted_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        revoked_at timestamptz,
        CHECK (role <> 'tenant' OR unit_id IS NOT NULL)
      )`);
    await queryRunner.query(`CREATE INDEX invitation_organization_idx ON invitation (organization_id, created_at DESC)`);

    await queryRunner.query(`
      CREATE TABLE password_reset (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES app_user(id) ON DELETE CASCADE,
        token_hash text NOT NULL UNIQUE,
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        used_at timestamptz
      )`);
    await queryRunner.query(`CREATE INDEX password_reset_user_idx ON password_reset (user_id)`);

    await queryRunner.query(`
      CREATE TABLE audit_log (
        id bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
        at timestamptz NOT NULL,
        organization_id uuid,
        actor_user_id uuid,
        actor_email text,
        action text NOT NULL,
        target_type text,
        target_id text,
        ip text,
        detail jsonb NOT NULL DEFAULT '{}'
      )`);
    await queryRunner.query(`CREATE INDEX audit_log_organization_idx ON audit_log (organization_id, at DESC)`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    for (const table of ['audit_log', 'password_reset', 'invitation', 'http_session']) {
      await queryRunner.query(`DROP TABLE IF EXISTS ${table}`);
    }
    await queryRunner.query(`DROP INDEX IF EXISTS app_user_email_lower_idx`);
  }
}
