import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import { MatDateRangeInputHarness } from '@angular/material/datepicker/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { MatTableHarness } from '@angular/material/table/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { ReportView } from '../../../shared/api/reports';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { ReportsPage } from './reports-page';
import { ALDER_ID, BIRCH_ID, emptyReport, sampleReport } from './reports-fixtures';

describe('ReportsPage', () => {
  let backend: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'reports', component: ReportsPage }]), provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()],
    });
    backend = TestBed.inject(HttpTestingController);
  });
  afterEach(() => backend.verify());

  const reportCall = (): TestRequest => backend.expectOne((req) => req.url === '/api/reports');
  const propertiesCall = (): TestRequest => backend.expectOne((req) => req.url === '/api/inventory/properties');

  async function settle(harness: RouterTestingHarness): Promise<void> {
    for (let round = 0; round < 3; round++) await new Promise((resolve) => setTimeout(resolve));
    await harness.fixture.whenStable();
    harness.detectChanges();
  }

  async function open(url: string, answer: ReportView | { status: number }) {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url, ReportsPage);
    const properties = propertiesCall();
    expect(properties.request.params.get('status')).toBe('active');
    properties.flush({ items: [{ id: ALDER_ID, name: 'Alder House' }, { id: BIRCH_ID, name: 'Birch Court' }], total: 2, page: 0, pageSize: 200 });
    const call = reportCall();
    if ('status' in answer) call.flush({ error: 'the database is not answering' }, { status: answer.status, statusText: 'Server Error' });
    else call.flush(answer);
    await settle(harness);
    const loader = TestbedHarnessEnvironment.loader(harness.fixture);
    const text = () => (harness.routeNativeElement?.textContent ?? '').replace(/\s+/g, ' ');
    return { harness, loader, call, text };
  }

  it('asks for the range and property in the URL and shows the headline figures', async () => {
    const { loader, call } = await open(`/reports?from=2025-12-01&to=2026-02-28&property=${ALDER_ID}`, sampleReport());
    expect(call.request.params.get('from')).toBe('2025-12-01');
    expect(call.request.params.get('to')).toBe('2026-02-28');
    expect(call.request.params.get('propertyId')).toBe(ALDER_ID);
    const cards = await loader.getAllHarnesses(MatCardHarness);
    const figures = await Promise.all(cards.map(async (card) => [await card.getTitleText(), (await card.getText()).replace(/\s+/g, ' ')]));
    expect(figures.map(([title]) => title)).toEqual(['Mean time to dispatch', 'Mean time to repair', 'Mean time to verified', 'First-visit fix rate']);
    expect(figures[0][1]).toContain('3 h 10 min');
    expect(figures[0][1]).toContain('6 of 7 requests');
    expect(figures[1][1]).toContain('1 d 6 h');
    expect(figures[2][1]).toContain('3 d 1 h');
    expect(figures[3][1]).toContain('33 %');
    expect(figures[3][1]).toContain('1 of 3 judged work orders');
    const range = await loader.getHarness(MatDateRangeInputHarness);
    expect(await (await range.getStartInput()).getValue()).toBe('12/1/2025');
    expect(await (await range.getEndInput()).getValue()).toBe('2/28/2026');
    expect(await (await loader.getHarness(MatSelectHarness)).getValueText()).toBe('Alder House');
  });

  it('fills the spend and past-life tables, each appliance linking to its page', async () => {
    const { harness, loader } = await open('/reports', sampleReport());
    const byProperty = await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Spend per property"]' }));
    const cells = await byProperty.getCellTextByColumnName();
    expect(cells['property'].text).toEqual(['Alder House']);
    expect(cells['total'].text).toEqual(['$484.00']);
    expect(cells['approved'].text).toEqual(['$269.00']);
    expect(cells['pending'].text).toEqual(['$195.00']);
    const byAppliance = await (await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Spend per appliance"]' }))).getCellTextByColumnName();
    expect(byAppliance['appliance'].text[0]).toMatch(/^Unit 1A\s*Top-freezer refrigerator · TF-18$/);
    const pastLife = await (await loader.getHarness(MatTableHarness.with({ selector: '[aria-label="Appliances past their expected service life"]' }))).getCellTextByColumnName();
    expect(pastLife['age'].text).toEqual(['15.7 of about 13 years']);
    const links = Array.from((harness.routeNativeElement as HTMLElement).querySelectorAll<HTMLAnchorElement>('cw-past-life-table a, cw-spend-table a')).map((a) => a.getAttribute('href'));
    expect(links).toEqual(['/appliances/appliance-a1', '/appliances/appliance-a1']);
  });

  it('says when an appliance table lists only the first rows', async () => {
    const { text } = await open('/reports', sampleReport({ rowCounts: { spendByAppliance: 1, pastLife: 1250 } }));
    expect(text()).toContain('The 1 oldest of 1,250 appliances; the CSV download lists every one.');
    expect(text()).not.toContain('with the largest spend of');
  });

  it('offers each table as a CSV download for the same range and property', async () => {
    const { harness } = await open(`/reports?from=2025-12-01&to=2026-02-28&property=${BIRCH_ID}`, sampleReport());
    const downloads = Array.from((harness.routeNativeElement as HTMLElement).querySelectorAll<HTMLAnchorElement>('a[download]')).map((a) => a.getAttribute('href'));
    const query = `?from=2025-12-01&to=2026-02-28&propertyId=${BIRCH_ID}`;
    expect(downloads).toEqual(['response-times', 'incident-rate', 'top-causes', 'spend-by-property', 'spend-by-appliance', 'past-life'].map((table) => `/api/reports/${table}.csv${query}`));
  });

  it('puts a new property and the picked range into the URL, which reloads the report', async () => {
    const { harness, loader } = await open('/reports', sampleReport());
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Birch Court' });
    await settle(harness);
    expect(TestBed.inject(Router).url).toBe(`/reports?property=${BIRCH_ID}`);
    const reload = reportCall();
    expect(reload.request.params.get('propertyId')).toBe(BIRCH_ID);
    reload.flush(sampleReport());
    await settle(harness);

    const range = await loader.getHarness(MatDateRangeInputHarness);
    await (await range.getStartInput()).setValue('1/1/2026');
    await (await range.getEndInput()).setValue('1/31/2026');
    await settle(harness);
    expect(TestBed.inject(Router).url).toBe(`/reports?from=2026-01-01&to=2026-01-31&property=${BIRCH_ID}`);
    // Typing the first day already makes a complete range (with the shown last day); the
    // second load replaces it.
    const loads = backend.match((req) => req.url === '/api/reports');
    expect(loads.slice(0, -1).every((load) => load.cancelled)).toBeTrue();
    const ranged = loads[loads.length - 1];
    expect([ranged.request.params.get('from'), ranged.request.params.get('to')]).toEqual(['2026-01-01', '2026-01-31']);
    ranged.flush(sampleReport());
    await settle(harness);
  });

  it('ranks causes by spend when asked', async () => {
    const { harness, loader } = await open('/reports', sampleReport());
    await (await loader.getHarness(MatButtonToggleHarness.with({ text: 'By spend' }))).check();
    await settle(harness);
    const chart = (harness.routeNativeElement as HTMLElement).querySelectorAll('cw-report-chart .chart')[1];
    expect(chart.getAttribute('aria-label')).toContain('top causes by spend');
  });

  it('shows the failure with a way to try again', async () => {
    const { harness, loader, text } = await open('/reports', { status: 500 });
    expect(text()).toContain('The report could not be loaded: the database is not answering');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    reportCall().flush(sampleReport());
    await settle(harness);
    expect(text()).not.toContain('could not be loaded');
    expect(text()).toContain('Mean time to dispatch');
  });

  it('says so when nothing happened in the range', async () => {
    const { text, loader } = await open('/reports', emptyReport());
    expect(text()).toContain('Nothing to report in this range');
    expect(await loader.getAllHarnesses(MatCardHarness)).toEqual([]);
  });

  it('shows a loading bar until the report arrives', async () => {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/reports', ReportsPage);
    propertiesCall().flush({ items: [], total: 0, page: 0, pageSize: 200 });
    harness.detectChanges();
    expect((harness.routeNativeElement as HTMLElement).querySelector('mat-progress-bar')).not.toBeNull();
    reportCall().flush(sampleReport());
    await settle(harness);
    expect((harness.routeNativeElement as HTMLElement).querySelector('mat-progress-bar')).toBeNull();
  });
});
