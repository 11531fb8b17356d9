import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import type { WorkOrderView } from '../../../shared/api/work-orders';
import { JobCosts } from './job-costs';
import { configureJobSpec, job, settle } from './work-order-fixtures';

describe('JobCosts', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureJobSpec('contractor')));
  afterEach(() => backend.verify());

  async function render(view: WorkOrderView, canRecord = true) {
    const fixture = TestBed.createComponent(JobCosts);
    fixture.componentRef.setInput('job', view);
    fixture.componentRef.setInput('canRecord', canRecord);
    const emitted: WorkOrderView[] = [];
    fixture.componentInstance.changed.subscribe((next) => emitted.push(next));
    await settle(fixture);
    return { fixture, loader: TestbedHarnessEnvironment.loader(fixture), element: fixture.nativeElement as HTMLElement, emitted };
  }

  const input = (loader: Awaited<ReturnType<typeof render>>['loader'], name: string) => loader.getHarness(MatInputHarness.with({ selector: `[formcontrolname="${name}"]` }));

  it('records a part with its cost in integer cents and the job’s currency', async () => {
    const { fixture, loader, emitted } = await render(job({ state: 'on-site' }));
    await (await input(loader, 'name')).setValue('Evaporator fan motor');
    await (await input(loader, 'quantity')).setValue('2');
    await (await input(loader, 'unitCost')).setValue('48.29');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add part/ }))).click();
    const call = backend.expectOne((req) => req.url === '/api/work-orders/w1/parts' && req.method === 'POST');
    expect(call.request.body).toEqual({ name: 'Evaporator fan motor', quantity: 2, unitCostCents: 4829, currency: 'USD' });
    const after = job({ state: 'on-site', parts: [{ id: 'p1', name: 'Evaporator fan motor', quantity: 2, unitCostCents: 4829, currency: 'USD' }] });
    call.flush(after);
    await settle(fixture);
    expect(emitted).toEqual([after]);
    expect(await (await input(loader, 'name')).getValue()).toBe(''); // ready for the next part
    // The emptied form is not marked as wrong before the next part is typed.
    const fields = await loader.getAllHarnesses(MatFormFieldHarness);
    expect(await Promise.all(fields.map((field) => field.hasErrors()))).not.toContain(true);
  });

  it('records labour as minutes and an hourly rate', async () => {
    const { loader } = await render(job({ state: 'on-site' }));
    await (await input(loader, 'minutes')).setValue('45');
    await (await input(loader, 'hourlyRate')).setValue('95');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add labour/ }))).click();
    const call = backend.expectOne('/api/work-orders/w1/labour');
    expect(call.request.body).toEqual({ minutes: 45, hourlyRateCents: 9500 });
    call.flush(job());
  });

  it('refuses an amount that is not money and a fractional quantity, without asking the server', async () => {
    const { fixture, loader, element } = await render(job({ state: 'on-site' }));
    await (await input(loader, 'name')).setValue('Door gasket');
    await (await input(loader, 'quantity')).setValue('1.5');
    await (await input(loader, 'unitCost')).setValue('twelve');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add part/ }))).click();
    await settle(fixture);
    expect(element.textContent).toContain('An amount such as 24.50.');
    expect(element.textContent).toContain('A whole number from 1 to 1000.');
    backend.expectNone('/api/work-orders/w1/parts');
  });

  it('shows the server’s refusal', async () => {
    const { fixture, loader, element } = await render(job({ state: 'on-site' }));
    await (await input(loader, 'minutes')).setValue('30');
    await (await input(loader, 'hourlyRate')).setValue('80.00');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add labour/ }))).click();
    backend.expectOne('/api/work-orders/w1/labour').flush({ error: 'a work order that is verified takes no more records' }, { status: 409, statusText: 'Conflict' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')!.textContent).toContain('takes no more records');
  });

  it('lists the lines with their amounts and the totals, and offers no forms when recording is not allowed', async () => {
    const { element } = await render(
      job({
        parts: [{ id: 'p1', name: 'Defrost heater', quantity: 1, unitCostCents: 3999, currency: 'USD' }],
        labour: [{ id: 'l1', minutes: 50, hourlyRateCents: 8500, currency: 'USD' }],
        // 50 min × $85.00/h = $70.833…, rounded to the cent as the server does.
        totals: { parts: { cents: 3999, currency: 'USD' }, labour: { cents: 7083, currency: 'USD' }, total: { cents: 11082, currency: 'USD' } },
      }),
      false,
    );
    expect(element.querySelector('form')).toBeNull();
    const lines = Array.from(element.querySelectorAll('.lines li')).map((li) => Array.from(li.children, (cell) => cell.textContent!.trim()).join(' | '));
    expect(lines).toEqual(['1 × Defrost heater at $39.99 | $39.99', '50 min at $85.00/h | $70.83']);
    expect(element.querySelector('.total dd')!.textContent!.replace(/\s+/g, ' ').trim()).toBe('$110.82 USD');
  });
});
