import type { ReportView } from '../../shared/api/reports';
import type { Browser } from '../auth/support/browser';
import { createFleetWorld, SETUP_TIMEOUT_MS, type FleetWorld } from '../fleet/support/fleet-world';
import { seedReportFixture, type ReportFixture } from './support/report-fixture';

/**
 * The reports against the real PostgreSQL with the hand-built history of
 * support/report-fixture.ts. The range is 2025-12-01 … 2026-02-28 in UTC (the manager has
 * no time zone of their own); every expected figure is worked out by hand beside it.
 */
const RANGE = 'from=2025-12-01&to=2026-02-28';

describe('reports', () => {
  let world: FleetWorld;
  let fixture: ReportFixture;
  let manager: Browser;
  let report: ReportView;

  beforeAll(async () => {
    world = await createFleetWorld();
    fixture = await seedReportFixture(world);
    manager = await world.signIn(fixture.manager.email);
    const res = await manager.get(`/api/reports?${RANGE}`);
    expect(res.status).withContext(JSON.stringify(res.body)).toBe(200);
    report = res.body;
  }, SETUP_TIMEOUT_MS);
  afterAll(async () => world.close(), SETUP_TIMEOUT_MS);

  it('states the range it covers', () => {
    expect(report.range).toEqual({ from: '2025-12-01', to: '2026-02-28', timeZone: 'UTC', propertyId: null });
  });

  it('counts incidents per 100 appliances in service, month by month', () => {
    // In service (joined the inventory 2025-01-01 unless said): a1, a2, a3, a6 all three
    // months; a4 joined 2026-01-10 (Jan, Feb); a5 archived 2026-01-05 (Dec, Jan).
    //   Dec: a1 a2 a3 a5 a6 = 5; Jan: all six = 6; Feb: a1 a2 a3 a4 a6 = 5.
    // Incidents that count (repair lane, not explained by a power loss, this organization):
    //   Dec: i1 (a1) = 1; Jan: i2 (a2), i3 (a3) = 2 (the outsider's Jan incident is not ours);
    //   Feb: i4 (a1) = 1 (a4's sensor fault and a3's power-loss incident do not count).
    //   per 100: 1 × 100 / 5 = 20; 2 × 100 / 6 = 33.33; 1 × 100 / 5 = 20.
    expect(report.incidentRate).toEqual([
      { month: '2025-12', incidents: 1, appliancesInService: 5, per100Appliances: 20 },
      { month: '2026-01', incidents: 2, appliancesInService: 6, per100Appliances: 33.33 },
      { month: '2026-02', incidents: 1, appliancesInService: 5, per100Appliances: 20 },
    ]);
  });

  it('measures opened → dispatched, → completed, → verified over the requests opened in the range', () => {
    // Requests opened in the range: R1, R2, R3, R4, R5, R6, R8 = 7 (R0 opened in November,
    // the merged request counts in R2). A request opens with its incident when it has one.
    //   dispatch: R1 08:00→09:00 = 60; R2 10:00→12:00 = 120; R3 12:00→13:30 = 90;
    //             R4 06:00→06:30 = 30; R6 09:00→21:00 (first of two work orders) = 720;
    //             R8 00:00→02:00 = 120 → 6 requests, 1140 / 6 = 190 min.
    //   repair:   R1 → Dec 4 10:00 = 26 h = 1560; R2 → Jan 6 10:00 = 24 h = 1440;
    //             R3 → Jan 21 12:00 = 1440; R6 → Dec 12 09:00 = 48 h = 2880 → 4, 7320 / 4 = 1830.
    //   verified: R1 → Dec 5 10:00 = 50 h = 3000; R2 → Jan 9 10:00 = 96 h = 5760 → 2, 4380.
    expect(report.responseTimes).toEqual({
      requests: 7,
      toDispatch: { meanMinutes: 190, count: 6 },
      toRepair: { meanMinutes: 1830, count: 4 },
      toVerified: { meanMinutes: 4380, count: 2 },
    });
  });

  it('gives the first-visit fix rate of the judged work orders', () => {
    // Judged (verified or reopened): wo1 (verified, never reopened), wo2 (verified after a
    // reopen), wo6 (reopened, then cancelled) = 3; fixed on the first visit: wo1 → 1 / 3.
    // wo3 awaits verification and the declined work order was never judged.
    expect(report.firstVisitFix).toEqual({ fixedFirstVisit: 1, judged: 3, rate: 0.3333 });
  });

  it('sums spend per property as recorded in the range, approved and pending apart', () => {
    // Alder House: wo1 part 8900 + labour 90 min × $120/h = 18000 (approved);
    //   wo2 parts 4500 + 2 × 1250 = 7000, labour 45 + 30 min × $100/h = 7500 + 5000 (pending);
    //   wo4 part 2000 (not submitted); its labour of March 1 is after the range.
    //   parts 8900 + 7000 + 2000 = 17900; labour 18000 + 12500 = 30500; approved 26900;
    //   pending 19500; other 2000; total 48400; 3 work orders.
    // Birch Court: wo0 labour 30 min × $120/h = 6000 (approved, recorded Dec 2);
    //   wo3 labour 50 min × $91/h = 7583.33 → 7583 (pending); wo6 part 25000 (disputed);
    //   wo8 labour 60 min × $60/h = 6000 (not submitted).
    //   parts 25000; labour 6000 + 7583 + 6000 = 19583; approved 6000; pending 7583;
    //   other 31000; total 44583; 4 work orders. The outsider's $999 job is not ours.
    expect(report.spendByProperty).toEqual([
      { propertyId: fixture.alder, propertyName: 'Alder House', currency: 'USD', partsCents: 17900, labourCents: 30500, approvedCents: 26900, pendingCents: 19500, otherCents: 2000, totalCents: 48400, workOrders: 3 },
      { propertyId: fixture.birch, propertyName: 'Birch Court', currency: 'USD', partsCents: 25000, labourCents: 19583, approvedCents: 6000, pendingCents: 7583, otherCents: 31000, totalCents: 44583, workOrders: 4 },
    ]);
  });

  it('sums spend per appliance; a property-level job belongs to no appliance', () => {
    // a1: wo1 26900 + wo4 2000 = 28900; a5: wo6 25000; a2: wo2 19500; a3: wo0 6000 + wo3 7583 = 13583.
    const { a1, a2, a3, a5 } = fixture.appliances;
    const rows = report.spendByAppliance.map((row) => [row.applianceId, row.unitLabel, row.partsCents, row.labourCents, row.approvedCents, row.pendingCents, row.otherCents, row.totalCents, row.workOrders]);
    expect(rows).toEqual([
      [a1, '1A', 10900, 18000, 26900, 0, 2000, 28900, 2],
      [a5, '103', 25000, 0, 0, 0, 25000, 25000, 1],
      [a2, '2A', 7000, 12500, 0, 19500, 0, 19500, 1],
      [a3, '101', 0, 13583, 6000, 7583, 0, 13583, 2],
    ]);
  });

  it('lists appliances past their expected service life at the end of the range', () => {
    // Expected life: refrigerator 13 years, freezer 11 (NAHB / Bank of America Home Equity,
    // "Study of Life Expectancy of Home Components", 2007). Ages on 2026-02-28:
    //   a1 top-freezer from 2010-06-01: 5751 days / 365.2425 = 15.75 → 15.7 > 13, past;
    //   a2 chest freezer from 2014-01-15: 4427 days = 12.12 → 12.1 > 11, past;
    //   a6 top-freezer from 2013-02-20: 4756 days = 13.02 → 13.0, not past 13 (as the appliance page rounds);
    //   a5 (from 2010) was archived in January; a4 has no install date; the outsider's is not ours.
    // Incidents in the range: a1 i1, i4 = 2; a2 i2 = 1.
    const { a1, a2 } = fixture.appliances;
    expect(report.pastLife.map((row) => [row.applianceId, row.style, row.installedOn, row.ageYears, row.expectedYears, row.incidents])).toEqual([
      [a1, 'top-freezer', '2010-06-01', 15.7, 13, 2],
      [a2, 'chest-freezer', '2014-01-15', 12.1, 11, 1],
    ]);
  });

  it('lists at most 50 appliances per table in the page, every one in the CSV', async () => {
    expect(report.rowCounts).toEqual({ spendByAppliance: 4, pastLife: 2 });
    // 50 more refrigerators installed in 1990 (36 years old): 52 past their life in all.
    const db = world.db.dataSource;
    const [{ id: unitId }] = await db.query(`SELECT id FROM unit WHERE property_id = $1 AND label = '104'`, [fixture.birch]);
    const added: { id: string }[] = await db.query(
      `INSERT INTO appliance (unit_id, style, installed_on, created_at) SELECT $1, 'top-freezer', date '1990-01-01' + n, '2025-01-01T00:00:00Z' FROM generate_series(1, 50) n RETURNING id`,
      [unitId],
    );
    try {
      const page: ReportView = (await manager.get(`/api/reports?${RANGE}`)).body;
      expect(page.rowCounts.pastLife).toBe(52);
      expect(page.pastLife.length).toBe(50);
      expect(page.pastLife[0].installedOn).toBe('1990-01-02'); // oldest first
      const csv = (await manager.get(`/api/reports/past-life.csv?${RANGE}`)).text.trimEnd().split('\r\n');
      expect(csv.length).toBe(1 + 52);
    } finally {
      await db.query(`DELETE FROM appliance WHERE id = ANY($1::uuid[])`, [added.map((row) => row.id)]);
    }
  });

  it('ranks causes: the cause found on site, else the diagnosis, by count and spend', () => {
    // R1 evaporator-fan (found) 26900; R4 evaporator-fan (diagnosis: not completed)
    //   2000 + 30 min × $80/h = 4000 (a request's spend counts whenever recorded) → 2 requests, 32900.
    // R6 compressor-start (found on the completed work order) 25000; R2 defrost-system (found) 19500;
    // R3 door-seal (found; the diagnosis said condenser airflow) 7583; R8 power-loss (diagnosis) 6000;
    // R5 unknown (no incident, no work order), no spend.
    const usd = (cents: number) => [{ currency: 'USD', cents }];
    expect(report.topCauses).toEqual([
      { cause: 'evaporator-fan', requests: 2, foundOnSite: 1, spend: usd(32900) },
      { cause: 'compressor-start', requests: 1, foundOnSite: 1, spend: usd(25000) },
      { cause: 'defrost-system', requests: 1, foundOnSite: 1, spend: usd(19500) },
      { cause: 'door-seal', requests: 1, foundOnSite: 1, spend: usd(7583) },
      { cause: 'power-loss', requests: 1, foundOnSite: 0, spend: usd(6000) },
      { cause: 'unknown', requests: 1, foundOnSite: 0, spend: [] },
    ]);
  });

  it('narrows every figure to one property', async () => {
    const res = await manager.get(`/api/reports?${RANGE}&propertyId=${fixture.alder}`);
    expect(res.status).toBe(200);
    const alder: ReportView = res.body;
    // a1, a2 in service all three months; i1, i2, i4 one a month → 1 × 100 / 2 = 50.
    expect(alder.incidentRate.map((month) => [month.month, month.incidents, month.appliancesInService, month.per100Appliances])).toEqual([
      ['2025-12', 1, 2, 50],
      ['2026-01', 1, 2, 50],
      ['2026-02', 1, 2, 50],
    ]);
    // R1, R2, R4: dispatch (60 + 120 + 30) / 3 = 70; repair (1560 + 1440) / 2 = 1500;
    // verified (3000 + 5760) / 2 = 4380; judged wo1, wo2 of which wo1 first visit → 0.5.
    expect(alder.responseTimes).toEqual({ requests: 3, toDispatch: { meanMinutes: 70, count: 3 }, toRepair: { meanMinutes: 1500, count: 2 }, toVerified: { meanMinutes: 4380, count: 2 } });
    expect(alder.firstVisitFix).toEqual({ fixedFirstVisit: 1, judged: 2, rate: 0.5 });
    expect(alder.spendByProperty.map((row) => row.propertyName)).toEqual(['Alder House']);
    expect(alder.topCauses.map((row) => [row.cause, row.requests])).toEqual([
      ['evaporator-fan', 2],
      ['defrost-system', 1],
    ]);
  });

  it('covers the last twelve calendar months up to today without a range', async () => {
    // The spec clock reads 2026-03-02: March 2026 and the eleven months before it.
    const res = await manager.get('/api/reports');
    expect(res.status).toBe(200);
    expect(res.body.range).toEqual({ from: '2025-04-01', to: '2026-03-02', timeZone: 'UTC', propertyId: null });
    expect(res.body.incidentRate.map((month: { month: string }) => month.month)).toEqual([
      '2025-04', '2025-05', '2025-06', '2025-07', '2025-08', '2025-09', '2025-10', '2025-11', '2025-12', '2026-01', '2026-02', '2026-03',
    ]);
    // November now counts a3's door-seal incident (Nov 20): a1 a2 a3 a5 a6 in service → 20.
    expect(res.body.incidentRate[7]).toEqual({ month: '2025-11', incidents: 1, appliancesInService: 5, per100Appliances: 20 });
  });

  it('uses the manager’s own time zone for days and months', async () => {
    // An incident on a6 at 2026-02-01T03:00Z is still January 31, 19:00 in America/Los_Angeles
    // (UTC−8): January there counts i2, i3 and it = 3, over the same 6 appliances → 50.
    // In UTC the same range counts 2 (33.33).
    const db = world.db.dataSource;
    const late = await world.seed.incident({ organizationId: fixture.org, propertyId: fixture.birch, applianceId: fixture.appliances.a6, openedAtIso: '2026-02-01T03:00:00Z' });
    await db.query(`UPDATE app_user SET time_zone = 'America/Los_Angeles' WHERE id = $1`, [fixture.manager.id]);
    try {
      const local = await manager.get('/api/reports?from=2026-01-01&to=2026-01-31');
      expect(local.body.range.timeZone).toBe('America/Los_Angeles');
      expect(local.body.incidentRate).toEqual([{ month: '2026-01', incidents: 3, appliancesInService: 6, per100Appliances: 50 }]);
      await db.query(`UPDATE app_user SET time_zone = NULL WHERE id = $1`, [fixture.manager.id]);
      const utc = await manager.get('/api/reports?from=2026-01-01&to=2026-01-31');
      expect(utc.body.incidentRate).toEqual([{ month: '2026-01', incidents: 2, appliancesInService: 6, per100Appliances: 33.33 }]);
    } finally {
      await db.query(`UPDATE app_user SET time_zone = NULL WHERE id = $1`, [fixture.manager.id]);
      await db.query(`DELETE FROM incident WHERE id = $1`, [late]);
    }
  });

  it('refuses a backwards or over-long range and a property of another organization', async () => {
    expect((await manager.get('/api/reports?from=2026-02-01&to=2026-01-01')).status).toBe(400);
    expect((await manager.get('/api/reports?from=2020-01-01&to=2026-01-01')).status).toBe(400);
    expect((await manager.get('/api/reports?from=2026-02-30')).status).toBe(400);
    const outsider = await world.signIn(fixture.outsider.email);
    expect((await outsider.get(`/api/reports?${RANGE}&propertyId=${fixture.alder}`)).status).toBe(404);
    const theirs: ReportView = (await outsider.get(`/api/reports?${RANGE}`)).body;
    expect(theirs.spendByProperty.map((row) => [row.propertyName, row.totalCents])).toEqual([['Cedar Flats', 99900]]);
    const tenant = await world.signIn(fixture.tenant.email);
    expect((await tenant.get(`/api/reports?${RANGE}`)).status).toBe(403);
  });

  describe('CSV downloads', () => {
    it('writes a table as RFC 4180 CSV with a formula guard, named after the table and range', async () => {
      const res = await manager.get(`/api/reports/spend-by-appliance.csv?${RANGE}`);
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toMatch(/^text\/csv; charset=utf-8/);
      expect(res.headers['content-disposition']).toBe('attachment; filename="chillwarden-spend-by-appliance-2025-12-01-to-2026-02-28.csv"');
      const { a1, a2, a3, a5 } = fixture.appliances;
      // a5's model `=1+2, "quoted"` starts like a formula and holds a comma and quotes:
      // an apostrophe first (OWASP CSV Injection), then quoted with doubled quotes (RFC 4180 §2.6–2.7).
      expect(res.text).toBe(
        [
          'appliance_id,property,unit,style,model,currency,parts_cents,labour_cents,approved_cents,pending_cents,other_cents,total_cents,work_orders',
          `${a1},Alder House,1A,top-freezer,,USD,10900,18000,26900,0,2000,28900,2`,
          `${a5},Birch Court,103,side-by-side,"'=1+2, ""quoted""",USD,25000,0,0,0,25000,25000,1`,
          `${a2},Alder House,2A,chest-freezer,,USD,7000,12500,0,19500,0,19500,1`,
          `${a3},Birch Court,101,bottom-freezer,,USD,0,13583,6000,7583,0,13583,2`,
          '',
        ].join('\r\n'),
      );
    });

    it('writes the other tables with the same figures as the report', async () => {
      const csv = async (table: string) => (await manager.get(`/api/reports/${table}.csv?${RANGE}`)).text.split('\r\n');
      expect(await csv('incident-rate')).toEqual(['month,incidents,appliances_in_service,incidents_per_100_appliances', '2025-12,1,5,20', '2026-01,2,6,33.33', '2026-02,1,5,20', '']);
      expect(await csv('response-times')).toEqual([
        'measure,mean_minutes,count,of',
        'opened to dispatched,190,6,7',
        'opened to completed,1830,4,7',
        'opened to verified,4380,2,7',
        'first-visit fix rate,0.3333,1,3',
        '',
      ]);
      expect((await csv('top-causes')).slice(0, 3)).toEqual(['cause,requests,found_on_site,spend_cents_usd', 'evaporator-fan,2,1,32900', 'compressor-start,1,1,25000']);
      expect((await csv('past-life'))[1]).toBe(`${fixture.appliances.a1},Alder House,1A,top-freezer,,2010-06-01,15.7,13,2`);
      expect((await csv('spend-by-property'))[2]).toBe(`${fixture.birch},Birch Court,USD,25000,19583,6000,7583,31000,44583,4`);
    });

    it('writes each download to the audit log', async () => {
      await manager.get(`/api/reports/past-life.csv?${RANGE}&propertyId=${fixture.alder}`);
      const [entry] = await world.db.dataSource.query(
        `SELECT action, actor_user_id, target_type, target_id, detail FROM audit_log WHERE target_id = 'past-life' ORDER BY at DESC, id DESC LIMIT 1`,
      );
      expect(entry).toEqual({
        action: 'data-export',
        actor_user_id: fixture.manager.id,
        target_type: 'report',
        target_id: 'past-life',
        detail: { table: 'past-life', from: '2025-12-01', to: '2026-02-28', propertyId: fixture.alder, rows: 2 },
      });
    });

    it('refuses an unknown table', async () => {
      expect((await manager.get(`/api/reports/everything.csv?${RANGE}`)).status).toBe(400);
    });
  });
});
