import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatDialogHarness } from '@angular/material/dialog/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import { RouterTestingHarness } from '@angular/router/testing';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import type { Role } from '../../../shared/domain';
import { sampleHistory } from '../appliance/appliance-fixtures';
import { FakeEventSource, configureJobSpec, job, settle } from './work-order-fixtures';
import type { RequestReports } from './work-order-api';
import { LIVE_RELOAD_DEBOUNCE_MS, WorkOrderPage } from './work-order-page';

@Component({ template: '' })
class Blank {}

describe('WorkOrderPage', () => {
  let backend: HttpTestingController;

  afterEach(() => backend.verify());

  function setUp(role: Role) {
    backend = configureJobSpec(role, [
      { path: 'work-orders/:workOrderId', component: WorkOrderPage },
      { path: 'jobs', component: Blank },
      { path: 'work-orders', component: Blank },
    ]);
  }

  function answerHistory() {
    const request = backend.expectOne((req) => req.url === '/api/appliances/a1/history');
    request.flush(sampleHistory(Date.parse(request.request.params.get('from')!), Date.parse(request.request.params.get('to')!)));
    return request;
  }

  function answerRequest(request: Partial<RequestReports> = {}) {
    backend.expectOne('/api/service-requests/r1').flush({ id: 'r1', source: 'monitor', description: '', reports: [], ...request });
  }

  async function open(view: WorkOrderView = job(), request: Partial<RequestReports> = {}) {
    const harness = await RouterTestingHarness.create();
    await harness.navigateByUrl('/work-orders/w1');
    backend.expectOne('/api/work-orders/w1').flush(view);
    await settle(harness.fixture);
    answerRequest(request);
    const history = view.applianceId ? answerHistory() : null;
    await settle(harness.fixture);
    const loader = TestbedHarnessEnvironment.documentRootLoader(harness.fixture);
    return { harness, loader, element: harness.routeNativeElement!, history };
  }

  /** A dialog's result arrives once its closing animation ends. */
  async function dialogClosed(loader: Awaited<ReturnType<typeof open>>['loader']) {
    for (let waitedMs = 0; waitedMs < 2000 && (await loader.getAllHarnesses(MatDialogHarness)).length; waitedMs += 20) await new Promise((resolve) => setTimeout(resolve, 20));
    await new Promise((resolve) => setTimeout(resolve));
  }

  const button = (loader: Awaited<ReturnType<typeof open>>['loader'], text: string | RegExp) => loader.getHarness(MatButtonHarness.with({ text }));
  const buttons = async (loader: Awaited<ReturnType<typeof open>>['loader']) => Promise.all((await loader.getAllHarnesses(MatButtonHarness)).map((b) => b.getText()));

  describe('for the contractor', () => {
    beforeEach(() => setUp('contractor'));

    it('shows the state, priority and due time, the cautions, the place and access, the diagnosis and the chart around the incident', async () => {
      const { element, history } = await open(job({ priority: 'urgent', overdue: true }));
      expect(element.querySelector('h1')!.textContent).toContain('Fridge warming in unit 1B');
      expect(element.querySelector('.chip.state')!.textContent).toContain('New — waiting for you to accept');
      expect(element.querySelector('.chip.urgent')!.textContent).toContain('Urgent');
      expect(element.querySelector('.chip.overdue')!.textContent).toContain('Overdue — was due Mar 3, 07:00 AM');
      const cautions = element.querySelector('cw-safety-cautions')!.textContent!;
      expect(cautions).toContain('Disconnect power');
      expect(cautions).toContain('meter');
      expect(cautions).toContain('EPA Section 608');
      expect(cautions).toContain('local codes and licensed practice');
      const place = element.querySelector('cw-job-place')!.textContent!;
      expect(place).toContain('12 Example Lane, Millbrook, OR');
      expect(place).toContain('Mar 3, 09:00 AM – 01:00 PM');
      expect(place).toContain('A pet lives in the unit');
      expect(place).toContain('The fridge is not cold');
      expect(place).toContain('model TF-18');
      // Causes most likely first, with the parts and checks of the top one.
      const causes = Array.from(element.querySelectorAll('cw-job-diagnosis .cause')).map((c) => `${c.querySelector('.cause-title')!.textContent} ${c.querySelector('.percent')!.textContent}`);
      expect(causes).toEqual(['Evaporator fan motor stopped 70 %', 'Automatic defrost not working 20 %']);
      const diagnosis = element.querySelector('cw-job-diagnosis')!.textContent!;
      expect(diagnosis).toContain('Evaporator fan motor (matching model)');
      expect(diagnosis).toContain('measure line voltage');
      // The chart asks for the window the server gave: 12 hours before the incident to now.
      expect(history!.request.params.get('from')).toBe('2026-03-01T20:00:00.000Z');
      expect(history!.request.params.get('to')).toBe('2026-03-02T16:00:00.000Z');
      expect(element.querySelector('cw-reading-chart')).not.toBeNull();
    });

    it('shows what the tenant reported, in words and photos', async () => {
      const report = { id: 't1', createdAt: '2026-03-02T16:30:00.000Z', symptoms: ['fridge-not-cold', 'noise'], description: 'Milk went sour overnight', petPresent: true, accessWindows: [], photoIds: ['ph1'] };
      const { element } = await open(job(), { source: 'tenant', reports: [report] });
      const reports = element.querySelector('cw-tenant-reports')!;
      expect(reports.textContent).toContain('Tenant, Mar 2, 08:30 AM');
      expect(reports.textContent).toContain('The fridge is not cold; Strange or loud noise');
      expect(reports.textContent).toContain('“Milk went sour overnight”');
      expect(reports.querySelector('a')!.getAttribute('href')).toBe('/api/attachments/ph1');
      expect(reports.querySelector('img')!.getAttribute('src')).toBe('/api/attachments/ph1/thumbnail');
    });

    it('leaves the report card out when there is nothing reported in words', async () => {
      const { element } = await open();
      expect(element.querySelector('cw-tenant-reports mat-card')).toBeNull();
    });

    it('shows the parts and checks of another cause when it is tapped', async () => {
      const { harness, element } = await open();
      element.querySelectorAll<HTMLButtonElement>('cw-job-diagnosis .cause')[1]!.click();
      await settle(harness.fixture);
      expect(element.querySelector('cw-job-diagnosis .repair')!.textContent).toContain('Defrost heater');
    });

    it('accepts a dispatched job and offers the next steps in order', async () => {
      const { harness, loader } = await open();
      expect(await buttons(loader)).toEqual(jasmine.arrayContaining(['check_circleAccept the job', 'blockDecline…']));
      expect((await buttons(loader)).some((text) => text.includes('Complete'))).toBeFalse();
      await (await button(loader, /Accept the job/)).click();
      const call = backend.expectOne((req) => req.url === '/api/work-orders/w1/accept' && req.method === 'POST');
      call.flush(job({ state: 'accepted' }));
      await settle(harness.fixture);
      const now = await buttons(loader);
      expect(now).toContain('eventSchedule the visit');
      expect(now).toContain('where_to_voteI am on site');
      expect(now.some((text) => text.includes('Accept'))).toBeFalse();
    });

    it('declines with a reason given in a dialog', async () => {
      const { harness, loader } = await open();
      await (await button(loader, /Decline/)).click();
      await settle(harness.fixture);
      const dialog = await loader.getHarness(MatDialogHarness);
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Decline' }))).click();
      expect(await (await dialog.getHarness(MatInputHarness)).getValue()).toBe('');
      expect(await (await dialog.host()).text()).toContain('Say why');
      await (await dialog.getHarness(MatInputHarness)).setValue('No technician free this week');
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Decline' }))).click();
      await settle(harness.fixture);
      await dialogClosed(loader);
      const call = backend.expectOne('/api/work-orders/w1/decline');
      expect(call.request.body).toEqual({ reason: 'No technician free this week' });
      call.flush(job({ state: 'declined' }));
      await settle(harness.fixture);
      expect(harness.routeNativeElement!.querySelector('cw-job-actions')!.textContent).toContain('You declined this job.');
    });

    it('schedules the visit on the property’s clocks, from the tenant’s access window', async () => {
      // A window far ahead, so "still ahead" holds whenever the spec runs.
      const { harness, loader } = await open(job({ state: 'accepted', accessWindows: [{ from: '2030-03-05T17:00:00Z', to: '2030-03-05T21:00:00Z' }] }));
      await (await button(loader, /Schedule the visit/)).click();
      const start = await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="start"]' }));
      // 17:00 UTC is 09:00 in Los Angeles: UTC−8 until daylight saving time starts on March 10, 2030 (IANA tz database).
      expect(await start.getValue()).toBe('2030-03-05T09:00');
      expect(await (await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="end"]' }))).getValue()).toBe('2030-03-05T13:00');
      await start.setValue('2030-03-05T10:00');
      await (await button(loader, 'Save the visit')).click();
      const call = backend.expectOne('/api/work-orders/w1/schedule');
      expect(call.request.body).toEqual({ startAt: '2030-03-05T18:00:00.000Z', endAt: '2030-03-05T21:00:00.000Z' });
      call.flush(job({ state: 'scheduled', scheduledStartAt: '2030-03-05T18:00:00.000Z', scheduledEndAt: '2030-03-05T21:00:00.000Z' }));
      await settle(harness.fixture);
      expect(await buttons(loader)).toContain('eventMove the visit');
      expect(harness.routeNativeElement!.querySelector('cw-job-place')!.textContent).toContain('Mar 5, 10:00 AM – 01:00 PM');
    });

    it('refuses a visit that ends before it starts, before asking the server', async () => {
      const { harness, loader, element } = await open(job({ state: 'accepted' }));
      await (await button(loader, /Schedule the visit/)).click();
      await (await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="start"]' }))).setValue('2030-03-05T12:00');
      await (await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="end"]' }))).setValue('2030-03-05T11:00');
      await (await button(loader, 'Save the visit')).click();
      await settle(harness.fixture);
      expect(element.querySelector('cw-job-actions [role="alert"]')!.textContent).toContain('The visit must end after it starts.');
    });

    it('arrives, then completes with the cause found and the findings', async () => {
      const { harness, loader } = await open(job({ state: 'scheduled' }));
      await (await button(loader, /I am on site/)).click();
      backend.expectOne('/api/work-orders/w1/arrive').flush(job({ state: 'on-site' }));
      await settle(harness.fixture);
      await (await button(loader, /Complete the job/)).click();
      await settle(harness.fixture);
      const dialog = await loader.getHarness(MatDialogHarness);
      const cause = await dialog.getHarness(MatSelectHarness);
      expect(await cause.getValueText()).toBe('Evaporator fan motor stopped'); // the suspected cause, ready to confirm
      await cause.clickOptions({ text: 'Something else (say what)' });
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Complete' }))).click();
      expect(await (await dialog.host()).text()).toContain('Say what the cause was.');
      expect(await (await dialog.host()).text()).toContain('Write what you found and did.');
      await (await dialog.getHarness(MatInputHarness.with({ selector: '[formcontrolname="causeNote"]' }))).setValue('Door switch stuck');
      await (await dialog.getHarness(MatInputHarness.with({ selector: '[formcontrolname="findings"]' }))).setValue('Replaced the door switch; fan runs.');
      await (await dialog.getHarness(MatButtonHarness.with({ text: 'Complete' }))).click();
      await dialogClosed(loader);
      const call = backend.expectOne('/api/work-orders/w1/complete');
      expect(call.request.body).toEqual({ causeFound: 'other', causeNote: 'Door switch stuck', findings: 'Replaced the door switch; fan runs.', notes: '' });
      call.flush(job({ state: 'completed', causeFound: 'other', causeNote: 'Door switch stuck', costStatus: 'pending' }));
      await settle(harness.fixture);
      expect(harness.routeNativeElement!.querySelector('cw-job-notes')!.textContent).toContain('Cause found: Something else — Door switch stuck');
    });

    it('asks for a return visit when the job was reopened', async () => {
      const { element, loader } = await open(job({ state: 'reopened', reopenedCount: 1 }));
      expect(element.querySelector('cw-job-actions .reopened')!.textContent).toContain('schedule a return visit');
      const offered = await buttons(loader);
      expect(offered).toContain('eventSchedule the visit');
      expect(offered).toContain('where_to_voteI am on site');
    });

    it('shows the server’s refusal of a step', async () => {
      const { harness, loader, element } = await open();
      await (await button(loader, /Accept the job/)).click();
      backend.expectOne('/api/work-orders/w1/accept').flush({ error: 'a work order that is cancelled cannot become accepted' }, { status: 409, statusText: 'Conflict' });
      await settle(harness.fixture);
      expect(element.querySelector('cw-job-actions [role="alert"]')!.textContent).toContain('cannot become accepted');
    });

    it('has no manager decisions', async () => {
      const { element, loader } = await open(job({ state: 'completed', costStatus: 'pending' }));
      expect(element.querySelector('cw-cost-review')).toBeNull();
      expect((await buttons(loader)).some((text) => /Approve|Dispute|Verify/.test(text))).toBeFalse();
    });

    it('reloads when the job changes on the live feed', async () => {
      const { harness, element } = await open();
      const place = { organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1' };
      FakeEventSource.last!.send({ type: 'work-order.changed', ...place, atMs: 1, workOrderId: 'other', serviceRequestId: 'r2', contractorId: 'c1', state: 'accepted', change: 'accepted' });
      FakeEventSource.last!.send({ type: 'work-order.changed', ...place, atMs: 2, workOrderId: 'w1', serviceRequestId: 'r1', contractorId: 'c1', state: 'cancelled', change: 'cancelled' });
      await new Promise((resolve) => setTimeout(resolve, LIVE_RELOAD_DEBOUNCE_MS + 50));
      backend.expectOne('/api/work-orders/w1').flush(job({ state: 'cancelled' }));
      await settle(harness.fixture);
      expect(element.querySelector('.chip.state')!.textContent).toContain('Cancelled');
    });

    it('says plainly when the job is not theirs', async () => {
      const harness = await RouterTestingHarness.create();
      await harness.navigateByUrl('/work-orders/w1');
      backend.expectOne('/api/work-orders/w1').flush({ error: 'work order not found' }, { status: 404, statusText: 'Not Found' });
      await settle(harness.fixture);
      expect(harness.routeNativeElement!.textContent).toContain('No such work order');
      expect(harness.routeNativeElement!.querySelector('a[href="/jobs"]')).not.toBeNull();
    });
  });

  describe('for the manager', () => {
    beforeEach(() => setUp('manager'));

    const recorded = () =>
      job({
        state: 'completed',
        costStatus: 'pending',
        causeFound: 'evaporator-fan',
        findings: 'Fan motor seized; replaced.',
        notes: 'Tenant home all day.',
        parts: [{ id: 'pt1', name: 'Evaporator fan motor', quantity: 1, unitCostCents: 4850, currency: 'USD' }],
        labour: [{ id: 'lb1', minutes: 45, hourlyRateCents: 9500, currency: 'USD' }],
        totals: { parts: { cents: 4850, currency: 'USD' }, labour: { cents: 7125, currency: 'USD' }, total: { cents: 11975, currency: 'USD' } },
        events: [
          { at: '2026-03-02T15:00:00.000Z', actor: null, type: 'dispatched', fromState: null, toState: 'dispatched', detail: {} },
          { at: '2026-03-03T18:30:00.000Z', actor: { userId: 'contractor-1', displayName: 'Robin Tech' }, type: 'part-recorded', fromState: null, toState: null, detail: { name: 'Evaporator fan motor', quantity: 1 } },
        ],
      });

    it('sees everything recorded, read-only, with the log of who did what', async () => {
      const { element, loader } = await open(recorded());
      expect(element.querySelector('cw-job-actions')).toBeNull();
      expect(element.querySelector('a[href="/work-orders"]')).not.toBeNull();
      expect(element.querySelector('cw-job-costs form')).toBeNull();
      expect(element.querySelector('cw-job-costs')!.textContent).toContain('1 × Evaporator fan motor at $48.50');
      expect(element.querySelector('cw-job-costs .total')!.textContent).toContain('$119.75');
      expect(element.querySelector('cw-job-notes')!.textContent).toContain('Fan motor seized; replaced.');
      expect(element.querySelector('cw-job-notes textarea')).toBeNull();
      const log = Array.from(element.querySelectorAll('cw-event-log li')).map((li) => li.textContent!.replace(/\s+/g, ' ').trim());
      expect(log[0]).toContain('Part recorded · Robin Tech');
      expect(log[0]).toContain('1 × Evaporator fan motor');
      expect(log[1]).toContain('Dispatched · Chillwarden');
      expect((await buttons(loader)).some((text) => text.includes('Accept'))).toBeFalse();
    });

    it('approves the cost', async () => {
      const { harness, loader, element } = await open(recorded());
      await (await button(loader, /Approve the cost/)).click();
      const call = backend.expectOne('/api/work-orders/w1/cost/approve');
      expect(call.request.body).toEqual({});
      call.flush({ ...recorded(), costStatus: 'approved' });
      await settle(harness.fixture);
      expect(element.querySelector('cw-cost-review')!.textContent).toContain('Approved');
    });

    it('disputes the cost only with a note', async () => {
      const { harness, loader, element } = await open(recorded());
      await (await button(loader, /Dispute the cost/)).click();
      expect(element.querySelector('cw-cost-review [role="alert"]')!.textContent).toContain('Say what is wrong');
      await (await loader.getHarness(MatInputHarness.with({ ancestor: 'cw-cost-review' }))).setValue('Labour rate above the agreed 80.00');
      await (await button(loader, /Dispute the cost/)).click();
      const call = backend.expectOne('/api/work-orders/w1/cost/dispute');
      expect(call.request.body).toEqual({ note: 'Labour rate above the agreed 80.00' });
      call.flush({ ...recorded(), costStatus: 'disputed', costNote: 'Labour rate above the agreed 80.00' });
      await settle(harness.fixture);
      expect(element.querySelector('cw-job-costs')!.textContent).toContain('Manager’s note: Labour rate above the agreed 80.00');
    });

    it('verifies the repair by hand', async () => {
      const { harness, loader } = await open(recorded());
      await (await button(loader, /Verify the repair by hand/)).click();
      backend.expectOne('/api/work-orders/w1/verify').flush({ ...recorded(), state: 'verified' });
      await settle(harness.fixture);
      expect((await buttons(loader)).some((text) => text.includes('Verify'))).toBeFalse();
    });

    it('sees the visits on site, and a plain word when the readings are not shared', async () => {
      const harness = await RouterTestingHarness.create();
      await harness.navigateByUrl('/work-orders/w1');
      backend.expectOne('/api/work-orders/w1').flush({ ...recorded(), visits: [{ id: 'v1', arrivedAt: '2026-03-03T18:05:00.000Z', leftAt: '2026-03-03T19:20:00.000Z', notes: '' }] });
      await settle(harness.fixture);
      answerRequest();
      backend.expectOne((req) => req.url === '/api/appliances/a1/history').flush({ error: 'appliance not found' }, { status: 404, statusText: 'Not Found' });
      await settle(harness.fixture);
      const element = harness.routeNativeElement!;
      expect(element.querySelector('cw-job-place [aria-label="Visits"]')!.textContent).toContain('Mar 3, 10:05 AM – 11:20 AM');
      expect(element.querySelector('cw-incident-chart')!.textContent).toContain('a contractor sees them only while the job is open');
      expect(element.querySelector('cw-reading-chart')).toBeNull();
    });

    it('has nothing to decide before completion', async () => {
      const { element, loader } = await open(job({ state: 'scheduled' }));
      expect(element.querySelector('cw-cost-review')!.textContent).toContain('Nothing to decide yet');
      expect((await buttons(loader)).some((text) => /Approve|Dispute|Verify/.test(text))).toBeFalse();
    });
  });
});
