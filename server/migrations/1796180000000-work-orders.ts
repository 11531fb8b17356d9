import type { MigrationInterface, QueryRunner } from 'typeorm';

const STYLES = `'top-freezer','bottom-freezer','side-by-side','fresh-food-only','upright-freezer','chest-freezer'`;
const STATES = `'dispatched','accepted','scheduled','on-site','completed','verified','declined','reopened','cancelled'`;

/**
 * Service requests and work orders: contractor companies and who works for them, the
 * coverage table (contractor × property × appliance style, primary and backup), the
 * organization's settings, requests with tenant reports, work orders with their event
 * history, visits, parts, labour and attachments, and per-user e-mail muting.
 * Money is integer cents with a currency. "One open request per appliance problem" and
 * "one active work order per request" are unique indexes, so a race cannot break them.
 */
export class WorkOrders1796180000000 implements MigrationInterface {
  name = 'WorkOrders1796180000000';

  async up(queryRunner: QueryRunner): Promise<void> {
    const q = (sql: string) => queryRunner.query(sql);
    await q(`
      CREATE TABLE org_settings (
        organization_id uuid PRIMARY KEY REFERENCES organization(id) ON DELETE CASCADE,
        settings jsonb NOT NULL DEFAULT '{}',
        updated_at timestamptz NOT NULL DEFAULT now(),
        updated_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL
      )`);
    await q(`
      CREATE TABLE contractor (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        name text NOT NULL,
        email text NOT NULL,
        phone text NOT NULL DEFAULT '',
        archived_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q(`CREATE UNIQUE INDEX contractor_organization_name_idx ON contractor (organization_id, lower(name))`);
    await q(`
      CREATE TABLE contractor_member (
        contractor_id uuid NOT NULL REFERENCES contractor(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES app_user(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (contractor_id, user_id)
      )`);
    await q(`CREATE INDEX contractor_member_user_idx ON contractor_member (user_id)`);
    await q(`
      CREATE TABLE coverage (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        contractor_id uuid NOT NULL REFERENCES contractor(id) ON DELETE CASCADE,
        property_id uuid NOT NULL REFERENCES property(id) ON DELETE CASCADE,
        appliance_style text CHECK (appliance_style IN (${STYLES})),
        rank text NOT NULL CHECK (rank IN ('primary','backup')),
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    // A null style covers every style of the property that has no row of its own.
    await q(`CREATE UNIQUE INDEX coverage_slot_idx ON coverage (property_id, coalesce(appliance_style, '*'), rank)`);

    await q(`
      CREATE TABLE service_request (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        property_id uuid NOT NULL REFERENCES property(id) ON DELETE CASCADE,
        unit_id uuid REFERENCES unit(id) ON DELETE CASCADE,
        appliance_id uuid REFERENCES appliance(id) ON DELETE CASCADE,
        level text NOT NULL CHECK (level IN ('appliance','property')),
        source text NOT NULL CHECK (source IN ('monitor','tenant','manager')),
        status text NOT NULL DEFAULT 'open' CHECK (status IN ('open','closed','cancelled','merged')),
        priority text NOT NULL CHECK (priority IN ('urgent','routine')),
        title text NOT NULL,
        description text NOT NULL DEFAULT '',
        incident_id uuid REFERENCES incident(id) ON DELETE SET NULL,
        symptoms text[] NOT NULL DEFAULT '{}',
        opened_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        opened_at timestamptz NOT NULL,
        closed_at timestamptz,
        close_reason text,
        merged_into_id uuid REFERENCES service_request(id) ON DELETE SET NULL,
        first_visit_fix boolean,
        updated_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((level = 'appliance') = (appliance_id IS NOT NULL))
      )`);
    await q(`CREATE UNIQUE INDEX service_request_open_appliance_idx ON service_request (appliance_id) WHERE status = 'open' AND appliance_id IS NOT NULL`);
    await q(`CREATE UNIQUE INDEX service_request_open_property_incident_idx ON service_request (incident_id) WHERE status = 'open' AND level = 'property'`);
    await q(`CREATE INDEX service_request_organization_idx ON service_request (organization_id, opened_at DESC)`);
    await q(`CREATE INDEX service_request_unit_idx ON service_request (unit_id, opened_at DESC)`);
    await q(`
      CREATE TABLE tenant_report (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        service_request_id uuid NOT NULL REFERENCES service_request(id) ON DELETE CASCADE,
        unit_id uuid NOT NULL REFERENCES unit(id) ON DELETE CASCADE,
        appliance_id uuid NOT NULL REFERENCES appliance(id) ON DELETE CASCADE,
        reporter_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        symptoms text[] NOT NULL,
        description text NOT NULL DEFAULT '',
        access_windows jsonb NOT NULL DEFAULT '[]',
        pet_present boolean NOT NULL DEFAULT false,
        created_at timestamptz NOT NULL
      )`);
    await q(`CREATE INDEX tenant_report_request_idx ON tenant_report (service_request_id, created_at)`);

    await q(`
      CREATE TABLE work_order (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        service_request_id uuid NOT NULL REFERENCES service_request(id) ON DELETE CASCADE,
        contractor_id uuid NOT NULL REFERENCES contractor(id),
        state text NOT NULL CHECK (state IN (${STATES})),
        priority text NOT NULL CHECK (priority IN ('urgent','routine')),
        dispatch_method text NOT NULL CHECK (dispatch_method IN ('coverage-primary','coverage-backup','manual')),
        dispatched_at timestamptz NOT NULL,
        due_at timestamptz NOT NULL,
        accepted_at timestamptz,
        declined_at timestamptz,
        decline_reason text,
        scheduled_start_at timestamptz,
        scheduled_end_at timestamptz,
        completed_at timestamptz,
        verified_at timestamptz,
        verification_due_at timestamptz,
        recovered_since timestamptz,
        escalated_at timestamptz,
        escalated_from_contractor_id uuid REFERENCES contractor(id) ON DELETE SET NULL,
        overdue_at timestamptz,
        reopened_count integer NOT NULL DEFAULT 0,
        cause_found text,
        cause_note text,
        findings text NOT NULL DEFAULT '',
        notes text NOT NULL DEFAULT '',
        currency text NOT NULL DEFAULT 'USD',
        cost_status text NOT NULL DEFAULT 'none' CHECK (cost_status IN ('none','pending','approved','disputed')),
        cost_note text,
        cost_decided_at timestamptz,
        cost_decided_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q(`CREATE UNIQUE INDEX work_order_active_idx ON work_order (service_request_id) WHERE state NOT IN ('verified','declined','cancelled')`);
    await q(`CREATE INDEX work_order_contractor_idx ON work_order (contractor_id, dispatched_at DESC)`);
    await q(`CREATE INDEX work_order_organization_idx ON work_order (organization_id, dispatched_at DESC)`);
    await q(`CREATE INDEX work_order_open_idx ON work_order (state, due_at) WHERE state NOT IN ('verified','declined','cancelled')`);
    await q(`
      CREATE TABLE work_order_event (
        id bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
        work_order_id uuid NOT NULL REFERENCES work_order(id) ON DELETE CASCADE,
        at timestamptz NOT NULL,
        actor_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        actor_kind text NOT NULL CHECK (actor_kind IN ('user','system')),
        type text NOT NULL,
        from_state text,
        to_state text,
        detail jsonb NOT NULL DEFAULT '{}'
      )`);
    await q(`CREATE INDEX work_order_event_work_order_idx ON work_order_event (work_order_id, id)`);
    await q(`
      CREATE TABLE work_order_visit (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        work_order_id uuid NOT NULL REFERENCES work_order(id) ON DELETE CASCADE,
        arrived_at timestamptz NOT NULL,
        left_at timestamptz,
        notes text NOT NULL DEFAULT '',
        technician_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CHECK (left_at IS NULL OR left_at >= arrived_at)
      )`);
    await q(`CREATE INDEX work_order_visit_idx ON work_order_visit (work_order_id, arrived_at)`);
    await q(`
      CREATE TABLE work_order_part (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        work_order_id uuid NOT NULL REFERENCES work_order(id) ON DELETE CASCADE,
        name text NOT NULL,
        quantity integer NOT NULL CHECK (quantity > 0),
        unit_cost_cents integer NOT NULL CHECK (unit_cost_cents >= 0),
        currency text NOT NULL,
        recorded_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q(`CREATE INDEX work_order_part_idx ON work_order_part (work_order_id)`);
    await q(`
      CREATE TABLE work_order_labour (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        work_order_id uuid NOT NULL REFERENCES work_order(id) ON DELETE CASCADE,
        minutes integer NOT NULL CHECK (minutes > 0),
        hourly_rate_cents integer NOT NULL CHECK (hourly_rate_cents >= 0),
        currency text NOT NULL,
        technician_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q(`CREATE INDEX work_order_labour_idx ON work_order_labour (work_order_id)`);
    await q(`
      CREATE TABLE attachment (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        organization_id uuid NOT NULL REFERENCES organization(id) ON DELETE CASCADE,
        work_order_id uuid REFERENCES work_order(id) ON DELETE CASCADE,
        tenant_report_id uuid REFERENCES tenant_report(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('before','after','data-plate','invoice','photo')),
        object_key text NOT NULL UNIQUE,
        thumbnail_key text,
        content_type text NOT NULL,
        size_bytes integer NOT NULL,
        width integer,
        height integer,
        display_name text NOT NULL DEFAULT '',
        uploaded_by_user_id uuid REFERENCES app_user(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CHECK ((work_order_id IS NULL) <> (tenant_report_id IS NULL))
      )`);
    await q(`CREATE INDEX attachment_work_order_idx ON attachment (work_order_id)`);
    await q(`CREATE INDEX attachment_tenant_report_idx ON attachment (tenant_report_id)`);
    await q(`
      CREATE TABLE notification_preference (
        user_id uuid PRIMARY KEY REFERENCES app_user(id) ON DELETE CASCADE,
        mute_non_urgent boolean NOT NULL DEFAULT false,
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
  }

  async down(queryRunner: QueryRunner): Promise<void> {
    const tables = ['notification_preference', 'attachment', 'work_order_labour', 'work_order_part', 'work_order_visit', 'work_order_event', 'work_order',
      'tenant_report', 'service_request', 'coverage', 'contractor_member', 'contractor', 'org_settings'];
    for (const table of tables) await queryRunner.query(`DROP TABLE IF EXISTS ${table}`);
  }
}
