import { IMPORT_BATCH_SIZE } from '../../server/services/inventory-import';
import { IMPORT_MAX_BYTES, type ImportPreview, type ImportRowError } from '../../shared/api/inventory';
import type { Browser } from '../auth/support/browser';
import { count, createWorld, finishedImport, upload, type World } from './support/inventory-world';

const HEADER = 'property_name,address_line1,city,region,postal_code,time_zone,unit_label,floor,appliance_style,model,serial,installed_on,warranty_ends_on';

/** A valid file: two new buildings, one row adding to the fixture's existing "Cedar Row". */
function goodFile(prefix: string): string {
  return [
    HEADER,
    `${prefix} Gardens,"1 Example Way, Rear",Springfield,IL,62701,America/Chicago,1A,1,top-freezer,TF-18,${prefix}-001,2020-03-01,2021-03-01`,
    `${prefix} Gardens,,,,,,1B,1,Bottom freezer,BF-22,${prefix}-002,2019-07-15,`,
    `${prefix} Gardens,,,,,,1B,1,upright-freezer,UF-9,${prefix}-003,,`,
    `${prefix} Lofts,40 Sample Street,Riverton,WY,82501,America/Denver,PH,,side-by-side,SxS-1,${prefix}-004,2022-11-30,2027-11-30`,
    `${prefix} Lofts,,,,,,,,,,,,`,
    `Cedar Row,,,,,,1A,,fresh-food-only,FF-3,${prefix}-005,2023-01-01,`,
  ].join('\r\n');
}

describe('inventory: CSV import', () => {
  let world: World;
  let manager: Browser;
  const preview = async (content: string | Buffer, name = 'inventory.csv') => upload(manager, '/api/inventory/import/preview', { name, content });
  const start = async (content: string | Buffer) => upload(manager, '/api/inventory/import', { name: 'inventory.csv', content });
  const countByPrefix = async (prefix: string) => ({
    properties: await count(world, `SELECT 1 FROM property WHERE name LIKE $1`, [`${prefix}%`]),
    appliances: await count(world, `SELECT 1 FROM appliance WHERE serial LIKE $1`, [`${prefix}-%`]),
  });

  beforeAll(async () => {
    world = await createWorld();
    manager = await world.signedIn('managerOrg1');
  });
  afterAll(async () => world.close());

  it('previews what a file would create and reuses what exists, writing nothing', async () => {
    const res = await preview(goodFile('Pv'));
    expect(res.status).toBe(200);
    const body: ImportPreview = res.body;
    expect(body.ok).toBeTrue();
    expect(body.errors).toEqual([]);
    expect(body.rows).toBe(6);
    expect(body.create).toEqual({ properties: 2, units: 3, appliances: 5 });
    expect(body.existing).toEqual({ properties: 1, units: 1, appliances: 0 });
    expect(body.sample[1]).toEqual(jasmine.objectContaining({ line: 3, propertyName: 'Pv Gardens', property: 'create', unitLabel: '1B', unit: 'create', style: 'bottom-freezer', appliance: 'create' }));
    expect(body.sample[5]).toEqual(jasmine.objectContaining({ propertyName: 'Cedar Row', property: 'existing', unit: 'existing', appliance: 'create' }));
    expect(await countByPrefix('Pv')).toEqual({ properties: 0, appliances: 0 });
  });

  it('reports every row error with its line and column, and imports nothing from such a file', async () => {
    const bad = [
      HEADER,
      'Err Court,2 Example Road,Springfield,IL,,America/Chicago,1,,top-freezer,,Err-1,2020-02-30,',
      'Err Court,3 Other Road,,,,,2,,wine-cooler,,Err-2,,',
      'Err Annex,5 Example Road,Springfield,IL,,,1,,top-freezer,,Err-3,,',
      'Err Court,,,,,,3,,top-freezer,,Err-4,2022-05-01,2021-05-01',
      'Err Court,,,,,,,,top-freezer,,Err-5,,',
      'Err Court,,,,,,4,,,Lonely model,,,',
      'Err Court,,,,,,1,,top-freezer,,Err-1,,',
      ',,,,,,,,,,,,',
      'Err Court,,,,,,5,,top-freezer,,Err-6,,,surplus',
    ].join('\n');
    const res = await preview(bad);
    expect(res.body.ok).toBeFalse();
    const errors: ImportRowError[] = res.body.errors;
    const at = (line: number) => errors.filter((e) => e.line === line).map((e) => e.column);
    expect(at(2)).toEqual(['installed_on']);
    expect(at(3)).toEqual(['address_line1', 'appliance_style']);
    expect(at(4)).toEqual(['time_zone']);
    expect(at(5)).toEqual(['warranty_ends_on']);
    expect(at(6)).toEqual(['unit_label']);
    expect(at(7)).toEqual(['appliance_style']);
    expect(at(8)).toEqual(['serial']);
    expect(at(10)).toEqual([null]);
    expect(errors.find((e) => e.line === 3 && e.column === 'appliance_style')!.message).toContain('"wine-cooler" is not a style');
    expect(errors.find((e) => e.line === 8)!.message).toBe('serial Err-1 appears on line 2 for the same unit');

    const refused = await start(bad);
    expect(refused.status).toBe(400);
    expect(refused.body.error).toBe(`the file has ${errors.length} problems; nothing was imported`);
    expect(refused.body.details).toEqual(errors);
    expect(await countByPrefix('Err')).toEqual({ properties: 0, appliances: 0 });
  });

  it('refuses files it cannot read as a whole, and says why', async () => {
    const fileError = async (content: string | Buffer) => (await preview(content)).body.errors[0] as ImportRowError;
    expect(await fileError('name,town\nA,B')).toEqual(jasmine.objectContaining({ line: 1, message: jasmine.stringContaining('unknown columns "name", "town"') }));
    expect((await fileError(HEADER)).message).toBe('the file has a header row but no rows to import');
    expect((await fileError('')).message).toContain('the file is empty');
    expect((await fileError('property_name,unit_label\n"Open quote,1\n')).message).toContain('not valid CSV');
    const latin1 = await preview(Buffer.from([0x70, 0x72, 0x6f, 0x70, 0x65, 0x72, 0x74, 0x79, 0x5f, 0x6e, 0x61, 0x6d, 0x65, 0x0a, 0xe9, 0x0a]));
    expect(latin1.status).toBe(400);
    expect(latin1.body.error).toContain('not UTF-8');
    const noFile = await manager.post('/api/inventory/import/preview', { csv: 'property_name' });
    expect(noFile.status).toBe(400);
    expect(noFile.body.error).toBe('choose the inventory file to upload (form field "file")');
  });

  it('answers an oversized upload with 413 and the limit', async () => {
    const big = `${HEADER}\n${'x'.repeat(IMPORT_MAX_BYTES)}`;
    const res = await preview(big);
    expect(res.status).toBe(413);
    expect(res.body.error).toBe('the inventory file is larger than the 2 MB limit');
  });

  it('imports a good file in the background, all of it, and a second run creates nothing new', async () => {
    const started = await start(goodFile('Ok'));
    expect(started.status).toBe(202);
    expect(started.body).toEqual(jasmine.objectContaining({ state: 'running', total: 10, fileName: 'inventory.csv' }));
    const done = await finishedImport(manager, started.body.id);
    expect(done.body).toEqual(jasmine.objectContaining({ state: 'done', processed: 10, total: 10, created: { properties: 2, units: 3, appliances: 5 }, error: null }));
    expect(await countByPrefix('Ok')).toEqual({ properties: 2, appliances: 5 });
    const [gardens] = await world.db.dataSource.query(`SELECT address_line1, time_zone FROM property WHERE name = 'Ok Gardens'`);
    expect(gardens).toEqual({ address_line1: '1 Example Way, Rear', time_zone: 'America/Chicago' });
    const again = await preview(goodFile('Ok'));
    expect(again.body.create).toEqual({ properties: 0, units: 0, appliances: 0 });
    expect(again.body.existing).toEqual({ properties: 3, units: 4, appliances: 5 });
  });

  it('writes nothing at all when the database fails part-way through a long file', async () => {
    const rows = Array.from({ length: IMPORT_BATCH_SIZE * 2 + 10 }, (_, i) => `Boom Block,1 Example Road,Springfield,IL,,America/Chicago,${i + 1},,top-freezer,${i === IMPORT_BATCH_SIZE * 2 + 9 ? 'EXPLODE' : 'TF'},Boom-${i},,`);
    // A trigger that fails the last appliance only: the properties, units and earlier batches were already written.
    await world.db.dataSource.query(`
      CREATE FUNCTION spec_refuse_explode() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN IF NEW.model = 'EXPLODE' THEN RAISE EXCEPTION 'spec: refused'; END IF; RETURN NEW; END $$`);
    await world.db.dataSource.query(`CREATE TRIGGER spec_refuse_explode BEFORE INSERT ON appliance FOR EACH ROW EXECUTE FUNCTION spec_refuse_explode()`);
    try {
      const started = await start([HEADER, ...rows].join('\n'));
      expect(started.status).toBe(202);
      const done = await finishedImport(manager, started.body.id);
      expect(done.body).toEqual(jasmine.objectContaining({ state: 'failed', processed: 0, created: null, error: 'the import failed and nothing was written; try again' }));
      expect(await countByPrefix('Boom')).toEqual({ properties: 0, appliances: 0 });
      expect(await count(world, `SELECT 1 FROM unit u JOIN property p ON p.id = u.property_id WHERE p.name = 'Boom Block'`)).toBe(0);
    } finally {
      await world.db.dataSource.query(`DROP TRIGGER spec_refuse_explode ON appliance; DROP FUNCTION spec_refuse_explode()`);
    }
  });

  it("keeps an import's progress to its own organization", async () => {
    const started = await start(goodFile('Scope'));
    await finishedImport(manager, started.body.id);
    expect((await (await world.signedIn('adminOrg2')).get(`/api/inventory/import/${started.body.id}`)).status).toBe(404);
    expect((await (await world.signedIn('adminOrg1')).get(`/api/inventory/import/${started.body.id}`)).status).toBe(200);
    const tenant = await world.signedIn('tenantA');
    expect((await upload(tenant, '/api/inventory/import/preview', { name: 'x.csv', content: goodFile('T') })).status).toBe(403);
  });
});
