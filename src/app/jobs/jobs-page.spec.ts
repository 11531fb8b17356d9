import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { Router } from '@angular/router';
import type { WorkOrderSummary } from '../../../shared/api/work-orders';
import { FakeEventSource, configureJobSpec, jobSummary, settle } from '../work-order/work-order-fixtures';
import { JobsPage, LIVE_RELOAD_DEBOUNCE_MS } from './jobs-page';

@Component({ template: '' })
class Blank {}

const page = (items: WorkOrderSummary[]) => ({ items, total: items.length, page: 0, pageSize: 100 });

describe('JobsPage', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureJobSpec('contractor', [{ path: 'work-orders/:workOrderId', component: Blank }])));
  afterEach(() => backend.verify());

  function expectList(status: 'open' | 'completed') {
    return backend.expectOne((req) => req.url === '/api/work-orders' && req.params.get('status') === status);
  }

  async function render(items: WorkOrderSummary[]) {
    const fixture = TestBed.createComponent(JobsPage);
    fixture.detectChanges();
    await settle(fixture);
    expectList('open').flush(page(items));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement };
  }

  const cards = (element: HTMLElement) => Array.from(element.querySelectorAll<HTMLAnchorElement>('a.job'));

  it('lists open jobs soonest due first, with priority, state, due time, place, access, pet and suspected cause', async () => {
    const later = jobSummary(1, { dueAt: '2026-03-04T18:00:00.000Z', state: 'accepted' });
    const sooner = jobSummary(2, {
      priority: 'urgent',
      overdue: true,
      dueAt: '2026-03-02T18:00:00.000Z',
      suspectedCause: 'evaporator-fan',
      accessWindows: [{ from: '2026-03-03T17:00:00Z', to: '2026-03-03T21:00:00Z' }],
      petPresent: true,
    });
    const { element } = await render([later, sooner]);
    const [first, second] = cards(element);
    expect(cards(element).length).toBe(2);
    expect(first!.getAttribute('href')).toBe('/work-orders/w2');
    expect(first!.classList).toContain('urgent');
    expect(first!.querySelector('.priority')!.textContent).toContain('Urgent');
    expect(first!.querySelector('.due.overdue')!.textContent).toContain('Overdue');
    // 18:00 UTC is 10:00 on the property's clocks (Pacific standard time, UTC−8).
    expect(first!.querySelector('.due')!.textContent).toContain('Mar 2, 10:00');
    expect(first!.querySelector('.place')!.textContent).toContain('Birch Court, unit 2B · 12 Example Lane, Millbrook, OR');
    expect(first!.querySelector('.cause')!.textContent).toContain('Evaporator fan motor stopped');
    expect(first!.querySelector('.access')!.textContent).toContain('Access Mar 3, 09:00 AM – 01:00 PM');
    expect(first!.querySelector('.pet')).not.toBeNull();
    expect(second!.querySelector('.state')!.textContent).toContain('accepted');
    expect(second!.querySelector('.overdue')).toBeNull();
    expect(second!.querySelector('.pet')).toBeNull();
    expect(second!.querySelector('.cause')).toBeNull();
  });

  it('opens a job when its card is tapped', async () => {
    const { fixture, element } = await render([jobSummary(1)]);
    cards(element)[0]!.click();
    await settle(fixture);
    expect(TestBed.inject(Router).url).toBe('/work-orders/w1');
  });

  it('shows completed jobs with the toggle, and back', async () => {
    const { fixture, loader, element } = await render([jobSummary(1)]);
    await (await loader.getHarness(MatSlideToggleHarness.with({ label: 'Show completed jobs' }))).toggle();
    await settle(fixture);
    expectList('completed').flush(page([jobSummary(7, { state: 'completed', title: 'Door seal replaced' })]));
    await settle(fixture);
    expect(cards(element).map((card) => card.querySelector('h2')!.textContent!.trim())).toEqual(['Door seal replaced']);
    await (await loader.getHarness(MatSlideToggleHarness)).toggle();
    await settle(fixture);
    expectList('open').flush(page([]));
    await settle(fixture);
    expect(element.textContent).toContain('No open jobs');
  });

  it('reloads when a job of theirs changes on the live feed', async () => {
    const { fixture, element } = await render([jobSummary(1)]);
    const place = { organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1' };
    FakeEventSource.last!.send({ type: 'live.hello', atMs: 1, role: 'contractor', heartbeatMs: 25000 });
    FakeEventSource.last!.send({ type: 'appliance.health-changed', ...place, atMs: 1, health: 'warm', previous: 'cold' });
    FakeEventSource.last!.send({ type: 'work-order.changed', ...place, atMs: 2, workOrderId: 'w9', serviceRequestId: 'r9', contractorId: 'c1', state: 'dispatched', change: 'dispatched' });
    await new Promise((resolve) => setTimeout(resolve, LIVE_RELOAD_DEBOUNCE_MS + 50));
    expectList('open').flush(page([jobSummary(1), jobSummary(9, { dueAt: '2026-03-05T00:00:00.000Z' })]));
    await settle(fixture);
    expect(cards(element).length).toBe(2);
  });

  it('says what went wrong and tries again', async () => {
    const fixture = TestBed.createComponent(JobsPage);
    fixture.detectChanges();
    await settle(fixture);
    expectList('open').flush({ error: 'database unavailable' }, { status: 503, statusText: 'Service Unavailable' });
    await settle(fixture);
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('Your jobs could not be loaded: database unavailable');
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    await settle(fixture);
    expectList('open').flush(page([jobSummary(1)]));
    await settle(fixture);
    expect(cards(element).length).toBe(1);
    expect(element.querySelector('[role="alert"]')).toBeNull();
  });
});
