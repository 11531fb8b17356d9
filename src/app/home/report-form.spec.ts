import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatCheckboxHarness } from '@angular/material/checkbox/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSelectHarness } from '@angular/material/select/testing';
import type { TenantApplianceView, TenantReportInput } from '../../../shared/api/tenant';
import { appliance, configureHomeSpec, request, settle } from './home-fixtures';
import { ReportForm } from './report-form';

describe('ReportForm', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureHomeSpec()));
  afterEach(() => backend.verify());

  async function render(appliances: TenantApplianceView[] = [appliance()]) {
    const fixture = TestBed.createComponent(ReportForm);
    fixture.componentRef.setInput('appliances', appliances);
    fixture.componentRef.setInput('timeZone', 'UTC');
    await settle(fixture);
    const sent = jasmine.createSpy('sent');
    fixture.componentInstance.sent.subscribe(sent);
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture), sent };
  }

  const tick = async (loader: ReturnType<typeof TestbedHarnessEnvironment.loader>, label: string | RegExp) => (await loader.getHarness(MatCheckboxHarness.with({ label }))).check();
  const send = async (loader: ReturnType<typeof TestbedHarnessEnvironment.loader>) => (await loader.getHarness(MatButtonHarness.with({ text: 'Send report' }))).click();
  const reportCall = () => backend.expectOne((req) => req.method === 'POST' && req.url === '/api/tenant/reports');
  const reportOf = (body: FormData) => JSON.parse(body.get('report') as string) as TenantReportInput;

  function pick(element: HTMLElement, label: string, files: File[]): void {
    const input = element.querySelector<HTMLInputElement>(`input[type="file"][aria-label="${label}"]`)!;
    const transfer = new DataTransfer();
    for (const file of files) transfer.items.add(file);
    input.files = transfer.files;
    input.dispatchEvent(new Event('change'));
  }

  it('offers the symptoms in plain words', async () => {
    const { loader } = await render();
    const boxes = await loader.getAllHarnesses(MatCheckboxHarness);
    const labels = await Promise.all(boxes.map((box) => box.getLabelText()));
    expect(labels).toEqual([
      'The fridge is not cold',
      'The freezer is not cold',
      'Water on the floor',
      'Strange or loud noise',
      'Ice building up',
      "A door won't close or seal",
      'Something else',
      'A pet will be at home (the technician is told before coming in)',
    ]);
  });

  it('sends nothing until a box is ticked, and wants words for "something else"', async () => {
    const { fixture, element, loader } = await render();
    await send(loader);
    await settle(fixture);
    expect(element.textContent).toContain('Tick at least one box.');
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('Check the marked parts of the form.');
    await tick(loader, 'Something else');
    await send(loader);
    await settle(fixture);
    expect(element.textContent).not.toContain('Tick at least one box.');
    expect(element.textContent).toContain('Say what else is wrong.');
    backend.expectNone('/api/tenant/reports');
  });

  it('sends the symptoms, words, access window, pet and photo as one multipart report and confirms', async () => {
    const { fixture, element, loader, sent } = await render();
    await tick(loader, 'The fridge is not cold');
    await tick(loader, 'Water on the floor');
    await (await loader.getHarness(MatInputHarness.with({ selector: 'textarea' }))).setValue('  Puddle under the door since this morning. ');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a time/ }))).click();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="from"]' }))).setValue('2026-03-03T09:00');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="to"]' }))).setValue('2026-03-03T12:00');
    await tick(loader, /A pet will be at home/);
    pick(element, 'Take a photo', [new File(['jpeg bytes'], 'puddle.jpg', { type: 'image/jpeg' })]);
    await settle(fixture);
    expect(element.querySelector('.photo-list')?.textContent).toContain('puddle.jpg');
    await send(loader);

    const call = reportCall();
    const body = call.request.body as FormData;
    const report = reportOf(body);
    expect(report.applianceId).toBe('a1');
    expect(report.symptoms).toEqual(['fridge-not-cold', 'water-on-floor']);
    expect(report.description).toBe('Puddle under the door since this morning.');
    expect(report.petPresent).toBeTrue();
    expect(report.accessWindows).toEqual([{ from: new Date('2026-03-03T09:00').toISOString(), to: new Date('2026-03-03T12:00').toISOString() }]);
    expect((body.getAll('photos') as File[]).map((photo) => photo.name)).toEqual(['puddle.jpg']);
    call.flush({ attached: false, request: request({ source: 'tenant', progress: 'received', workOrder: null, title: 'Tenant report: the fridge is not cold and more' }) });
    await settle(fixture);

    const confirmation = element.querySelector('.confirmation[role="status"]');
    expect(confirmation?.textContent).toContain('Thank you, your report is sent');
    expect(confirmation?.textContent).toContain('A repair request is now open');
    expect(confirmation?.querySelector('cw-request-progress')?.textContent).toContain('Tenant report: the fridge is not cold and more');
    expect(sent).toHaveBeenCalledTimes(1);
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Report something else' }))).click();
    expect(await (await loader.getHarness(MatCheckboxHarness.with({ label: 'Water on the floor' }))).isChecked()).toBeFalse();
  });

  it('shows the open request before sending and says the report joined it', async () => {
    const { fixture, element, loader } = await render([appliance({ openRequest: request({ title: 'Fridge warming', progress: 'dispatched' }) })]);
    expect(element.querySelector('.already-open')?.textContent).toContain('A repair request is already open for this appliance: Fridge warming (dispatched)');
    await tick(loader, 'Strange or loud noise');
    await send(loader);
    reportCall().flush({ attached: true, request: request({ title: 'Fridge warming', symptoms: ['noise'] }) });
    await settle(fixture);
    expect(element.querySelector('.confirmation')?.textContent).toContain('was already open for this appliance, so your report was added to it');
  });

  it('asks which appliance when the unit has several', async () => {
    const freezer = appliance({ id: 'a2', style: 'upright-freezer' });
    const { fixture, element, loader } = await render([appliance(), freezer]);
    await tick(loader, 'The freezer is not cold');
    await send(loader);
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('Choose the appliance the problem is with.');
    backend.expectNone('/api/tenant/reports');
    await (await loader.getHarness(MatSelectHarness)).clickOptions({ text: 'Upright freezer' });
    await send(loader);
    expect(reportOf(reportCall().request.body as FormData).applianceId).toBe('a2');
  });

  it('refuses an access window that ends before it starts', async () => {
    const { fixture, element, loader } = await render();
    await tick(loader, 'Ice building up');
    await (await loader.getHarness(MatButtonHarness.with({ text: /Add a time/ }))).click();
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="from"]' }))).setValue('2026-03-03T12:00');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formControlName="to"]' }))).setValue('2026-03-03T09:00');
    await send(loader);
    await settle(fixture);
    expect(element.querySelector('.window-error')?.textContent).toContain('The end must come after the start.');
    backend.expectNone('/api/tenant/reports');
  });

  it('leaves out a file that is not a picture, and more than five photos', async () => {
    const { fixture, element } = await render();
    pick(element, 'Choose photos', [new File(['x'], 'notes.txt', { type: 'text/plain' })]);
    await settle(fixture);
    expect(element.querySelector('.photos [role="alert"]')?.textContent).toBe('Not added: notes.txt (not a JPEG, PNG or WebP picture).');
    const six = Array.from({ length: 6 }, (_, i) => new File(['p'], `p${i}.png`, { type: 'image/png' }));
    pick(element, 'Choose photos', six);
    await settle(fixture);
    expect(element.querySelectorAll('.photo-list li').length).toBe(5);
    expect(element.querySelector('.photos [role="alert"]')?.textContent).toBe('Not added: p5.png (at most 5 photos fit in one report).');
  });

  it("shows the server's message when the report cannot be sent", async () => {
    const { fixture, element, loader } = await render();
    await tick(loader, "A door won't close or seal");
    await send(loader);
    reportCall().flush({ error: 'a file may be at most 10 MB' }, { status: 413, statusText: 'Too Large' });
    await settle(fixture);
    expect(element.querySelector('.form-error')?.textContent).toContain('A file may be at most 10 MB');
    expect(element.querySelector('.confirmation')).toBeNull();
  });
});
