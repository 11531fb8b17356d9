import type { DataSource } from 'typeorm';
import type { SeedContext, SeedStep } from '../context';

/**
 * The demo's repair side: two invented contractor companies, the demo contractor account
 * working for the first, the coverage table (for every property and style one company
 * primary, the other backup; the scenario says which is primary where) and the demo
 * company's own settings. Past verified work orders come with the service-history step.
 */
export const DEMO_CONTRACTORS = [
  { name: 'Rook Appliance Repair (demo)', email: 'dispatch@rook-repair.example.com', phone: '555-0188' },
  { name: 'Tidewater Cooling Service (demo)', email: 'jobs@tidewater-cooling.example.com', phone: '555-0199' },
] as const;

/** The demo contractor sign-in (seeds/demo-accounts.ts) works for the first company. */
const DEMO_TECHNICIAN_DOMAIN = '@rook-repair.example.com';

async function insertContractor(dataSource: DataSource, organizationId: string, contractor: (typeof DEMO_CONTRACTORS)[number]): Promise<string> {
  const [row] = await dataSource.query(`INSERT INTO contractor (organization_id, name, email, phone) VALUES ($1, $2, $3, $4) RETURNING id`, [
    organizationId,
    contractor.name,
    contractor.email,
    contractor.phone,
  ]);
  return row.id;
}

export const workOrdersStep: SeedStep = {
  name: 'demo contractors and coverage: a primary and a backup for every property',
  async run(context: SeedContext): Promise<void> {
    const { dataSource } = context;
    const organizationId = context.facts.organizationId as string | undefined;
    if (!organizationId) throw new Error('the work-order step needs the demo organization (run the fleet step first)');
    const contractorIds = [await insertContractor(dataSource, organizationId, DEMO_CONTRACTORS[0]), await insertContractor(dataSource, organizationId, DEMO_CONTRACTORS[1])];
    await dataSource.query(
      `INSERT INTO contractor_member (contractor_id, user_id)
       SELECT $1, id FROM app_user WHERE organization_id = $2 AND role = 'contractor' AND email LIKE $3`,
      [contractorIds[0], organizationId, `%${DEMO_TECHNICIAN_DOMAIN}`],
    );
    // The scenario names each property's primary company; without it the first company is primary everywhere.
    const primaryByProperty = (context.facts.primaryContractorByProperty ?? {}) as Record<string, 0 | 1>;
    const properties: { id: string }[] = await dataSource.query(`SELECT id FROM property WHERE organization_id = $1 ORDER BY name`, [organizationId]);
    for (const property of properties) {
      const primaryIndex = primaryByProperty[property.id] ?? 0;
      await dataSource.query(
        `INSERT INTO coverage (organization_id, contractor_id, property_id, appliance_style, rank) VALUES ($1, $2, $4, NULL, 'primary'), ($1, $3, $4, NULL, 'backup')`,
        [organizationId, contractorIds[primaryIndex], contractorIds[1 - primaryIndex], property.id],
      );
    }
    const orgSettings = context.facts.orgSettings as Record<string, unknown> | undefined;
    if (orgSettings) await dataSource.query(`INSERT INTO org_settings (organization_id, settings) VALUES ($1, $2::jsonb)`, [organizationId, JSON.stringify(orgSettings)]);
    context.facts.contractorIds = contractorIds;
    context.log(`${DEMO_CONTRACTORS.length} contractors covering ${properties.length} properties (primary and backup, every style)`);
  },
};
