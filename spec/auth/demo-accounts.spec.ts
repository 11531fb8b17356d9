import { SPEC_TIMEOUT_MS } from './support/world';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { seedDatabase } from '../../seeds/run';
import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import { accountsStep } from '../../seeds/steps/accounts';
import { NewPasswordSchema } from '../../shared/api/auth';
import { assertPasswordAcceptable } from '../../server/auth/password-policy';
import { PasswordService } from '../../server/services/passwords';
import { createTestDatabase, type TestDatabase } from '../support/test-db';

describe('demo accounts', () => {
  let db: TestDatabase;

  beforeAll(async () => {
    db = await createTestDatabase('cw_demo');
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => db.drop(), SPEC_TIMEOUT_MS);

  it('lists one account per role plus an administrator, all at reserved example domains', () => {
    expect(DEMO_ACCOUNTS.map((account) => `${account.role}${account.isAdmin ? ' (admin)' : ''}`).sort()).toEqual(['contractor', 'manager', 'manager (admin)', 'tenant']);
    for (const account of DEMO_ACCOUNTS) {
      expect(account.email).toMatch(/@([a-z-]+\.)?example\.com$/);
      expect(account.phone).toMatch(/^555-01\d\d$/);
      expect(NewPasswordSchema.safeParse(account.password).success).withContext(account.email).toBeTrue();
      expect(() => assertPasswordAcceptable(account.password, account.email)).not.toThrow();
    }
  });

  it('creates its organization and a unit when the fleet step did not run, and each account signs in', async () => {
    const context = { dataSource: db.dataSource, seed: 1, dataDir: '/tmp', nowMs: Date.now(), facts: {} as Record<string, unknown>, log: () => {} };
    await accountsStep.run(context);
    const [org] = await db.dataSource.query('SELECT count(*)::int AS n FROM organization');
    expect(org.n).toBe(1);
    const passwords = passwordCheck(db.dataSource);
    for (const account of DEMO_ACCOUNTS) expect(await passwords.verifyCredentials(account.email, account.password)).withContext(account.email).not.toBeNull();
    const [tenant] = await db.dataSource.query(`SELECT unit_id FROM app_user WHERE role = 'tenant'`);
    expect(tenant.unit_id).toBe(context.facts.demoTenantUnitId);
  }, SPEC_TIMEOUT_MS);

  it('joins the demo fleet when seeded with it: same organization, the tenant in one of its units', async () => {
    const fleetDb = await createTestDatabase('cw_demo_fleet');
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-seed-'));
    spyOn(console, 'log'); // the seed runner narrates each step
    try {
      // One day of history: this checks who joins which organization, not the months of readings.
      await seedDatabase(fleetDb.dataSource, { reset: false, seed: 7, historyDays: 1 }, dataDir);
      const [counts] = await fleetDb.dataSource.query(`SELECT (SELECT count(*)::int FROM organization) AS orgs, (SELECT count(DISTINCT organization_id)::int FROM app_user) AS user_orgs`);
      expect(counts).toEqual({ orgs: 1, user_orgs: 1 });
      const [tenant] = await fleetDb.dataSource.query(
        `SELECT p.organization_id = a.organization_id AS same_org
           FROM app_user a JOIN unit u ON u.id = a.unit_id JOIN property p ON p.id = u.property_id
          WHERE a.role = 'tenant'`,
      );
      expect(tenant.same_org).toBeTrue();
    } finally {
      await fleetDb.drop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  }, SPEC_TIMEOUT_MS);
});

function passwordCheck(dataSource: DataSource): PasswordService {
  const unused = null as never;
  return new PasswordService({ dataSource, clock: { now: () => new Date() }, rounds: 4, mail: unused, audit: unused, logger: unused });
}
