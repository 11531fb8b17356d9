import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router } from '@angular/router';
import type { LoggerFileSummaryView } from '../../../shared/api/logger-files';
import { configureSpec, page, settle } from '../inventory/testing';
import { LoggerFilesPage } from './logger-files-page';

@Component({ template: '' })
class Blank {}

function summary(n: number, extra: Partial<LoggerFileSummaryView> = {}): LoggerFileSummaryView {
  return {
    id: `lf${n}`,
    fileName: `logger-${n}.csv`,
    sizeBytes: 1000,
    style: 'upright-freezer',
    uploadedAt: '2026-03-01T10:00:00.000Z',
    uploadedBy: 'Dana Manager',
    readings: 1440,
    firstAt: '2026-02-01T00:00:00.000Z',
    lastAt: '2026-02-02T00:00:00.000Z',
    findingCount: n,
    healthAtEnd: 'cold',
    attachment: null,
    ...extra,
  };
}

describe('LoggerFilesPage', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec({ routes: [{ path: 'logger-files/:id', component: Blank }] })));
  afterEach(() => backend.verify());

  async function render() {
    const fixture = TestBed.createComponent(LoggerFilesPage);
    fixture.detectChanges();
    const list = backend.expectOne((req) => req.url === '/api/logger-files' && req.method === 'GET');
    expect(list.request.params.get('pageSize')).toBe('10');
    list.flush(page([summary(1), summary(2, { attachment: { applianceId: 'a1', propertyName: 'Linden Court 1', unitLabel: '1A', style: 'upright-freezer', attachedAt: '2026-03-01T11:00:00.000Z', readings: 1440 } })], 2, 0, 10));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  async function upload(fixture: Awaited<ReturnType<typeof render>>['fixture'], content: string) {
    const input = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[type="file"]')!;
    const transfer = new DataTransfer();
    transfer.items.add(new File([content], 'garage.csv', { type: 'text/csv' }));
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
    await settle(fixture);
  }

  it('lists the files analysed before, with where each was attached', async () => {
    const { loader } = await render();
    const cells = await (await loader.getHarness(MatTableHarness)).getCellTextByColumnName();
    expect(cells['findings'].text).toEqual(['1 cold at the end', '2 cold at the end']);
    expect(cells['attached'].text).toEqual(['not attached', 'Linden Court 1 · 1A']);
  });

  it('uploads a file with the chosen style and opens its analysis', async () => {
    const { fixture, loader } = await render();
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Chest freezer' });
    await upload(fixture, 'timestamp,freezer_c\n2026-02-01T00:00:00Z,-18\n');
    const call = backend.expectOne((req) => req.url === '/api/logger-files' && req.method === 'POST');
    const form = call.request.body as FormData;
    expect(form.get('style')).toBe('chest-freezer');
    expect((form.get('file') as File).name).toBe('garage.csv');
    call.flush({ ...summary(3), id: 'lf3' });
    await settle(fixture);
    expect(TestBed.inject(Router).url).toBe('/logger-files/lf3');
  });

  it("shows the reader's message for a file it cannot read", async () => {
    const { fixture, element } = await render();
    await upload(fixture, 'time,temp\n1,2\n');
    backend
      .expectOne((req) => req.url === '/api/logger-files' && req.method === 'POST')
      .flush({ error: 'the logger file cannot be read: no "timestamp" column in the header row' }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The logger file cannot be read: no "timestamp" column in the header row');
  });
});
