import { analyzeSeries } from '../../server/detection/analyze';
import { parseLoggerCsv } from '../../server/detection/logger-csv';
import { loggerReportJson } from '../../server/detection/logger-report';
import { LOGGER_CHART_MAX_POINTS, LOGGER_FILE_MAX_BYTES, type LoggerFileView } from '../../shared/api/logger-files';
import type { ApplianceView, PropertyView, UnitView } from '../../shared/api/inventory';
import type { Browser } from '../auth/support/browser';
import { count, createWorld, NEW_PROPERTY, upload, type World } from './support/inventory-world';
import { DAY_MS, TRACE_START_MS, traceCsv } from './support/logger-fixtures';

describe('logger-file analysis', () => {
  let world: World;
  let manager: Browser;
  let serial = 0;
  const fanFailure = traceCsv({ days: 4, intervalMinutes: 5, fault: 'evaporator-fan', faultAfterHours: 48 });

  const send = (content: string | Buffer, fields: Record<string, string> = {}, name = 'logger.csv') => upload(manager, '/api/logger-files', { name, content }, fields);
  const addAppliance = async (style = 'top-freezer'): Promise<ApplianceView> => {
    const property: PropertyView = (await manager.post('/api/inventory/properties', { ...NEW_PROPERTY, name: `Logger Spec House ${++serial}` })).body;
    const unit: UnitView = (await manager.post(`/api/inventory/properties/${property.id}/units`, { label: '1' })).body;
    return (await manager.post('/api/inventory/appliances', { unitId: unit.id, style })).body;
  };
  /** Each spec uploads its own content: the same bytes are one logger file per organization. */
  const uniqueTrace = (days = 3) => traceCsv({ days, intervalMinutes: 5, seed: 100 + ++serial });

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('answers the same findings the analyze command prints, with a chart of every reading', async () => {
    const res = await send(fanFailure.text, { style: 'top-freezer' }, 'fan-failure.csv');
    expect(res.status).toBe(201);
    const file: LoggerFileView = res.body;
    // The same engine and the same document as `npm run analyze` (DESIGN.md, "Logger files").
    const parsed = parseLoggerCsv(fanFailure.text);
    const expected = JSON.parse(JSON.stringify(loggerReportJson(analyzeSeries(parsed.series, 'top-freezer'), parsed.report)));
    expect(file.analysis).toEqual(expected);
    expect(file.analysis.findings.length).toBeGreaterThan(0);
    // The simulator stopped the evaporator fan: the top cause of every repair finding names it.
    expect(file.analysis.findings.filter((f) => f.kind !== 'sensor-fault').map((f) => f.probable_causes[0].code)).toEqual(
      jasmine.arrayWithExactContents(file.analysis.findings.filter((f) => f.kind !== 'sensor-fault').map(() => 'evaporator-fan')),
    );
    expect(file).toEqual(jasmine.objectContaining({ fileName: 'fan-failure.csv', style: 'top-freezer', readings: fanFailure.rows, attachment: null, findingCount: file.analysis.findings.length }));
    expect(file.chart.fresh_food!.points.length).toBe(fanFailure.rows);
    expect(file.chart.freezer!.readings).toBe(fanFailure.rows);
    expect(file.firstAt).toBe(new Date(TRACE_START_MS).toISOString());
  });

  it('downsamples a long file to at most 2,000 points per probe, keeping the first and last reading', async () => {
    const long = traceCsv({ days: 10, intervalMinutes: 1, seed: 3 });
    const file: LoggerFileView = (await send(long.text)).body;
    expect(file.readings).toBe(long.rows);
    for (const probe of ['fresh_food', 'freezer'] as const) {
      const points = file.chart[probe]!.points;
      expect(points.length).toBe(LOGGER_CHART_MAX_POINTS);
      expect(points[0][0]).toBe(TRACE_START_MS);
      expect(points[points.length - 1][0]).toBe(TRACE_START_MS + 10 * DAY_MS - 60_000);
      expect(file.chart[probe]!.readings).toBe(long.rows);
    }
    // Without a chosen style, both probes mean a refrigerator with a freezer, as the command decides.
    expect(file.style).toBe('top-freezer');
  });

  it('answers a file it cannot read with 400 and the reader’s own message', async () => {
    const cases: [string, string][] = [
      ['time,fresh_food_c\n2026-01-01T00:00:00Z,3', 'no "timestamp" column in the header row'],
      ['timestamp,temperature\n2026-01-01T00:00:00Z,3', 'no temperature column (fresh_food_c, freezer_c, fresh_food_f or freezer_f) in the header row'],
      ['timestamp,fresh_food_c,freezer_f\n2026-01-01T00:00:00Z,3,0', 'mixed °C and °F temperature columns'],
      ['timestamp,fresh_food_c\nyesterday,3\nsoon,4', 'no row with a readable timestamp'],
      ['', 'the file is empty or has no header row'],
    ];
    for (const [content, message] of cases) {
      const res = await send(content);
      expect(res.status).withContext(message).toBe(400);
      expect(res.body.error).toBe(`the logger file cannot be read: ${message}`);
    }
    expect((await send(fanFailure.text, { style: 'wine-cooler' })).status).toBe(400);
    expect(await count(world, `SELECT 1 FROM logger_file WHERE readings = 0`)).toBe(0);
  });

  it('answers an oversized upload with 413 and the limit', async () => {
    const res = await send(Buffer.alloc(LOGGER_FILE_MAX_BYTES + 1, 0x30));
    expect(res.status).toBe(413);
    expect(res.body.error).toBe('the logger file is larger than the 32 MB limit');
  });

  it('keeps one record per content: the same file again updates its analysis', async () => {
    const trace = uniqueTrace();
    const first = await send(trace.text, {}, 'first-name.csv');
    const second = await send(trace.text, { style: 'side-by-side' }, 'second-name.csv');
    expect(first.status).toBe(201);
    expect(second.status).toBe(200);
    expect(second.body).toEqual(jasmine.objectContaining({ id: first.body.id, fileName: 'second-name.csv', style: 'side-by-side' }));
    const listed = await manager.get('/api/logger-files?pageSize=100');
    expect(listed.body.items.filter((f: LoggerFileView) => f.id === first.body.id).length).toBe(1);
    expect(listed.body.items[0].analysis).toBeUndefined();
  });

  it("attaches a file's readings to an appliance's history, marked as imported, and a second attach writes nothing", async () => {
    const trace = uniqueTrace();
    const appliance = await addAppliance();
    const file: LoggerFileView = (await send(trace.text)).body;
    const attached = await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: appliance.id });
    expect(attached.status).toBe(200);
    expect(attached.body).toEqual(jasmine.objectContaining({ inserted: trace.rows, skippedInFuture: 0 }));
    expect(attached.body.attachment).toEqual(jasmine.objectContaining({ applianceId: appliance.id, readings: trace.rows, unitLabel: '1' }));
    // Imported readings carry the logger file's id where a live reading has its sensor's.
    expect(await count(world, `SELECT 1 FROM reading WHERE appliance_id = $1 AND sensor_id = $2`, [appliance.id, file.id])).toBe(trace.rows);
    const from = new Date(TRACE_START_MS).toISOString();
    const to = new Date(TRACE_START_MS + DAY_MS).toISOString();
    const history = await manager.get(`/api/appliances/${appliance.id}/history?from=${from}&to=${to}`);
    expect(history.status).toBe(200);
    const firstDay = trace.text.split('\n').slice(1).filter((line) => line && Date.parse(line.split(',')[0]) < TRACE_START_MS + DAY_MS && line.split(',')[1] !== '');
    expect(history.body.probes.fresh_food.points.length).toBe(firstDay.length);
    expect(firstDay.length).toBeGreaterThan(24 * 12 - 5);

    const again = await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: appliance.id });
    expect(again.body).toEqual(jasmine.objectContaining({ inserted: 0 }));
    expect(again.body.attachment.readings).toBe(trace.rows);
    expect(await count(world, `SELECT 1 FROM reading WHERE appliance_id = $1`, [appliance.id])).toBe(trace.rows);
    const [rollup] = await world.db.dataSource.query(`SELECT sum(fresh_food_count)::int AS n FROM reading_rollup_1h WHERE appliance_id = $1`, [appliance.id]);
    expect(rollup.n).toBe(trace.rows);

    const other = await addAppliance();
    const elsewhere = await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: other.id });
    expect(elsewhere.status).toBe(409);
    expect(await count(world, `SELECT 1 FROM reading WHERE appliance_id = $1`, [other.id])).toBe(0);
  });

  it("stores only the probes the appliance has, and leaves out readings from a logger's future", async () => {
    const nowMs = Date.now();
    const lines = ['timestamp,fresh_food_c,freezer_c', `${new Date(nowMs - 600_000).toISOString()},3.1,-18`, `${new Date(nowMs - 300_000).toISOString()},3.2,-18.1`, `${new Date(nowMs + 3_600_000).toISOString()},3.3,-18.2`];
    const file: LoggerFileView = (await send(lines.join('\n'))).body;
    const fridge = await addAppliance('fresh-food-only');
    const res = await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: fridge.id });
    expect(res.body).toEqual(jasmine.objectContaining({ inserted: 2, skippedInFuture: 1 }));
    expect(await count(world, `SELECT 1 FROM reading WHERE appliance_id = $1 AND freezer_c IS NULL AND fresh_food_c IS NOT NULL`, [fridge.id])).toBe(2);
  });

  it('forgets a file on request but keeps the readings it gave an appliance', async () => {
    const trace = uniqueTrace(2);
    const appliance = await addAppliance();
    const file: LoggerFileView = (await send(trace.text)).body;
    await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: appliance.id });
    expect((await manager.delete(`/api/logger-files/${file.id}`)).status).toBe(204);
    expect((await manager.get(`/api/logger-files/${file.id}`)).status).toBe(404);
    expect(await count(world, `SELECT 1 FROM reading WHERE appliance_id = $1`, [appliance.id])).toBe(trace.rows);
  });

  it("keeps each organization's files and appliances apart", async () => {
    const file: LoggerFileView = (await send(uniqueTrace(2).text)).body;
    const outsider = await world.signedIn('adminOrg2');
    expect((await outsider.get(`/api/logger-files/${file.id}`)).status).toBe(404);
    expect((await outsider.delete(`/api/logger-files/${file.id}`)).status).toBe(404);
    expect((await outsider.post(`/api/logger-files/${file.id}/attach`, { applianceId: world.fixtures.org2.applianceC })).status).toBe(404);
    expect((await outsider.get('/api/logger-files')).body.total).toBe(0);
    // A manager cannot pour readings into another organization's appliance.
    const intoTheirs = await manager.post(`/api/logger-files/${file.id}/attach`, { applianceId: world.fixtures.org2.applianceC });
    expect(intoTheirs.status).toBe(404);
    expect(intoTheirs.body.error).toBe('appliance not found');
    expect((await upload(await world.signedIn('tenantA'), '/api/logger-files', { name: 'x.csv', content: fanFailure.text })).status).toBe(403);
  });
});
