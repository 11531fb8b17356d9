/** The demo's repair side: every property covered by a primary and a backup, the demo technician on the primary. */
import { CoverageService } from '../../server/services/coverage';
import { WorkOrderScope } from '../../server/work-orders/work-order-scope';
import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import { DEMO_CONTRACTORS, workOrdersStep } from '../../seeds/steps/work-orders';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

describe('demo contractors and coverage', () => {
  let db: TestDatabase;

  /** What the fleet and accounts steps leave behind, in small: two properties with appliances, the demo contractor. */
  beforeAll(async () => {
    db = await createTestDatabase('cw_wo_seed');
    const q = (sql: string, params: unknown[] = []) => db.dataSource.query(sql, params).then((rows: { id: string }[]) => rows[0]?.id);
    const organizationId = await q(`INSERT INTO organization (name) VALUES ('Seed Spec Rentals') RETURNING id`);
    for (const [name, styles] of [['Birch House', ['top-freezer', 'chest-freezer']], ['Cedar Flats', ['side-by-side']]] as const) {
      const propertyId = await q(`INSERT INTO property (organization_id, name, address_line1, city, time_zone) VALUES ($1, $2, '1 Example Way', 'Millbrook', 'UTC') RETURNING id`, [organizationId, name]);
      const unitId = await q(`INSERT INTO unit (property_id, label) VALUES ($1, '1') RETURNING id`, [propertyId]);
      for (const style of styles) await q(`INSERT INTO appliance (unit_id, style) VALUES ($1, $2) RETURNING id`, [unitId, style]);
    }
    const technician = DEMO_ACCOUNTS.find((account) => account.role === 'contractor');
    await q(`INSERT INTO app_user (email, display_name, role, organization_id) VALUES ($1, 'Spec technician', 'contractor', $2) RETURNING id`, [technician?.email, organizationId]);
    await workOrdersStep.run({ dataSource: db.dataSource, seed: 1, dataDir: '/tmp', nowMs: Date.now(), facts: { organizationId }, log: () => undefined });
  }, 30_000);
  afterAll(async () => db.drop());

  it('covers every property and style with a primary and a different backup', async () => {
    const coverage = new CoverageService(db.dataSource, new WorkOrderScope(db.dataSource));
    const appliances: { property_id: string; style: string }[] = await db.dataSource.query(
      `SELECT u.property_id, a.style FROM appliance a JOIN unit u ON u.id = a.unit_id`,
    );
    expect(appliances.length).toBeGreaterThan(0);
    for (const appliance of appliances) {
      const primary = await coverage.covering(db.dataSource, appliance.property_id, appliance.style as never, 'primary');
      const backup = await coverage.covering(db.dataSource, appliance.property_id, appliance.style as never, 'backup');
      expect(primary?.name).toBe(DEMO_CONTRACTORS[0].name);
      expect(backup?.name).toBe(DEMO_CONTRACTORS[1].name);
    }
  });

  it('puts the demo contractor sign-in on the primary company', async () => {
    const rows = await db.dataSource.query(
      `SELECT c.name FROM contractor_member m JOIN contractor c ON c.id = m.contractor_id JOIN app_user u ON u.id = m.user_id WHERE u.role = 'contractor'`,
    );
    expect(rows).toEqual([{ name: DEMO_CONTRACTORS[0].name }]);
    for (const contractor of DEMO_CONTRACTORS) {
      expect(contractor.email).toMatch(/@[a-z-]+\.example\.com$/);
      expect(contractor.phone).toMatch(/^555-01\d\d$/);
    }
  });
});
