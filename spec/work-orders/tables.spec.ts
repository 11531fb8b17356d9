/**
 * The manager's three tables on the real database: sorting by whitelisted columns,
 * filters, paging with a total, the scope of each role, and the CSV export (quoting,
 * formula guard, chosen columns, all pages, the row cap, the audit entry).
 */
import { parse } from 'csv-parse/sync';
import request from 'supertest';
import type { Browser } from '../auth/support/browser';
import { EXPORT_MAX_ROWS } from '../../shared/api/tables';
import type { TestDevice } from '../telemetry/support/telemetry-fixture';
import { createWorkOrderWorld, type WorkOrderWorld } from './support/world';

const HOUR_MS = 3_600_000;
const DAY0 = Date.parse('2026-11-01T12:00:00Z');

interface IncidentSeed {
  device: number;
  kind: string;
  severity: string;
  topCause: string | null;
  openedHours: number;
  closed?: boolean;
  minutes?: number;
}

/** The CSV body as rows of cells, read by csv-parse (an independent RFC 4180 reader), byte-order mark dropped. */
function cellsOf(text: string): string[][] {
  expect(text.charCodeAt(0)).withContext('starts with a UTF-8 byte-order mark').toBe(0xfeff);
  return parse(text.slice(1), { relax_column_count: false }) as string[][];
}

describe('manager tables: sort, filter, paging and CSV', () => {
  let world: WorkOrderWorld;
  let manager: Browser;
  let devices: TestDevice[];
  let requestIds: string[];

  async function insertIncident(seed: IncidentSeed, index: number): Promise<string> {
    const device = devices[seed.device];
    const openedAt = new Date(DAY0 + seed.openedHours * HOUR_MS);
    const [row] = await world.db.dataSource.query(
      `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, closed_at, severity, top_cause, minutes_above_4c)
       VALUES ($1, $2, $3, $4, 'appliance', $5, 'repair', $6, ARRAY[$6], $7, $7, $8, $9, $10, $11) RETURNING id`,
      [world.place.organizationId, world.place.propertyId, world.place.units[seed.device], device.applianceId, `spec-${index}`, seed.kind, openedAt, seed.closed ? new Date(openedAt.getTime() + HOUR_MS) : null, seed.severity, seed.topCause, seed.minutes ?? 0],
    );
    return row.id;
  }

  beforeAll(async () => {
    world = await createWorkOrderWorld({ units: 4 });
    manager = await world.signedIn(world.people.manager);
    devices = [];
    for (let i = 0; i < 4; i++) devices.push(await world.device(i));
    // A model with a comma and quotes, and a unit label a spreadsheet would run as a formula.
    await world.db.dataSource.query(`UPDATE appliance SET model = $2, serial = 'SN-0001' WHERE id = $1`, [devices[0].applianceId, 'Cool "Max", 18']);
    await world.db.dataSource.query(`UPDATE appliance SET model = 'RT21', serial = 'SN-0002' WHERE id = $1`, [devices[1].applianceId]);
    await world.db.dataSource.query(`UPDATE unit SET label = $2 WHERE id = $1`, [world.place.units[3], '=HYPERLINK("http://example.com")']);
    const seeds: IncidentSeed[] = [
      { device: 0, kind: 'no-cooling', severity: 'critical', topCause: 'compressor-start', openedHours: 0, minutes: 300 },
      { device: 1, kind: 'warming-trend', severity: 'watch', topCause: 'door-seal', openedHours: 24, minutes: 0 },
      { device: 2, kind: 'over-temperature', severity: 'urgent', topCause: 'evaporator-fan', openedHours: 48, minutes: 90 },
      { device: 3, kind: 'sensor-fault', severity: 'info', topCause: 'sensor', openedHours: 72 },
      { device: 1, kind: 'over-temperature', severity: 'urgent', topCause: 'defrost-system', openedHours: -48, closed: true, minutes: 45 },
    ];
    for (const [index, seed] of seeds.entries()) await insertIncident(seed, index);

    requestIds = [];
    const titles = ['Warm fresh food', 'Door will not close', 'Freezer frosting up'];
    for (const [i, title] of titles.entries()) {
      const res = await manager.post('/api/service-requests', { applianceId: devices[i].applianceId, title, priority: i === 1 ? 'urgent' : 'routine' });
      expect(res.status).toBe(201);
      requestIds.push(res.body.id);
      world.clock.advance(HOUR_MS);
    }
    // Request 0 to the covering contractor, request 2 to another picked by hand.
    expect((await manager.post(`/api/service-requests/${requestIds[0]}/dispatch`, {})).status).toBe(200);
    const [idle] = await world.db.dataSource.query(`SELECT id FROM contractor WHERE name = 'Idle Appliance Co (spec)'`);
    expect((await manager.post(`/api/service-requests/${requestIds[2]}/dispatch`, { contractorId: idle.id })).status).toBe(200);
  }, 60_000);
  afterAll(async () => world.close());

  const ids = (res: { body: { items: { id: string }[] } }) => res.body.items.map((item) => item.id);

  describe('incidents', () => {
    it('keeps the old default: open ones, newest first, with where they are', async () => {
      const res = await manager.get('/api/incidents');
      expect(res.status).toBe(200);
      expect(res.body.total).toBe(4);
      expect(res.body.items.map((i: { openedAt: string }) => i.openedAt)).toEqual([72, 48, 24, 0].map((h) => new Date(DAY0 + h * HOUR_MS).toISOString()));
      expect(res.body.items[3].place).toEqual({ propertyName: 'Fernhill Court', timeZone: 'America/Los_Angeles', unitLabel: '1A', applianceLabel: 'top-freezer Cool "Max", 18' });
    });

    it('sorts by severity rank, by unit and by minutes above 4 °C, either way', async () => {
      const bySeverity = await manager.get('/api/incidents?status=all&sort=severity&dir=desc');
      expect(bySeverity.body.items.map((i: { severity: string }) => i.severity)).toEqual(['critical', 'urgent', 'urgent', 'watch', 'info']);
      const ascending = await manager.get('/api/incidents?status=all&sort=severity&dir=asc');
      expect(ascending.body.items.map((i: { severity: string }) => i.severity)).toEqual(['info', 'watch', 'urgent', 'urgent', 'critical']);
      const byMinutes = await manager.get('/api/incidents?sort=minutesAbove4c&dir=desc');
      expect(byMinutes.body.items.map((i: { minutesAbove4c: number }) => i.minutesAbove4c)).toEqual([300, 90, 0, 0]);
      const byUnit = await manager.get('/api/incidents?sort=unit&dir=asc');
      expect(byUnit.body.items.map((i: { place: { unitLabel: string } }) => i.place.unitLabel)).toEqual(['1A', '2A', '3A', '=HYPERLINK("http://example.com")']);
      expect((await manager.get('/api/incidents?sort=organization_id')).status).toBe(400);
      expect((await manager.get('/api/incidents?dir=sideways')).status).toBe(400);
    });

    it('pages with a steady total', async () => {
      const all = ids(await manager.get('/api/incidents?status=all&sort=openedAt&dir=asc'));
      const first = await manager.get('/api/incidents?status=all&sort=openedAt&dir=asc&pageSize=2&page=0');
      const third = await manager.get('/api/incidents?status=all&sort=openedAt&dir=asc&pageSize=2&page=2');
      expect(first.body.total).toBe(5);
      expect(third.body.total).toBe(5);
      expect(ids(first)).toEqual(all.slice(0, 2));
      expect(ids(third)).toEqual(all.slice(4));
    });

    it('filters by severity, kind, cause, opened range and free text', async () => {
      const count = async (query: string) => (await manager.get(`/api/incidents?status=all&${query}`)).body.total;
      expect(await count('severity=urgent')).toBe(2);
      expect(await count('kind=over-temperature')).toBe(2);
      expect(await count('cause=door-seal')).toBe(1);
      const from = encodeURIComponent(new Date(DAY0 + 24 * HOUR_MS).toISOString());
      const to = encodeURIComponent(new Date(DAY0 + 72 * HOUR_MS).toISOString());
      expect(await count(`openedFrom=${from}&openedTo=${to}`)).withContext('from inclusive, to exclusive').toBe(2);
      expect(await count('q=2a')).withContext('unit label, any case').toBe(2);
      expect(await count('q=rt21')).withContext('appliance model').toBe(2);
      expect(await count('q=SN-0001')).withContext('serial').toBe(1);
      expect(await count('q=fernhill')).withContext('property name').toBe(5);
      expect(await count('q=%25')).withContext('a LIKE wildcard is literal').toBe(0);
      expect(await count(`propertyId=${world.place.propertyId}&severity=critical&kind=no-cooling`)).toBe(1);
      expect((await manager.get('/api/incidents?severity=dreadful')).status).toBe(400);
    });

    it('stays within the organization for managers and the unit for tenants', async () => {
      expect((await (await world.signedIn(world.people.outsider)).get('/api/incidents?status=all')).body.total).toBe(0);
      const tenant = await (await world.signedIn(world.people.tenantA)).get('/api/incidents?status=all&q=fernhill');
      expect(tenant.body.total).toBe(1);
      expect(tenant.body.items[0].place.unitLabel).toBe('1A');
    });
  });

  describe('service requests', () => {
    it('sorts, filters and searches the contractor behind the job', async () => {
      const newest = await manager.get('/api/service-requests');
      expect(ids(newest)).toEqual([...requestIds].reverse());
      expect(newest.body.items[0].place.unitLabel).toBe('3A');
      const byPriority = await manager.get('/api/service-requests?sort=priority&dir=desc');
      expect(byPriority.body.items[0].id).toBe(requestIds[1]);
      expect(ids(await manager.get('/api/service-requests?sort=title&dir=asc'))).toEqual([requestIds[1], requestIds[2], requestIds[0]]);
      expect(ids(await manager.get('/api/service-requests?priority=urgent'))).toEqual([requestIds[1]]);
      expect(ids(await manager.get('/api/service-requests?q=frostline'))).toEqual([requestIds[0]]);
      expect(ids(await manager.get('/api/service-requests?q=idle%20appliance'))).toEqual([requestIds[2]]);
      expect(ids(await manager.get('/api/service-requests?q=door'))).toEqual([requestIds[1]]);
      expect((await manager.get('/api/service-requests?source=manager')).body.total).toBe(3);
      expect((await manager.get('/api/service-requests?source=tenant')).body.total).toBe(0);
      // The cause is the incident's: request 1 points at the warming-trend incident (door seal).
      await world.db.dataSource.query(`UPDATE service_request SET incident_id = (SELECT id FROM incident WHERE top_cause = 'door-seal') WHERE id = $1`, [requestIds[1]]);
      expect(ids(await manager.get('/api/service-requests?cause=door-seal'))).toEqual([requestIds[1]]);
      expect((await manager.get('/api/service-requests?cause=sensor')).body.total).toBe(0);
      expect((await manager.get('/api/service-requests?cause=gremlins')).status).toBe(400);
      const paged = await manager.get('/api/service-requests?pageSize=1&page=1');
      expect(paged.body).toEqual(jasmine.objectContaining({ total: 3, page: 1, pageSize: 1 }));
      expect(ids(paged)).toEqual([requestIds[1]]);
    });
  });

  describe('work orders', () => {
    it('lists by request, sorts by contractor and searches', async () => {
      expect((await manager.get('/api/work-orders')).body.total).toBe(2);
      const ofRequest = await manager.get(`/api/work-orders?serviceRequestId=${requestIds[2]}&status=all`);
      expect(ofRequest.body.items.map((w: { contractor: { name: string } }) => w.contractor.name)).toEqual(['Idle Appliance Co (spec)']);
      const byContractor = await manager.get('/api/work-orders?sort=contractor&dir=desc');
      expect(byContractor.body.items.map((w: { contractor: { name: string } }) => w.contractor.name)).toEqual(['Idle Appliance Co (spec)', 'Frostline Repair (spec)']);
      expect((await manager.get('/api/work-orders?q=frostline')).body.total).toBe(1);
      expect((await manager.get('/api/work-orders?state=accepted')).body.total).toBe(0);
      expect((await manager.get('/api/work-orders?priority=routine&state=dispatched')).body.total).toBe(2);
      expect((await manager.get('/api/work-orders?sort=wo.id')).status).toBe(400);
    });
  });

  describe('CSV export', () => {
    it('writes the filtered rows of every page, in the chosen columns, quoted and guarded', async () => {
      const res = await manager.get('/api/incidents/export?status=all&sort=openedAt&dir=asc&columns=unit,appliance,severity,minutesAbove4c,openedAt');
      expect(res.status).toBe(200);
      expect(res.headers['content-type']).toContain('text/csv');
      expect(res.headers['content-disposition']).toMatch(/^attachment; filename="incidents-\d{4}-\d{2}-\d{2}\.csv"$/);
      const cells = cellsOf(res.text);
      expect(cells[0]).toEqual(['Unit', 'Appliance', 'Severity', 'Minutes above 4 °C (40 °F)', 'Opened']);
      expect(cells.length).toBe(6);
      expect(cells[2]).toEqual(['1A', 'top-freezer Cool "Max", 18', 'critical', '300', new Date(DAY0).toISOString()]);
      // OWASP "CSV Injection": a leading = is prefixed with an apostrophe.
      expect(cells[5][0]).toBe(`'=HYPERLINK("http://example.com")`);
      // RFC 4180, section 2: quotes doubled inside a quoted field.
      expect(res.text).toContain('"top-freezer Cool ""Max"", 18"');
      expect(res.text).toContain('\r\n');
    });

    it('records each export in the audit log with its filters', async () => {
      const res = await manager.get('/api/service-requests/export?status=all&priority=urgent&columns=title,priority,contractor');
      expect(cellsOf(res.text)).toEqual([['Title', 'Priority', 'Contractor'], ['Door will not close', 'urgent', '']]);
      const [entry] = await world.db.dataSource.query(`SELECT * FROM audit_log WHERE action = 'data-export' AND target_type = 'service-requests' ORDER BY id DESC LIMIT 1`);
      expect(entry.actor_user_id).toBe(world.people.manager.id);
      expect(entry.organization_id).toBe(world.place.organizationId);
      expect(entry.detail).toEqual(jasmine.objectContaining({ format: 'csv', rows: 1, columns: ['title', 'priority', 'contractor'] }));
      expect(entry.detail.filters).toEqual(jasmine.objectContaining({ status: 'all', priority: 'urgent' }));
      expect(new Date(entry.at).getTime()).toBe(world.clock.currentMs);
      const workOrders = await manager.get('/api/work-orders/export?columns=contractor,state');
      expect(cellsOf(workOrders.text).slice(1).sort()).toEqual([['Frostline Repair (spec)', 'dispatched'], ['Idle Appliance Co (spec)', 'dispatched']]);
    });

    it('refuses unknown columns, and callers other than the organization’s managers', async () => {
      expect((await manager.get('/api/incidents/export?columns=unit,secret')).status).toBe(400);
      const outsider = await (await world.signedIn(world.people.outsider)).get('/api/incidents/export?status=all');
      expect(outsider.status).toBe(200);
      expect(cellsOf(outsider.text).length).withContext('header only: nothing of another organization').toBe(1);
      for (const path of ['/api/incidents/export', '/api/service-requests/export', '/api/work-orders/export']) {
        expect((await (await world.signedIn(world.people.tenantA)).get(path)).status).withContext(`tenant ${path}`).toBe(403);
        expect((await (await world.signedIn(world.people.primaryTech)).get(path)).status).withContext(`contractor ${path}`).toBe(403);
        expect((await request(world.app).get(path)).status).withContext(`anonymous ${path}`).toBe(401);
      }
    });

    it('refuses an export past the row cap with what to do, and takes it once narrowed', async () => {
      const bulk = `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, closed_at, severity, minutes_above_4c)
        SELECT $1, $2, $3, $4, 'appliance', 'bulk-' || n, 'sensor', 'sensor-fault', ARRAY['sensor-fault'], $5::timestamptz - n * interval '1 minute', $5::timestamptz - n * interval '1 minute', $5, 'info', 0
          FROM generate_series(1, $6::int) AS n`;
      const lastMs = DAY0 - 100 * HOUR_MS;
      await world.db.dataSource.query(bulk, [world.place.organizationId, world.place.propertyId, world.place.units[2], devices[2].applianceId, new Date(lastMs), EXPORT_MAX_ROWS + 1]);
      try {
        const refused = await manager.get('/api/incidents/export?status=closed&kind=sensor-fault');
        expect(refused.status).toBe(400);
        expect(refused.body.error).toContain('10,001 rows match');
        expect(refused.body.error).toContain('narrow the filters');
        const from = encodeURIComponent(new Date(lastMs - 60 * 60_000).toISOString());
        const narrowed = await manager.get(`/api/incidents/export?status=closed&kind=sensor-fault&openedFrom=${from}&columns=openedAt`);
        expect(narrowed.status).toBe(200);
        expect(cellsOf(narrowed.text).length).toBe(61);
      } finally {
        await world.db.dataSource.query(`DELETE FROM incident WHERE engine_incident_id LIKE 'bulk-%'`);
      }
    }, 60_000);
  });
});
