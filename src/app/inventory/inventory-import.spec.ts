import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import type { ImportJob, ImportPreview } from '../../../shared/api/inventory';
import { IMPORT_POLL_MS, InventoryImport } from './inventory-import';
import { configureSpec, settle } from './testing';

const EMPTY_COUNTS = { properties: 0, units: 0, appliances: 0 };

function preview(extra: Partial<ImportPreview>): ImportPreview {
  return { fileName: 'buildings.csv', rows: 3, create: EMPTY_COUNTS, existing: EMPTY_COUNTS, errors: [], sample: [], ok: true, ...extra };
}

function job(extra: Partial<ImportJob>): ImportJob {
  return { id: 'job-1', fileName: 'buildings.csv', state: 'running', processed: 0, total: 10, created: null, error: null, startedAt: '2026-03-01T00:00:00.000Z', finishedAt: null, ...extra };
}

describe('InventoryImport', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  async function chooseFile(fixture: ReturnType<typeof TestBed.createComponent<InventoryImport>>, content: string) {
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[type="file"]')!;
    const transfer = new DataTransfer();
    transfer.items.add(new File([content], 'buildings.csv', { type: 'text/csv' }));
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await settle(fixture);
  }

  it('shows every row error of the file and offers no import', async () => {
    const fixture = TestBed.createComponent(InventoryImport);
    fixture.detectChanges();
    await chooseFile(fixture, 'property_name,appliance_style\nCedar Row,wine-cooler\n');
    const call = backend.expectOne('/api/inventory/import/preview');
    expect(call.request.body instanceof FormData).toBeTrue();
    expect((call.request.body as FormData).get('file')).toEqual(jasmine.any(File));
    call.flush(
      preview({
        ok: false,
        errors: [
          { line: 2, column: 'appliance_style', message: '"wine-cooler" is not a style' },
          { line: 2, column: 'time_zone', message: 'new property: not a time zone' },
        ],
      }),
    );
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const problems = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Problems in the file"]' }));
    const cells = await problems.getCellTextByColumnName();
    expect(cells['line'].text).toEqual(['2', '2']);
    expect(cells['column'].text).toEqual(['appliance_style', 'time_zone']);
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: /^Import$/ }))).toEqual([]);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Nothing has been imported');
  });

  it('imports a checked file and follows its progress to the end', async () => {
    const fixture = TestBed.createComponent(InventoryImport);
    fixture.detectChanges();
    await chooseFile(fixture, 'property_name\nCedar Row\n');
    backend.expectOne('/api/inventory/import/preview').flush(preview({ create: { properties: 2, units: 3, appliances: 5 } }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Would add 2 properties, 3 units and 5 appliances');
    const loader = TestbedHarnessEnvironment.loader(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: /Import/ }))).click();
    backend.expectOne((req) => req.method === 'POST' && req.url === '/api/inventory/import').flush(job({}));
    await settle(fixture);

    await new Promise((resolve) => setTimeout(resolve, IMPORT_POLL_MS + 50));
    backend.expectOne('/api/inventory/import/job-1').flush(job({ processed: 4 }));
    await settle(fixture);
    const bar = await loader.getHarness(MatProgressBarHarness.with({ selector: '[mode="determinate"]' }));
    expect(await bar.getValue()).toBe(40);

    await new Promise((resolve) => setTimeout(resolve, IMPORT_POLL_MS + 50));
    backend.expectOne('/api/inventory/import/job-1').flush(job({ state: 'done', processed: 10, created: { properties: 2, units: 3, appliances: 5 } }));
    await settle(fixture);
    expect(await bar.getValue()).toBe(100);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Added 2 properties, 3 units and 5 appliances.');
    // Polling stops once the import has finished.
    await new Promise((resolve) => setTimeout(resolve, IMPORT_POLL_MS + 50));
    backend.expectNone('/api/inventory/import/job-1');
  });

  it('says plainly that nothing was kept when the import fails', async () => {
    const fixture = TestBed.createComponent(InventoryImport);
    fixture.detectChanges();
    await chooseFile(fixture, 'property_name\nCedar Row\n');
    backend.expectOne('/api/inventory/import/preview').flush(preview({ create: { properties: 1, units: 0, appliances: 0 } }));
    await settle(fixture);
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: /Import/ }))).click();
    backend.expectOne((req) => req.method === 'POST' && req.url === '/api/inventory/import').flush(job({ total: 1 }));
    await settle(fixture);
    await new Promise((resolve) => setTimeout(resolve, IMPORT_POLL_MS + 50));
    backend.expectOne('/api/inventory/import/job-1').flush(job({ state: 'failed', total: 1, error: 'the import failed and nothing was written; try again' }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Nothing from the file was kept.');
  });
});
