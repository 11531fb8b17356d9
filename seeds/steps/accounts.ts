import bcrypt from 'bcryptjs';
import type { DataSource } from 'typeorm';
import { DEFAULT_PASSWORD_HASH_ROUNDS } from '../../server/services/passwords';
import type { SeedContext, SeedStep } from '../context';
import { DEMO_ACCOUNTS } from '../demo-accounts';

/** Used only when the fleet step did not run first and nothing else made an organization. */
const FALLBACK_ORGANIZATION_NAME = 'Lindenfield Rentals (demo)';

async function one(dataSource: DataSource, sql: string, params: unknown[] = []): Promise<string | null> {
  const [row] = await dataSource.query(sql, params);
  return row?.id ?? null;
}

async function demoOrganization(context: SeedContext): Promise<string> {
  const fromFacts = context.facts.organizationId as string | undefined;
  const existing = fromFacts ?? (await one(context.dataSource, 'SELECT id FROM organization ORDER BY created_at, id LIMIT 1'));
  const organizationId = existing ?? (await one(context.dataSource, 'INSERT INTO organization (name) VALUES ($1) RETURNING id', [FALLBACK_ORGANIZATION_NAME]));
  if (!organizationId) throw new Error('could not create the demo organization');
  context.facts.organizationId = organizationId;
  return organizationId;
}

/** The demo tenant's unit: the scenario's choice, else the fleet step's first unit, else any unit of the organization, else a new one. */
async function demoTenantUnit(context: SeedContext, organizationId: string): Promise<string> {
  const planned = context.facts.demoTenantUnitId as string | undefined;
  if (planned) return planned;
  const unitIds = (context.facts.unitIds ?? {}) as Record<string, string>;
  const firstKey = Object.keys(unitIds).sort()[0];
  if (firstKey) return unitIds[firstKey];
  const existing = await one(
    context.dataSource,
    'SELECT u.id FROM unit u JOIN property p ON p.id = u.property_id WHERE p.organization_id = $1 ORDER BY p.name, u.label LIMIT 1',
    [organizationId],
  );
  if (existing) return existing;
  const propertyId = await one(
    context.dataSource,
    `INSERT INTO property (organization_id, name, address_line1, city, region, postal_code, time_zone)
     VALUES ($1, 'Alder Court (demo)', '100 Example Street', 'Springfield', 'IL', '62701', 'America/Chicago') RETURNING id`,
    [organizationId],
  );
  const unitId = await one(context.dataSource, `INSERT INTO unit (property_id, label, floor) VALUES ($1, '1A', 1) RETURNING id`, [propertyId]);
  if (!unitId) throw new Error('could not create the demo unit');
  return unitId;
}

/** Demo sign-ins for every role (seeds/demo-accounts.ts), in the demo organization. */
export const accountsStep: SeedStep = {
  name: 'demo accounts: an administrator, a manager, a contractor and a tenant',
  async run(context: SeedContext): Promise<void> {
    const organizationId = await demoOrganization(context);
    const tenantUnitId = await demoTenantUnit(context, organizationId);
    const userIds: Record<string, string> = {};
    for (const account of DEMO_ACCOUNTS) {
      const passwordHash = await bcrypt.hash(account.password, DEFAULT_PASSWORD_HASH_ROUNDS);
      const id = await one(
        context.dataSource,
        `INSERT INTO app_user (email, display_name, role, is_admin, organization_id, unit_id, password_hash, phone, time_zone)
         VALUES ($1, $2, $3, $4, $5, $6, $7, $8, 'America/Chicago') RETURNING id`,
        [account.email, account.displayName, account.role, account.isAdmin, organizationId, account.role === 'tenant' ? tenantUnitId : null, passwordHash, account.phone],
      );
      userIds[account.email] = id as string;
    }
    context.facts.demoUserIds = userIds;
    context.facts.demoTenantUnitId = tenantUnitId;
    context.log(`${DEMO_ACCOUNTS.length} demo accounts; the tenant lives in unit ${tenantUnitId}`);
  },
};
