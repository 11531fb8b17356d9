import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatAutocompleteHarness } from '@angular/material/autocomplete/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { LoggerFileView } from '../../../shared/api/logger-files';
import { appliance, configureSpec, page, settle } from '../inventory/testing';
import { ReadingChart } from '../shared/reading-chart/reading-chart';
import { LoggerFileDetail } from './logger-file-detail';

const START_MS = Date.UTC(2026, 0, 5);

function file(extra: Partial<LoggerFileView> = {}): LoggerFileView {
  return {
    id: 'lf1',
    fileName: 'garage-fridge.csv',
    sizeBytes: 4200,
    style: 'top-freezer',
    uploadedAt: '2026-03-01T10:00:00.000Z',
    uploadedBy: 'Dana Manager',
    readings: 3,
    firstAt: new Date(START_MS).toISOString(),
    lastAt: new Date(START_MS + 600_000).toISOString(),
    findingCount: 1,
    healthAtEnd: 'warm',
    attachment: null,
    chart: { fresh_food: { points: [[START_MS, 3.1], [START_MS + 300_000, 9.5], [START_MS + 600_000, 10.2]], readings: 3 } },
    analysis: {
      findings: [
        {
          kind: 'warming-trend',
          compartment: 'fresh_food',
          started_at: new Date(START_MS + 300_000).toISOString(),
          detected_at: new Date(START_MS + 600_000).toISOString(),
          ended_at: null,
          severity: 'urgent',
          probable_causes: [{ code: 'evaporator-fan', confidence: 0.62 }, { code: 'door-seal', confidence: 0.1 }],
          minutes_above_4c: 10,
          summary: 'Fresh food at 10.2 °C (50 °F), rising.',
        },
      ],
      summary: {
        style: 'top-freezer',
        probes: ['fresh_food'],
        readings: 3,
        first_at: new Date(START_MS).toISOString(),
        last_at: new Date(START_MS + 600_000).toISOString(),
        median_interval_minutes: 5,
        health_at_end: 'warm',
        fresh_food_minutes_above_4c: 10,
        findings_by_kind: { 'warming-trend': 1 },
        learned: { baseline_c: { fresh_food: 3.1, freezer: null }, cycle_period_minutes: null, defrost_interval_hours: null, defrost_rise_c: null, door_openings_per_day: null },
        file: { rows: 4, rows_skipped: 1, duplicates_merged: 0, cells_unreadable: 0, temperature_unit: 'C', timestamps_without_offset_read_as_utc: false },
      },
    },
    ...extra,
  };
}

describe('LoggerFileDetail', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec({ user: { temperatureUnit: 'F' } })));
  afterEach(() => backend.verify());

  async function render(view: LoggerFileView) {
    const fixture = TestBed.createComponent(LoggerFileDetail);
    fixture.componentRef.setInput('loggerFileId', 'lf1');
    fixture.detectChanges();
    await settle(fixture);
    backend.expectOne('/api/logger-files/lf1').flush(view);
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  it('draws the file on the reading chart and lists the findings with their probable causes', async () => {
    const { fixture, element } = await render(file());
    const chart = fixture.debugElement.query((node) => node.componentInstance instanceof ReadingChart).componentInstance as ReadingChart;
    expect(chart.data().probes.fresh_food!.points.length).toBe(3);
    expect(chart.data().incidents).toEqual([{ startMs: START_MS + 300_000, endMs: null, label: 'Warming trend (fresh food)' }]);
    expect(chart.unit()).toBe('F');
    const text = element.textContent ?? '';
    expect(text).toContain('Warming trend, fresh food');
    expect(text).toContain('Evaporator fan motor stopped');
    expect(text).toContain('62%');
    expect(text).toContain('1 rows had no readable timestamp');
    // 3.1 °C is 37.6 °F (NIST SP 811, B.8).
    expect(text).toContain('37.6 °F');
    expect(text).toContain('EPA Section 608');
  });

  it("adds the file's readings to a chosen appliance's history", async () => {
    const { fixture, loader, element } = await render(file());
    const picker = await loader.getHarness(MatAutocompleteHarness);
    await picker.enterText('linden');
    await new Promise((resolve) => setTimeout(resolve, 300));
    backend.expectOne((req) => req.url === '/api/inventory/appliances').flush(page([appliance(1)]));
    await settle(fixture);
    await picker.selectOption({ text: /Linden Court 1 · 1A/ });
    await settle(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Add to history' }))).click();
    const call = backend.expectOne('/api/logger-files/lf1/attach');
    expect(call.request.body).toEqual({ applianceId: 'a1' });
    call.flush({ attachment: { applianceId: 'a1', propertyName: 'Linden Court 1', unitLabel: '1A', style: 'top-freezer', attachedAt: '2026-03-01T11:00:00.000Z', readings: 3 }, inserted: 3, skippedInFuture: 0 });
    await settle(fixture);
    expect(element.textContent).toContain('3 readings are in the history of the Linden Court 1 · 1A appliance');
    expect(element.textContent).toContain('3 readings added now.');
  });

  it('says when the file is not found', async () => {
    const fixture = TestBed.createComponent(LoggerFileDetail);
    fixture.componentRef.setInput('loggerFileId', 'lf1');
    fixture.detectChanges();
    await settle(fixture);
    backend.expectOne('/api/logger-files/lf1').flush({ error: 'logger file not found' }, { status: 404, statusText: 'Not Found' });
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('Logger file not found');
  });
});
