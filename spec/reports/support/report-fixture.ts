/**
 * A small hand-built history for the reports spec: two properties of one organization and
 * an outsider organization, appliances with known install and inventory dates, incidents,
 * requests and work orders with known times and costs. reports.spec.ts works every figure
 * out by hand from these rows.
 */
import type { ApplianceStyle } from '../../../shared/domain';
import type { FleetWorld, PersonSeed } from '../../fleet/support/fleet-world';

export interface ReportFixture {
  org: string;
  alder: string;
  birch: string;
  appliances: Record<'a1' | 'a2' | 'a3' | 'a4' | 'a5' | 'a6', string>;
  manager: PersonSeed;
  tenant: PersonSeed;
  outsider: PersonSeed;
}

interface RequestSeed {
  propertyId: string;
  applianceId?: string | null;
  incidentId?: string | null;
  source?: 'monitor' | 'tenant' | 'manager';
  status?: 'open' | 'closed' | 'cancelled' | 'merged';
  openedAt: string;
}

interface WorkOrderSeed {
  requestId: string;
  state: string;
  dispatchedAt: string;
  completedAt?: string | null;
  verifiedAt?: string | null;
  reopenedCount?: number;
  causeFound?: string | null;
  costStatus?: 'none' | 'pending' | 'approved' | 'disputed';
}

export async function seedReportFixture(world: FleetWorld): Promise<ReportFixture> {
  const { seed } = world;
  const db = world.db.dataSource;
  const one = async (sql: string, params: unknown[]) => ((await db.query(sql, params)) as { id: string }[])[0].id;

  const org = await seed.organization('Hollowbrook Homes (reports spec)');
  const alder = await seed.property(org, 'Alder House');
  const birch = await seed.property(org, 'Birch Court');
  const units = {
    alder1: await seed.unit(alder, '1A'),
    alder2: await seed.unit(alder, '2A'),
    birch1: await seed.unit(birch, '101'),
    birch2: await seed.unit(birch, '102'),
    birch3: await seed.unit(birch, '103'),
    birch4: await seed.unit(birch, '104'),
  };
  const appliance = async (unitId: string, style: ApplianceStyle, installedOn: string | null, createdAt: string, extra: { archivedAt?: string; model?: string } = {}) => {
    const id = await seed.appliance(unitId, style, { installedOn, model: extra.model ?? '' });
    await db.query(`UPDATE appliance SET created_at = $2, archived_at = $3 WHERE id = $1`, [id, createdAt, extra.archivedAt ?? null]);
    return id;
  };
  const appliances = {
    a1: await appliance(units.alder1, 'top-freezer', '2010-06-01', '2025-01-01T00:00:00Z'),
    a2: await appliance(units.alder2, 'chest-freezer', '2014-01-15', '2025-01-01T00:00:00Z'),
    a3: await appliance(units.birch1, 'bottom-freezer', '2020-05-01', '2025-01-01T00:00:00Z'),
    a4: await appliance(units.birch2, 'upright-freezer', null, '2026-01-10T00:00:00Z'),
    a5: await appliance(units.birch3, 'side-by-side', '2010-01-01', '2025-01-01T00:00:00Z', { archivedAt: '2026-01-05T00:00:00Z', model: `=1+2, "quoted"` }),
    a6: await appliance(units.birch4, 'top-freezer', '2013-02-20', '2025-01-01T00:00:00Z'),
  };

  const incident = (applianceId: string | null, openedAtIso: string, cause: string, kind = 'over-temperature') =>
    seed.incident({ organizationId: org, propertyId: applianceId ? (applianceId === appliances.a1 || applianceId === appliances.a2 ? alder : birch) : birch, applianceId, kind, openedAtIso, causes: [{ code: cause, confidence: 0.7 }] });
  const i1 = await incident(appliances.a1, '2025-12-03T08:00:00Z', 'evaporator-fan');
  const i2 = await incident(appliances.a2, '2026-01-05T10:00:00Z', 'defrost-system');
  const i3 = await incident(appliances.a3, '2026-01-20T12:00:00Z', 'condenser-airflow');
  const i4 = await incident(appliances.a1, '2026-02-10T06:00:00Z', 'evaporator-fan');
  await incident(appliances.a4, '2026-02-11T06:00:00Z', 'sensor', 'sensor-fault');
  await incident(appliances.a3, '2025-11-20T06:00:00Z', 'door-seal');
  const powerLoss = await incident(null, '2026-02-15T00:00:00Z', 'power-loss', 'power-loss');
  const explained = await incident(appliances.a3, '2026-02-15T01:00:00Z', 'power-loss');
  await db.query(`UPDATE incident SET property_incident_id = $2 WHERE id = $1`, [explained, powerLoss]);

  const contractor = await one(`INSERT INTO contractor (organization_id, name, email) VALUES ($1, 'Frostline Repair (spec)', 'jobs@frostline.example.com') RETURNING id`, [org]);
  const request = (r: RequestSeed) => {
    const unitOf = (id: string | null | undefined) =>
      id ? ({ [appliances.a1]: units.alder1, [appliances.a2]: units.alder2, [appliances.a3]: units.birch1, [appliances.a4]: units.birch2, [appliances.a5]: units.birch3, [appliances.a6]: units.birch4 } as Record<string, string>)[id] : null;
    return one(
      `INSERT INTO service_request (organization_id, property_id, unit_id, appliance_id, level, source, status, priority, title, incident_id, opened_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, 'urgent', 'spec request', $8, $9) RETURNING id`,
      [org, r.propertyId, unitOf(r.applianceId), r.applianceId ?? null, r.applianceId ? 'appliance' : 'property', r.source ?? 'monitor', r.status ?? 'closed', r.incidentId ?? null, r.openedAt],
    );
  };
  const workOrder = (w: WorkOrderSeed) =>
    one(
      `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, completed_at, verified_at, reopened_count, cause_found, cost_status)
       VALUES ($1, $2, $3, $4, 'urgent', 'coverage-primary', $5, $5::timestamptz + interval '1 day', $6, $7, $8, $9, $10) RETURNING id`,
      [org, w.requestId, contractor, w.state, w.dispatchedAt, w.completedAt ?? null, w.verifiedAt ?? null, w.reopenedCount ?? 0, w.causeFound ?? null, w.costStatus ?? 'none'],
    );
  const part = (workOrderId: string, quantity: number, unitCostCents: number, createdAt: string) =>
    db.query(`INSERT INTO work_order_part (work_order_id, name, quantity, unit_cost_cents, currency, created_at) VALUES ($1, 'spec part', $2, $3, 'USD', $4)`, [workOrderId, quantity, unitCostCents, createdAt]);
  const labour = (workOrderId: string, minutes: number, hourlyRateCents: number, createdAt: string) =>
    db.query(`INSERT INTO work_order_labour (work_order_id, minutes, hourly_rate_cents, currency, created_at) VALUES ($1, $2, $3, 'USD', $4)`, [workOrderId, minutes, hourlyRateCents, createdAt]);

  // R0: opened before the range; its labour was recorded inside it.
  const r0 = await request({ propertyId: birch, applianceId: appliances.a3, openedAt: '2025-11-25T09:00:00Z' });
  const wo0 = await workOrder({ requestId: r0, state: 'verified', dispatchedAt: '2025-11-25T10:00:00Z', completedAt: '2025-12-02T10:00:00Z', verifiedAt: '2025-12-03T10:00:00Z', causeFound: 'door-seal', costStatus: 'approved' });
  await labour(wo0, 30, 12000, '2025-12-02T10:00:00Z');

  // R1: fixed on the first visit.
  const r1 = await request({ propertyId: alder, applianceId: appliances.a1, incidentId: i1, openedAt: '2025-12-03T08:30:00Z' });
  const wo1 = await workOrder({ requestId: r1, state: 'verified', dispatchedAt: '2025-12-03T09:00:00Z', completedAt: '2025-12-04T10:00:00Z', verifiedAt: '2025-12-05T10:00:00Z', causeFound: 'evaporator-fan', costStatus: 'approved' });
  await part(wo1, 1, 8900, '2025-12-04T10:00:00Z');
  await labour(wo1, 90, 12000, '2025-12-04T10:00:00Z');

  // R2: reopened once, then verified.
  const r2 = await request({ propertyId: alder, applianceId: appliances.a2, incidentId: i2, openedAt: '2026-01-05T10:00:00Z' });
  const wo2 = await workOrder({ requestId: r2, state: 'verified', dispatchedAt: '2026-01-05T12:00:00Z', completedAt: '2026-01-06T10:00:00Z', verifiedAt: '2026-01-09T10:00:00Z', reopenedCount: 1, causeFound: 'defrost-system', costStatus: 'pending' });
  await part(wo2, 1, 4500, '2026-01-06T10:00:00Z');
  await part(wo2, 2, 1250, '2026-01-06T10:00:00Z');
  await labour(wo2, 45, 10000, '2026-01-06T10:00:00Z');
  await labour(wo2, 30, 10000, '2026-01-06T10:00:00Z');
  // A request merged into R2: counted there, not again.
  await request({ propertyId: alder, applianceId: appliances.a2, source: 'tenant', status: 'merged', openedAt: '2026-01-05T11:00:00Z' });

  // R3: completed, awaiting verification; the technician found another cause than the diagnosis.
  const r3 = await request({ propertyId: birch, applianceId: appliances.a3, incidentId: i3, status: 'open', openedAt: '2026-01-20T12:00:00Z' });
  const wo3 = await workOrder({ requestId: r3, state: 'completed', dispatchedAt: '2026-01-20T13:30:00Z', completedAt: '2026-01-21T12:00:00Z', causeFound: 'door-seal', costStatus: 'pending' });
  await labour(wo3, 50, 9100, '2026-01-21T12:00:00Z');

  // R4: accepted, not completed; one line recorded after the range.
  const r4 = await request({ propertyId: alder, applianceId: appliances.a1, incidentId: i4, status: 'open', openedAt: '2026-02-10T06:00:00Z' });
  const wo4 = await workOrder({ requestId: r4, state: 'accepted', dispatchedAt: '2026-02-10T06:30:00Z' });
  await part(wo4, 1, 2000, '2026-02-11T10:00:00Z');
  await labour(wo4, 30, 8000, '2026-03-01T10:00:00Z');

  // R5: a tenant's request nobody has dispatched yet.
  await request({ propertyId: birch, applianceId: appliances.a6, source: 'tenant', status: 'open', openedAt: '2026-02-20T09:00:00Z' });

  // R6: declined by the first contractor, completed by the second, reopened, then cancelled.
  const r6 = await request({ propertyId: birch, applianceId: appliances.a5, source: 'tenant', status: 'cancelled', openedAt: '2025-12-10T09:00:00Z' });
  await workOrder({ requestId: r6, state: 'declined', dispatchedAt: '2025-12-10T21:00:00Z' });
  const wo6 = await workOrder({ requestId: r6, state: 'cancelled', dispatchedAt: '2025-12-11T09:00:00Z', completedAt: '2025-12-12T09:00:00Z', reopenedCount: 1, causeFound: 'compressor-start', costStatus: 'disputed' });
  await part(wo6, 1, 25000, '2025-12-12T09:00:00Z');

  // R8: the power loss of Birch Court, a property-level request.
  const r8 = await request({ propertyId: birch, incidentId: powerLoss, status: 'open', openedAt: '2026-02-15T00:30:00Z' });
  const wo8 = await workOrder({ requestId: r8, state: 'on-site', dispatchedAt: '2026-02-15T02:00:00Z' });
  await labour(wo8, 60, 6000, '2026-02-15T03:00:00Z');

  // The outsider organization: an old appliance with an incident and a paid job.
  const elsewhere = await seed.organization('Elsewhere Lettings (reports spec)');
  const cedar = await seed.property(elsewhere, 'Cedar Flats');
  const x = await seed.appliance(await seed.unit(cedar, '9Z'), 'top-freezer', { installedOn: '2000-01-01' });
  await db.query(`UPDATE appliance SET created_at = '2025-01-01T00:00:00Z' WHERE id = $1`, [x]);
  const ix = await seed.incident({ organizationId: elsewhere, propertyId: cedar, applianceId: x, openedAtIso: '2026-01-07T00:00:00Z', causes: [{ code: 'compressor-start', confidence: 0.9 }] });
  const otherContractor = await one(`INSERT INTO contractor (organization_id, name, email) VALUES ($1, 'Coldbay Service (spec)', 'jobs@coldbay.example.com') RETURNING id`, [elsewhere]);
  const rx = await one(
    `INSERT INTO service_request (organization_id, property_id, appliance_id, level, source, status, priority, title, incident_id, opened_at) VALUES ($1, $2, $3, 'appliance', 'monitor', 'closed', 'urgent', 'outsider', $4, '2026-01-07T00:00:00Z') RETURNING id`,
    [elsewhere, cedar, x, ix],
  );
  const wox = await one(
    `INSERT INTO work_order (organization_id, service_request_id, contractor_id, state, priority, dispatch_method, dispatched_at, due_at, cost_status) VALUES ($1, $2, $3, 'verified', 'urgent', 'manual', '2026-01-07T01:00:00Z', '2026-01-08T01:00:00Z', 'approved') RETURNING id`,
    [elsewhere, rx, otherContractor],
  );
  await part(wox, 1, 99900, '2026-01-07T05:00:00Z');

  return {
    org,
    alder,
    birch,
    appliances,
    manager: await seed.person('manager', org),
    tenant: await seed.person('tenant', org, units.alder1),
    outsider: await seed.person('manager', elsewhere, null, 'outsider'),
  };
}
