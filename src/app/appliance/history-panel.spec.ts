import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, type TestRequest } from '@angular/common/http/testing';
import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleGroupHarness } from '@angular/material/button-toggle/testing';
import type { ApplianceDetail } from '../../../shared/api/appliances';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { sampleDetail, sampleHistory } from './appliance-fixtures';
import { HistoryPanel } from './history-panel';

@Component({
  imports: [HistoryPanel],
  template: `<cw-history-panel [detail]="detail()" unit="C" [refresh]="tick()" />`,
})
class Host {
  readonly detail = signal<ApplianceDetail>(sampleDetail());
  readonly tick = signal(0);
}

const HOUR_MS = 3_600_000;

async function settle(fixture: { whenStable(): Promise<unknown> }): Promise<void> {
  for (let i = 0; i < 3; i++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

describe('HistoryPanel', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const historyRequest = () => http.expectOne((req) => req.url === '/api/appliances/a1/history');
  const spanOf = (request: TestRequest) => Date.parse(request.request.params.get('to')!) - Date.parse(request.request.params.get('from')!);
  const answer = (request: TestRequest) => request.flush(sampleHistory(Date.parse(request.request.params.get('from')!), Date.parse(request.request.params.get('to')!)));

  async function render() {
    const fixture = TestBed.createComponent(Host);
    await settle(fixture);
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('loads the last 24 hours first, then each preset’s range, asking for a point budget that fits the chart', async () => {
    const { fixture, element, loader } = await render();
    const first = historyRequest();
    expect(spanOf(first)).toBe(24 * HOUR_MS);
    const maxPoints = Number(first.request.params.get('maxPoints'));
    expect(maxPoints).toBeGreaterThanOrEqual(200);
    expect(maxPoints).toBeLessThanOrEqual(2000);
    answer(first);
    await settle(fixture);
    expect(element.querySelector('.caption')?.textContent).toContain('5-minute means with their min–max band');
    expect(element.querySelector('cw-reading-chart')).not.toBeNull();
    const group = await loader.getHarness(MatButtonToggleGroupHarness);
    const toggles = await group.getToggles();
    expect(await Promise.all(toggles.map((t) => t.getText()))).toEqual(['6 h', '24 h', '7 d', '30 d', '1 y', 'Custom']);
    for (const [label, hours] of [['7 d', 7 * 24], ['1 y', 365 * 24], ['6 h', 6]] as const) {
      await (await group.getToggles({ text: label }))[0]!.check();
      await settle(fixture);
      const request = historyRequest();
      expect(spanOf(request)).withContext(label).toBe(hours * HOUR_MS);
      answer(request);
      await settle(fixture);
    }
  });

  it('reloads a range that ends now when live readings arrive', async () => {
    const { fixture } = await render();
    answer(historyRequest());
    await settle(fixture);
    fixture.componentInstance.tick.set(1);
    await settle(fixture);
    answer(historyRequest());
  });

  it('says when a range has no readings, and offers to try again after an error', async () => {
    const { fixture, element, loader } = await render();
    historyRequest().flush({ ...sampleHistory(0, 1), probes: { fresh_food: { points: [], envelope: null } } });
    await settle(fixture);
    expect(element.querySelector('.empty')?.textContent).toContain('No readings in this range');
    fixture.componentInstance.tick.set(1);
    await settle(fixture);
    historyRequest().flush({ error: 'a history range is at most ten years' }, { status: 400, statusText: 'Bad Request' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('a history range is at most ten years');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    await settle(fixture);
    answer(historyRequest());
  });

  it('opens a custom range of whole days in the property’s time zone', async () => {
    const { fixture, element, loader } = await render();
    answer(historyRequest());
    await settle(fixture);
    await (await (await loader.getHarness(MatButtonToggleGroupHarness)).getToggles({ text: 'Custom' }))[0]!.check();
    await settle(fixture);
    const inputs = element.querySelectorAll<HTMLInputElement>('.custom input');
    inputs[0]!.value = '2/1/2026';
    inputs[0]!.dispatchEvent(new Event('input'));
    inputs[1]!.value = '2/3/2026';
    inputs[1]!.dispatchEvent(new Event('input'));
    await settle(fixture);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Show' }))).click();
    await settle(fixture);
    const request = historyRequest();
    // Midnight in New York (EST, UTC−5) on 1 Feb to midnight after 3 Feb.
    expect(request.request.params.get('from')).toBe('2026-02-01T05:00:00.000Z');
    expect(request.request.params.get('to')).toBe('2026-02-04T05:00:00.000Z');
    answer(request);
  });
});
