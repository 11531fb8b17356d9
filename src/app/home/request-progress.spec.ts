import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatStepperHarness } from '@angular/material/stepper/testing';
import type { ServiceRequestView } from '../../../shared/api/service-requests';
import { configureHomeSpec, request, settle } from './home-fixtures';
import { RequestProgress } from './request-progress';

describe('RequestProgress', () => {
  beforeEach(() => configureHomeSpec());

  async function render(view: ServiceRequestView) {
    const fixture = TestBed.createComponent(RequestProgress);
    fixture.componentRef.setInput('request', view);
    fixture.componentRef.setInput('timeZone', 'UTC');
    await settle(fixture);
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  const report = (createdAt: string) => ({ id: createdAt, createdAt, symptoms: ['noise'], description: '', petPresent: false, accessWindows: [], photoIds: [] });

  it('marks every step done once the repair is verified, and counts the reports joined to the request', async () => {
    const { element, loader } = await render(request({ progress: 'verified', reports: [report('2026-03-02T09:00:00.000Z'), report('2026-03-02T11:30:00.000Z')] }));
    const steps = await (await loader.getHarness(MatStepperHarness)).getSteps();
    expect(await Promise.all(steps.map((step) => step.isCompleted()))).toEqual([true, true, true, true]);
    expect(await steps[3].isSelected()).toBeTrue();
    expect(element.querySelector('.reports')?.textContent).toBe('2 reports from your unit on this request, the latest on Mar 2, 11:30 AM.');
    expect(element.querySelectorAll('.detail')[3].textContent).toBe('The repair is done and the temperatures are back to normal.');
  });

  it('says so plainly when the request was cancelled, without a stepper', async () => {
    const { element } = await render(request({ progress: 'cancelled', status: 'cancelled', closeReason: 'the tenant fixed the door' }));
    expect(element.querySelector('mat-stepper')).toBeNull();
    expect(element.querySelector('.cancelled')?.textContent).toContain('This request was cancelled: the tenant fixed the door.');
  });

  it('shows a technician on site on the scheduled step', async () => {
    const { element, loader } = await render(request({ progress: 'technician on site' }));
    const steps = await (await loader.getHarness(MatStepperHarness)).getSteps();
    expect(await steps[2].isSelected()).toBeTrue();
    expect(element.querySelectorAll('.detail')[2].textContent).toBe('The technician is at your unit now.');
  });
});
