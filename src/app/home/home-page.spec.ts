import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatStepperHarness } from '@angular/material/stepper/testing';
import { FakeEventSource, appliance, configureHomeSpec, homeView, request, settle, warmGuidance } from './home-fixtures';
import { HomePage, LIVE_RELOAD_DEBOUNCE_MS } from './home-page';

describe('HomePage', () => {
  let backend: HttpTestingController;

  afterEach(() => backend.verify());

  async function render(user = {}) {
    backend = configureHomeSpec(user);
    const fixture = TestBed.createComponent(HomePage);
    fixture.detectChanges();
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  const homeCall = () => backend.expectOne((req) => req.method === 'GET' && req.url === '/api/tenant/home');

  it('shows each appliance with one health word on the thermal scale and temperatures in the profile unit', async () => {
    const { fixture, element } = await render({ temperatureUnit: 'C' });
    homeCall().flush(homeView([appliance({ health: 'drifting', healthText: 'Drifting: it is slowly getting warmer.', freshFoodC: 5.25, freezerC: -17 })]));
    await settle(fixture);
    const card = element.querySelector<HTMLElement>('cw-appliance-status mat-card')!;
    expect(card.dataset['health']).toBe('drifting');
    expect(card.style.getPropertyValue('--health-colour')).toBe('var(--cw-health-drifting)');
    expect(card.querySelector('.word')?.textContent).toContain('drifting');
    expect(card.textContent).toContain('Drifting: it is slowly getting warmer.');
    const readings = Array.from(card.querySelectorAll('.reading')).map((r) => `${r.querySelector('dt')?.textContent} ${r.querySelector('dd')?.textContent}`);
    expect(readings).toEqual(['Fridge 5.3 °C', 'Freezer -17.0 °C']);
    expect(card.querySelector('.heard')?.textContent).toContain('(Mar 2, 09:50 AM)');
    expect(element.querySelector('.cw-page-lead')?.textContent).toContain('Maple Yard · unit 4B');
  });

  it('shows °F to a tenant who reads Fahrenheit, and only the freezer of a chest freezer', async () => {
    const { fixture, element } = await render();
    homeCall().flush(homeView([appliance({ style: 'chest-freezer', freshFoodC: null, freezerC: -20 })]));
    await settle(fixture);
    const readings = Array.from(element.querySelectorAll('.reading')).map((r) => `${r.querySelector('dt')?.textContent} ${r.querySelector('dd')?.textContent}`);
    // °F = °C × 9/5 + 32 (NIST SP 811, B.8): −20 °C = −4 °F.
    expect(readings).toEqual(['Freezer -4.0 °F']);
  });

  it('gives food-safety guidance with how long, the USDA FSIS source and the health authority, once the fridge was above 40 °F', async () => {
    const { fixture, element } = await render();
    homeCall().flush(homeView([appliance({ health: 'warm', guidance: warmGuidance(150) })]));
    await settle(fixture);
    const card = element.querySelector('cw-food-safety-card')!;
    expect(card.querySelector('.time-above')?.textContent).toContain('above 40 °F for 2 hours 30 minutes — more than 2 hours');
    expect(card.textContent).toContain('about 48 hours');
    expect(card.querySelector('.sources')?.textContent).toContain('Keep Your Food Safe During Emergencies');
    expect(card.querySelector('.sources')?.textContent).toContain('local health authority');
  });

  it('shows no food-safety card while all is cold', async () => {
    const { fixture, element } = await render();
    homeCall().flush(homeView());
    await settle(fixture);
    expect(element.querySelector('cw-food-safety-card')).toBeNull();
  });

  it("shows the open request's progress as a stepper with the visit time", async () => {
    const { fixture, loader } = await render();
    const scheduled = request({
      progress: 'scheduled',
      workOrder: { id: 'w1', state: 'scheduled', contractorName: 'Brightcoil Repairs', scheduledStartAt: '2026-03-03T14:00:00.000Z', scheduledEndAt: '2026-03-03T16:00:00.000Z', dueAt: '2026-03-03T18:00:00.000Z' },
    });
    homeCall().flush(homeView([appliance({ openRequest: scheduled })]));
    await settle(fixture);
    const stepper = await loader.getHarness(MatStepperHarness);
    const steps = await stepper.getSteps();
    expect(await Promise.all(steps.map((step) => step.getLabel()))).toEqual(['Received', 'Dispatched', 'Scheduled', 'Completed']);
    expect(await Promise.all(steps.map((step) => step.isCompleted()))).toEqual([true, true, false, false]);
    expect(await steps[2].isSelected()).toBeTrue();
    const details = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('.detail')).map((p) => p.textContent);
    expect(details[1]).toBe('Brightcoil Repairs has the job and has accepted it.');
    expect(details[2]).toBe('A technician is coming Mar 3, 02:00 PM – Mar 3, 04:00 PM.');
  });

  it('reloads quietly after a live event, debounced', async () => {
    const { fixture, element } = await render();
    homeCall().flush(homeView());
    await settle(fixture);
    FakeEventSource.last!.send({ type: 'live.hello', atMs: 0, role: 'tenant', heartbeatMs: 25000 });
    FakeEventSource.last!.send({ type: 'appliance.health-changed', atMs: 1, health: 'warm', previous: 'cold', organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1' });
    FakeEventSource.last!.send({ type: 'service-request.changed', atMs: 2, serviceRequestId: 'r1', status: 'open', change: 'opened', organizationId: 'o1', propertyId: 'p1', unitId: 'u1', applianceId: 'a1' });
    backend.expectNone('/api/tenant/home');
    await new Promise((resolve) => setTimeout(resolve, LIVE_RELOAD_DEBOUNCE_MS + 50));
    homeCall().flush(homeView([appliance({ health: 'warm', healthText: 'Warm: it is warmer than a safe fridge.', openRequest: request() })]));
    await settle(fixture);
    expect(element.querySelector('.word')?.textContent).toContain('warm');
    expect(element.querySelector('cw-request-progress')).not.toBeNull();
  });

  it("shows the server's message and loads again on request", async () => {
    const { fixture, element, loader } = await render();
    homeCall().flush({ error: 'the database is not answering' }, { status: 503, statusText: 'Unavailable' });
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The database is not answering');
    await (await loader.getHarness(MatButtonHarness.with({ text: 'Try again' }))).click();
    homeCall().flush(homeView());
    await settle(fixture);
    expect(element.querySelector('[role="alert"]')).toBeNull();
    expect(element.querySelector('cw-appliance-status')).not.toBeNull();
  });

  it('says so when the unit has no appliance on record', async () => {
    const { fixture, element } = await render();
    homeCall().flush(homeView([]));
    await settle(fixture);
    expect(element.textContent).toContain('No appliance on record for your unit');
    expect(element.querySelector('cw-report-form')).toBeNull();
  });
});
