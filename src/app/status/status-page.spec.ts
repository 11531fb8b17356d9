import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCardHarness } from '@angular/material/card/testing';
import type { HealthReport } from '../../../shared/api/health';
import type { SessionUser } from '../../../shared/api/session';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { StatusPage } from './status-page';

function report(brokerUp: boolean, ingest?: HealthReport['components']['ingest']): HealthReport {
  return {
    status: brokerUp && ingest?.state !== 'down' ? 'ok' : 'degraded',
    version: '1.2.3',
    startedAt: '2026-12-01T10:00:00.000Z',
    checkedAt: '2026-12-01T10:05:00.000Z',
    components: {
      server: { state: 'up', latencyMs: 0, detail: 'up 300 s' },
      database: { state: 'up', latencyMs: 3, detail: 'PostgreSQL 15.18' },
      broker: brokerUp ? { state: 'up', latencyMs: 1, detail: 'MQTT broker' } : { state: 'down', latencyMs: null, detail: 'connection refused' },
      ...(ingest ? { ingest } : {}),
    },
  };
}

const manager: SessionUser = {
  id: 'm1',
  email: 'manager@example.com',
  displayName: 'Mo Manager',
  role: 'manager',
  isAdmin: false,
  organizationId: 'o1',
  unitId: null,
  temperatureUnit: 'C',
  timeZone: null,
};

describe('StatusPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([apiErrorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    TestBed.inject(Session).set(manager);
  });

  afterEach(() => http.verify());

  async function render() {
    const fixture = TestBed.createComponent(StatusPage);
    fixture.detectChanges();
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  it('shows one card per component with its state and detail', async () => {
    const { fixture, loader, element } = await render();
    http.expectOne('/api/health/details').flush(report(true));
    await fixture.whenStable();
    const cards = await loader.getAllHarnesses(MatCardHarness);
    expect(await Promise.all(cards.map((card) => card.getTitleText()))).toEqual(['Web server', 'Database', 'Telemetry broker']);
    expect(await cards[1].getText()).toContain('PostgreSQL 15.18');
    expect(element.querySelector('.banner')?.textContent).toContain('Everything is running.');
  });

  it('adds the ingest card when the server runs the ingest, with what it stored', async () => {
    const { fixture, loader, element } = await render();
    http.expectOne('/api/health/details').flush(report(true, { state: 'down', latencyMs: null, detail: 'storing readings has failed since 09:58:30 UTC (7 retries)' }));
    await fixture.whenStable();
    const cards = await loader.getAllHarnesses(MatCardHarness);
    expect(await cards[3].getTitleText()).toBe('Reading ingest');
    expect(await cards[3].getText()).toContain('Down');
    expect(element.querySelector('[data-component="ingest"]')?.textContent).toContain('failed since 09:58:30 UTC');
  });

  it('says what is down when a component is down', async () => {
    const { fixture, element } = await render();
    http.expectOne('/api/health/details').flush(report(false));
    await fixture.whenStable();
    expect(element.querySelector('.banner.down')?.textContent).toContain('Something is down');
    expect(element.querySelector('[data-component="broker"]')?.textContent).toContain('connection refused');
  });

  it('says the server cannot be reached when the request fails outright, and checks again on demand', async () => {
    const { fixture, loader, element } = await render();
    http.expectOne('/api/health/details').error(new ProgressEvent('error'), { status: 0 });
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The server cannot be reached');
    const button = await loader.getHarness(MatButtonHarness.with({ text: /Check now/ }));
    await button.click();
    http.expectOne('/api/health/details').flush(report(true));
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')).toBeNull();
  });

  it('asks for the states only when the visitor is not a manager, and shows no detail lines', async () => {
    TestBed.inject(Session).set(null);
    const { fixture, loader, element } = await render();
    const states = report(false);
    for (const component of Object.values(states.components)) component.detail = '';
    http.expectOne('/api/health').flush(states);
    await fixture.whenStable();
    expect((await loader.getAllHarnesses(MatCardHarness)).length).toBe(3);
    expect(element.querySelectorAll('.detail').length).toBe(0);
    expect(element.querySelector('[data-component="broker"] .state')?.textContent).toBe('Down');
  });
});
