import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HarnessLoader } from '@angular/cdk/testing';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { Router } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import { configureTableSpec, incident, page, request, settle, workOrder } from '../shared/data-table/testing';
import { RequestPage } from './request-page';

const REPORTED: ServiceRequestView = request(1, {
  source: 'monitor',
  incident: incident(1),
  reports: [
    {
      id: 't1',
      createdAt: '2026-11-02T17:00:00.000Z',
      symptoms: ['warm inside', 'loud clicking'],
      description: 'Milk went sour overnight.',
      petPresent: true,
      accessWindows: [{ from: '2026-11-03T15:00:00.000Z', to: '2026-11-03T19:00:00.000Z' }],
      photoIds: ['ph1'],
    },
  ],
});

describe('RequestPage', () => {
  let http: HttpTestingController;
  let root: HarnessLoader;

  beforeEach(() => {
    ({ http } = configureTableSpec([
      { path: 'requests/:requestId', component: RequestPage },
      { path: 'appliances/:id', children: [] },
      { path: 'work-orders/:id', children: [] },
    ]));
  });
  afterEach(() => http.verify());

  function answer(view: ServiceRequestView, jobs = [workOrder(1, { state: 'declined' })]): void {
    http.expectOne(`/api/service-requests/${view.id}`).flush(view);
    const list = http.expectOne((req) => req.url === '/api/work-orders');
    expect(list.request.params.get('serviceRequestId')).toBe(view.id);
    expect(list.request.params.get('status')).toBe('all');
    list.flush(page(jobs));
  }

  async function open(view: ServiceRequestView = REPORTED) {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl(`/requests/${view.id}`);
    await settle(harness.fixture);
    answer(view);
    await settle(harness.fixture);
    root = TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
    return { harness, element: harness.routeNativeElement!, loader: TestbedHarnessEnvironment.loader(harness.fixture) };
  }

  async function dialog(): Promise<MatDialogHarness> {
    return root.getHarness(MatDialogHarness);
  }

  /** A dialog closes after its exit animation; then the page makes its call. */
  async function closed(fixture: Parameters<typeof settle>[0]): Promise<void> {
    await new Promise((resolve) => setTimeout(resolve, 300));
    await settle(fixture);
  }

  it('shows the summary, the incident, the tenant’s report with photos, access window and pet, and the work orders', async () => {
    const { element } = await open();
    const text = element.textContent ?? '';
    expect(element.querySelector('h1')?.textContent).toBe('Fridge not cooling 1');
    expect(text).toContain('Linden Court');
    expect(text).toContain('monitor finding');
    expect(element.querySelector<HTMLAnchorElement>('a[href="/appliances/a1"]')?.textContent).toContain('top-freezer RT18');
    expect(text).toContain('no cooling');
    expect(text).toContain('critical');
    expect(text).toContain('Milk went sour overnight.');
    expect(text).toContain('yes, a pet may be in the unit');
    // 15:00 UTC is 08:00 in the property's zone (America/Denver).
    expect(text).toContain('Nov 3, 2026, 08:00 AM MST – 12:00 PM');
    expect(element.querySelector<HTMLImageElement>('img[alt="Photo 1 of the tenant report"]')?.getAttribute('src')).toBe('/api/attachments/ph1/thumbnail');
    expect(element.querySelector<HTMLAnchorElement>('a[href="/work-orders/w1"]')?.textContent).toContain('Frostline Repair');
    expect(text).toContain('declined');
  });

  it('dispatches to a contractor picked by hand, after confirming', async () => {
    const { harness, loader } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Dispatch/ }))).click();
    http.expectOne('/api/contractors').flush([
      { id: 'c1', name: 'Frostline Repair', email: 'a@example.com', phone: '', archivedAt: null, members: [] },
      { id: 'c2', name: 'Coldbay Service', email: 'b@example.com', phone: '', archivedAt: null, members: [] },
      { id: 'c3', name: 'Gone Fixers', email: 'c@example.com', phone: '', archivedAt: '2026-01-01T00:00:00.000Z', members: [] },
    ]);
    await settle(harness.fixture);
    const confirm = await dialog();
    expect(await confirm.getTitleText()).toBe('Dispatch a technician');
    const select = await confirm.getHarness(MatSelectHarness);
    expect(await select.getValueText()).toBe('The contractor covering this property');
    await select.open();
    expect((await select.getOptions()).length).toBe(3);
    await select.clickOptions({ text: 'Coldbay Service' });
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Dispatch' }))).click();
    await closed(harness.fixture);
    const post = http.expectOne('/api/service-requests/r1/dispatch');
    expect(post.request.body).toEqual({ contractorId: 'c2' });
    post.flush({ ...REPORTED, workOrder: { id: 'w2', state: 'dispatched', contractorName: 'Coldbay Service', scheduledStartAt: null, scheduledEndAt: null, dueAt: '2026-11-02T20:00:00.000Z' } });
    await settle(harness.fixture);
    answer(REPORTED, [workOrder(2, { contractor: { id: 'c2', name: 'Coldbay Service' } })]);
    await settle(harness.fixture);
    expect(harness.routeNativeElement!.textContent).toContain('Coldbay Service');
  });

  it('cancels only with a reason and shows the server’s refusal in words', async () => {
    const { harness, loader, element } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Cancel request/ }))).click();
    await settle(harness.fixture);
    const confirm = await dialog();
    const go = await confirm.getHarness(MatButtonHarness.with({ text: 'Cancel the request' }));
    expect(await go.isDisabled()).toBeTrue();
    await (await confirm.getHarness(MatInputHarness)).setValue('Tenant moved out');
    expect(await go.isDisabled()).toBeFalse();
    await go.click();
    await closed(harness.fixture);
    const post = http.expectOne('/api/service-requests/r1/cancel');
    expect(post.request.body).toEqual({ reason: 'Tenant moved out' });
    post.flush({ error: 'the request is closed' }, { status: 409, statusText: 'Conflict' });
    await settle(harness.fixture);
    expect(element.querySelector('[role=alert]')?.textContent).toContain('The request is closed');
  });

  it('keeps the request as it was when the dialog is dismissed', async () => {
    const { harness, loader } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Make it routine/ }))).click();
    await settle(harness.fixture);
    await (await (await dialog()).getHarness(MatButtonHarness.with({ text: 'Keep as is' }))).click();
    await closed(harness.fixture);
    http.expectNone('/api/service-requests/r1');
  });

  it('changes the priority after confirming', async () => {
    const { harness, loader } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Make it routine/ }))).click();
    await settle(harness.fixture);
    await (await (await dialog()).getHarness(MatButtonHarness.with({ text: 'Make it routine' }))).click();
    await closed(harness.fixture);
    const patch = http.expectOne((req) => req.method === 'PATCH');
    expect(patch.request.body).toEqual({ priority: 'routine' });
    patch.flush({ ...REPORTED, priority: 'routine' });
    await settle(harness.fixture);
    answer({ ...REPORTED, priority: 'routine' });
    await settle(harness.fixture);
    expect(await (await loader.getHarness(MatButtonHarness.with({ text: /Make it urgent/ }))).isDisabled()).toBeFalse();
  });

  it('merges into another open request of the property and goes there', async () => {
    const { harness, loader } = await open();
    await (await loader.getHarness(MatButtonHarness.with({ text: /Merge/ }))).click();
    const others = http.expectOne((req) => req.url === '/api/service-requests' && req.params.get('propertyId') === 'p1');
    expect(others.request.params.get('status')).toBe('open');
    others.flush(page([REPORTED, request(5, { title: 'Ice maker leaking', place: { propertyName: 'Linden Court', timeZone: 'America/Denver', unitLabel: '3C', applianceLabel: null } })]));
    await settle(harness.fixture);
    const confirm = await dialog();
    const select = await confirm.getHarness(MatSelectHarness);
    expect(await select.getValueText()).toBe('Ice maker leaking · 3C');
    await (await confirm.getHarness(MatButtonHarness.with({ text: 'Merge' }))).click();
    await closed(harness.fixture);
    const post = http.expectOne('/api/service-requests/r1/merge');
    expect(post.request.body).toEqual({ intoRequestId: 'r5' });
    post.flush(request(5));
    await settle(harness.fixture);
    expect(TestBed.inject(Router).url).toBe('/requests/r5');
    answer(request(5));
    await settle(harness.fixture);
  });

  it('says why a load failed', async () => {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/requests/r9');
    await settle(harness.fixture);
    http.expectOne((req) => req.url === '/api/work-orders').flush(page([]));
    http.expectOne('/api/service-requests/r9').flush({ error: 'service request not found' }, { status: 404, statusText: 'Not Found' });
    await settle(harness.fixture);
    expect(harness.routeNativeElement!.querySelector('[role=alert]')?.textContent).toContain('Service request not found');
  });

  it('offers no actions on a closed request', async () => {
    const closed = await open(request(2, { status: 'cancelled', closedAt: '2026-11-04T00:00:00.000Z', closeReason: 'duplicate' }));
    expect(await closed.loader.getAllHarnesses(MatButtonHarness.with({ text: /Dispatch|Merge|Cancel request/ }))).toEqual([]);
    expect(closed.element.textContent).toContain('duplicate');
  });
});
