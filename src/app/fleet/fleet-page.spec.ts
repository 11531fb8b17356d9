import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatChipListboxHarness } from '@angular/material/chips/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { SessionUser } from '../../../shared/api/session';
import { Session } from '../core/auth/session';
import { apiErrorInterceptor } from '../core/http/api-error.interceptor';
import { EVENT_SOURCE_FACTORY } from '../core/live/live-events';
import { sampleOverview } from './fleet-fixtures';
import { FleetPage, LIVE_RELOAD_DEBOUNCE_MS } from './fleet-page';

const manager: SessionUser = { id: 'm1', email: 'm@example.com', displayName: 'Pat', role: 'manager', isAdmin: false, organizationId: 'o1', unitId: null, temperatureUnit: 'C', timeZone: null };

class FakeEventSource {
  static last: FakeEventSource | null = null;
  onmessage: ((event: MessageEvent<string>) => void) | null = null;
  onerror: ((event: Event) => void) | null = null;
  constructor(readonly url: string) {
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

describe('FleetPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'fleet', component: FleetPage },
          { path: 'appliances/:id', children: [] },
        ]),
        provideHttpClient(withInterceptors([apiErrorInterceptor])),
        provideHttpClientTesting(),
        { provide: EVENT_SOURCE_FACTORY, useValue: (url: string) => new FakeEventSource(url) as unknown as EventSource },
      ],
    });
    TestBed.inject(Session).set(manager);
    http = TestBed.inject(HttpTestingController);
  });
  afterEach(() => http.verify());

  async function open(url = '/fleet') {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(url);
    const element = harness.routeNativeElement!;
    return { harness, element, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
  }

  it('shows each property as a band of unit tiles coloured by health, with the counts per health word', async () => {
    const { harness, element, loader } = await open();
    http.expectOne('/api/fleet').flush(sampleOverview());
    await settle(harness.fixture);
    expect(Array.from(element.querySelectorAll('.band h2')).map((h) => h.textContent?.trim())).toEqual(['Alder House', 'Birch Court']);
    const cells = Array.from(element.querySelectorAll<HTMLAnchorElement>('a.cell'));
    expect(cells.map((cell) => cell.dataset['health'])).toEqual(['warm', 'cold', 'drifting', 'cold', 'silent']);
    expect(cells[0]!.style.background).toContain('var(--cw-health-warm)');
    const nameOf = (cell: Element) => cell.querySelector('.cw-visually-hidden')?.textContent?.trim();
    expect(nameOf(cells[0]!)).toBe('Unit 1A, Top-freezer refrigerator, warm, fresh food 7.5 °C, freezer -18.4 °C, open incident: over temperature, urgent');
    expect(nameOf(cells[4]!)).toContain('past its expected life');
    expect(cells[0]!.getAttribute('href')).toBe('/appliances/a-1a');
    const chips = await (await loader.getHarness(MatChipListboxHarness)).getChips();
    expect(await chips[0]!.getText()).toContain('2');
    expect(element.querySelector('.summary')?.textContent).toContain('5 appliances in 2 properties');
  });

  it('sends the filters as query parameters and keeps them in the page address', async () => {
    const { harness, loader } = await open('/fleet?health=warm&q=1a');
    const request = http.expectOne((req) => req.url === '/api/fleet');
    expect(request.request.params.get('health')).toBe('warm');
    expect(request.request.params.get('q')).toBe('1a');
    request.flush(sampleOverview());
    await settle(harness.fixture);
    const listbox = await loader.getHarness(MatChipListboxHarness);
    await listbox.selectChips({ text: /no cooling/ });
    await settle(harness.fixture);
    const next = http.expectOne((req) => req.url === '/api/fleet');
    expect(next.request.params.get('health')).toBe('warm,no-cooling');
    expect(TestBed.inject(Router).url).toBe('/fleet?health=warm,no-cooling&q=1a');
    next.flush(sampleOverview());
  });

  it('says when no appliance matches the filters, and offers to clear them', async () => {
    const { harness, element, loader } = await open('/fleet?health=no-cooling');
    http.expectOne((req) => req.url === '/api/fleet').flush({ ...sampleOverview(), total: 0, properties: [] });
    await settle(harness.fixture);
    expect(element.querySelector('cw-empty-state')?.textContent).toContain('No appliance matches these filters');
    const clear = await loader.getHarness(MatButtonHarness.with({ text: 'Clear filters', ancestor: 'cw-empty-state' }));
    await clear.click();
    await settle(harness.fixture);
    http.expectOne('/api/fleet').flush(sampleOverview());
  });

  it('shows an error with a way to try again', async () => {
    const { harness, element, loader } = await open();
    http.expectOne('/api/fleet').flush({ error: 'database unavailable' }, { status: 503, statusText: 'Service Unavailable' });
    await settle(harness.fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('database unavailable');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    http.expectOne('/api/fleet').flush(sampleOverview());
    await settle(harness.fixture);
    expect(element.querySelector('[role="alert"]')).toBeNull();
  });

  it('recolours a tile the moment a live health change arrives, then reloads for exact counts', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/fleet').flush(sampleOverview());
    await settle(harness.fixture);
    FakeEventSource.last!.send({ type: 'live.hello', atMs: 0, role: 'manager', heartbeatMs: 25_000 });
    FakeEventSource.last!.send({ type: 'appliance.health-changed', organizationId: 'o1', propertyId: 'p-birch', unitId: 'u-3c', applianceId: 'a-3c', atMs: Date.now(), health: 'no-cooling', previous: 'cold' });
    await settle(harness.fixture);
    const cell = element.querySelector<HTMLElement>('[data-appliance="a-3c"]')!;
    expect(cell.dataset['health']).toBe('no-cooling');
    expect(cell.classList).toContain('changed');
    expect(element.querySelector('.live')?.textContent).toContain('Live');
    await new Promise((resolve) => setTimeout(resolve, LIVE_RELOAD_DEBOUNCE_MS + 100));
    http.expectOne('/api/fleet').flush(sampleOverview());
  });

  it('moves focus between appliances with the arrow keys', async () => {
    const { harness, element } = await open();
    http.expectOne('/api/fleet').flush(sampleOverview());
    await settle(harness.fixture);
    const first = element.querySelector<HTMLElement>('[data-cell="0"]')!;
    first.focus();
    first.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    expect(document.activeElement?.getAttribute('data-cell')).toBe('1');
    (document.activeElement as HTMLElement).dispatchEvent(new KeyboardEvent('keydown', { key: 'End', bubbles: true }));
    expect(document.activeElement?.getAttribute('data-cell')).toBe('4');
  });
});
