import type { ApplianceDetail } from '../../shared/api/appliances';
import type { Browser } from '../auth/support/browser';
import { SETUP_TIMEOUT_MS, createFleetWorld, type FleetWorld } from './support/fleet-world';

/**
 * The appliance page's service history and repair rule as the server wires them by
 * default: read from the work-order tables and the organization's settings row.
 */
describe('appliance page: service history from work orders', () => {
  let world: FleetWorld;
  let manager: Browser;
  const ids: Record<string, string> = {};

  async function workOrder(state: string, dispatchedAt: string, completedAt: string | null): Promise<string> {
    const db = world.db.dataSource;
    const [request] = await db.query(
      `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, status, priority, title, opened_at)
       VALUES ($1, $2, $3, $4, 'appliance', 'monitor', $5, 'urgent', 'Fresh food warm', $6) RETURNING id`,
      [ids.org, ids.property, ids.unit, ids.appliance, completedAt ? 'closed' : 'open', dispatchedAt],
    );
    const [order] = await db.query(
      `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, completed_at, cause_found, findings)
       VALUES ($1, $2, $3, $4, 'urgent', 'coverage-primary', $5, $5::timestamptz + interval '1 day', $6, 'evaporator-fan', 'fan motor seized') RETURNING id`,
      [ids.org, request.id, ids.contractor, state, dispatchedAt, completedAt],
    );
    return order.id;
  }

  beforeAll(async () => {
    world = await createFleetWorld();
    const { seed } = world;
    const db = world.db.dataSource;
    ids.org = await seed.organization('Harbor Flats (spec)');
    ids.property = await seed.property(ids.org, 'Birch Court');
    ids.unit = await seed.unit(ids.property, '4B');
    ids.appliance = await seed.appliance(ids.unit, 'top-freezer', { installedOn: '2017-01-01' });
    [{ id: ids.contractor }] = await db.query(`INSERT INTO contractor (organization_id, name, email) VALUES ($1, 'Northwind Repair (spec)', 'jobs@northwind.example.com') RETURNING id`, [ids.org]);
    ids.done = await workOrder('verified', '2026-01-05T10:00:00Z', '2026-01-06T12:00:00Z');
    await db.query(`INSERT INTO work_order_part (work_order_id, name, quantity, unit_cost_cents, currency) VALUES ($1, 'Evaporator fan motor', 1, 8950, 'USD'), ($1, 'Fan grommet', 2, 125, 'USD')`, [ids.done]);
    await db.query(`INSERT INTO work_order_labour (work_order_id, minutes, hourly_rate_cents, currency) VALUES ($1, 50, 9500, 'USD'), ($1, 7, 9500, 'USD')`, [ids.done]);
    ids.open = await workOrder('dispatched', '2026-03-01T10:00:00Z', null);
    manager = await world.signIn((await seed.person('manager', ids.org)).email);
  }, SETUP_TIMEOUT_MS);
  afterAll(async () => world.close(), SETUP_TIMEOUT_MS);

  const detail = async (): Promise<ApplianceDetail> => (await manager.get(`/api/appliances/${ids.appliance}`)).body;

  it('lists the appliance’s work orders newest first with parts, labour and the total in cents', async () => {
    const history = (await detail()).serviceHistory!;
    expect(history.map((entry) => [entry.workOrderId, entry.state, entry.contractorName])).toEqual([
      [ids.open, 'dispatched', 'Northwind Repair (spec)'],
      [ids.done, 'verified', 'Northwind Repair (spec)'],
    ]);
    const done = history[1];
    expect(done.parts).toEqual([
      { name: 'Evaporator fan motor', quantity: 1, unitCostCents: 8950 },
      { name: 'Fan grommet', quantity: 2, unitCostCents: 125 },
    ]);
    expect(done.labourMinutes).toBe(57);
    // Parts 8950 + 250; labour round(50 × 9500 / 60) + round(7 × 9500 / 60) = 7917 + 1108.
    expect(done.totalCents).toBe(8950 + 250 + 7917 + 1108);
    expect(done.causeFound).toBe('evaporator-fan');
  });

  it('reads the repair-or-replace rule from the organization’s settings and counts the year’s repairs', async () => {
    let hint = (await detail()).repairOrReplace;
    expect(hint.rule.repairShareOfNewPrice).toBe(0.5);
    expect(hint.replaceAtCents).toBeNull();
    expect(hint.repairsLastYearCents).toBe(18_225);
    await world.db.dataSource.query(`INSERT INTO org_settings (organization_id, settings) VALUES ($1, $2)`, [
      ids.org,
      JSON.stringify({ currency: 'USD', repairOrReplace: { repairShareOfNewPrice: 0.3, newUnitPriceCents: { refrigerator: 60_000 } } }),
    ]);
    hint = (await detail()).repairOrReplace;
    // 9.2 of 13 years is past mid-life; 30 % of $600 is $180 and $182.25 of repairs reached it.
    expect(hint.replaceAtCents).toBe(18_000);
    expect(hint.verdict).toBe('replace');
  });
});
