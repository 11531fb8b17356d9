import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { SessionUser } from '../../../shared/api/session';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { EVENT_SOURCE_FACTORY } from '../core/live/live-events';
import { sampleDetail, sampleHistory } from './appliance-fixtures';
import { AppliancePage, LIVE_RELOAD_DEBOUNCE_MS } from './appliance-page';

const manager: SessionUser = { id: 'm1', email: 'm@example.com', displayName: 'Pat', role: 'manager', isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'F', timeZone: null };

class FakeEventSource {
  static last: FakeEventSource | null = null;
  onmessage: ((event: MessageEvent<string>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  constructor() {
    FakeEventSource.last = this;
  }
  close(): void {}
  send(data: unknown): void {
    this.onmessage?.(new MessageEvent('message', { data: JSON.stringify(data) }));
  }
}

async function settle(fixture: { whenStable(): Promise<unknown> }): Promise<void> {
  for (let i = 0; i < 3; i++) await new Promise((resolve) => setTimeout(resolve));
  await fixture.whenStable();
}

describe('AppliancePage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([{ path: 'appliances/:id', component: AppliancePage }, { path: 'fleet', children: [] }], withComponentInputBinding()),
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: EVENT_SOURCE_FACTORY, useValue: () => new FakeEventSource() as unknown as EventSource },
      ],
    });
    TestBed.inject(Session).set(manager);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  const answerHistory = () => {
    const request = http.expectOne((req) => req.url === '/api/appliances/a1/history');
    request.flush(sampleHistory(Date.parse(request.request.params.get('from')!), Date.parse(request.request.params.get('to')!)));
  };

  async function open() {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/appliances/a1');
    return { harness, element: harness.routeNativeElement! };
  }

  it('shows the unit, the current health and temperatures in the person’s unit, then the chart, diagnosis, incidents, service history and particulars', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/appliances/a1').flush(sampleDetail());
    await settle(harness.fixture);
    answerHistory();
    await settle(harness.fixture);
    expect(element.querySelector('h1')?.textContent).toContain('Unit 4B · Birch Court');
    const health = element.querySelector<HTMLElement>('.health')!;
    expect(health.dataset['health']).toBe('drifting');
    expect(health.style.background).toContain('var(--cw-health-drifting)');
    // 3.6 °C = 38.5 °F (NIST SP 811: °F = °C × 9/5 + 32).
    expect(element.querySelector('.readings')?.textContent).toContain('38.5 °F');
    for (const selector of ['cw-history-panel', 'cw-diagnosis-card', 'cw-incident-timeline', 'cw-service-history', 'cw-appliance-facts']) {
      expect(element.querySelector(selector)).withContext(selector).not.toBeNull();
    }
    expect(element.querySelector('cw-diagnosis-card')?.textContent).toContain('Condenser fan stopped');
  });

  it('says so when the appliance does not exist or is out of reach', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/appliances/a1').flush({ error: 'appliance not found' }, { status: 404, statusText: 'Not Found' });
    await settle(harness.fixture);
    expect(element.querySelector('cw-empty-state')?.textContent).toContain('No such appliance');
  });

  it('shows a load error with a way to try again', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/appliances/a1').flush({ error: 'internal error' }, { status: 500, statusText: 'Server Error' });
    await settle(harness.fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('internal error');
    (element.querySelector('[role="alert"] button') as HTMLButtonElement).click();
    await settle(harness.fixture);
    http.expectOne('/api/appliances/a1').flush(sampleDetail());
    await settle(harness.fixture);
    answerHistory();
  });

  it('reloads itself and its chart when a live event about this appliance arrives, and ignores others', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/appliances/a1').flush(sampleDetail());
    await settle(harness.fixture);
    answerHistory();
    const place = { organizationId: 'o1', propertyId: 'p1', unitId: 'u1' };
    FakeEventSource.last!.send({ type: 'appliance.health-changed', ...place, applianceId: 'another', atMs: 1, health: 'warm', previous: 'cold' });
    FakeEventSource.last!.send({ type: 'appliance.health-changed', ...place, applianceId: 'a1', atMs: 1, health: 'warm', previous: 'drifting' });
    await settle(harness.fixture);
    answerHistory(); // the chart's range ends now: it reloads at once
    await new Promise((resolve) => setTimeout(resolve, LIVE_RELOAD_DEBOUNCE_MS + 100));
    http.expectOne('/api/appliances/a1').flush(sampleDetail({ now: { ...sampleDetail().now, health: 'warm' } }));
    await settle(harness.fixture);
    expect(element.querySelector<HTMLElement>('.health')!.dataset['health']).toBe('warm');
  });
});
