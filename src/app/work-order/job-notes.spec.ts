import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { JobNotes } from './job-notes';
import { configureJobSpec, job, settle } from './work-order-fixtures';

describe('JobNotes', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureJobSpec('contractor')));
  afterEach(() => backend.verify());

  it('saves the findings and notes the technician wrote', async () => {
    const fixture = TestBed.createComponent(JobNotes);
    fixture.componentRef.setInput('job', job({ state: 'on-site', findings: 'Fan blade iced.' }));
    fixture.componentRef.setInput('canEdit', true);
    await settle(fixture);
    const loader = TestbedHarnessEnvironment.loader(fixture);
    const findings = await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="findings"]' }));
    expect(await findings.getValue()).toBe('Fan blade iced.');
    const save = await loader.getHarness(MatButtonHarness.with({ text: 'Save findings and notes' }));
    expect(await save.isDisabled()).toBeTrue(); // nothing changed yet
    await findings.setValue('Fan blade iced; drain clogged.');
    await (await loader.getHarness(MatInputHarness.with({ selector: '[formcontrolname="notes"]' }))).setValue('Back Thursday with a heater.');
    await save.click();
    const call = backend.expectOne((req) => req.url === '/api/work-orders/w1' && req.method === 'PATCH');
    expect(call.request.body).toEqual({ findings: 'Fan blade iced; drain clogged.', notes: 'Back Thursday with a heater.' });
    call.flush(job({ state: 'on-site', findings: 'Fan blade iced; drain clogged.', notes: 'Back Thursday with a heater.' }));
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="status"]')!.textContent).toContain('Saved.');
  });

  it('only shows them when editing is not allowed', async () => {
    const fixture = TestBed.createComponent(JobNotes);
    fixture.componentRef.setInput('job', job({ state: 'verified', findings: 'Replaced the start relay.' }));
    await settle(fixture);
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelector('textarea')).toBeNull();
    expect(element.textContent).toContain('Replaced the start relay.');
  });
});
