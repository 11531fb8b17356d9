import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatCardHarness } from '@angular/material/card/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import type { IncidentWithFindings } from '../../../shared/api/appliances';
import { CAUSES } from '../../../shared/causes';
import { openIncident } from './appliance-fixtures';
import { DiagnosisCard } from './diagnosis-card';

@Component({
  imports: [DiagnosisCard],
  template: `<cw-diagnosis-card [incident]="incident()" timeZone="America/New_York" />`,
})
class Host {
  readonly incident = signal<IncidentWithFindings | null>(openIncident());
}

describe('DiagnosisCard', () => {
  async function render(incident: IncidentWithFindings | null = openIncident()) {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.incident.set(incident);
    await fixture.whenStable();
    return { fixture, element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('lists the probable causes most likely first with their confidence', async () => {
    const { element, loader } = await render();
    const titles = Array.from(element.querySelectorAll('.cause-title')).map((node) => node.textContent?.trim());
    expect(titles).toEqual([CAUSES['condenser-airflow'].title, CAUSES['door-seal'].title]);
    const bars = await loader.getAllHarnesses(MatProgressBarHarness);
    expect(await Promise.all(bars.map((bar) => bar.getValue()))).toEqual([55, 20]);
    expect(element.querySelector('.percent')?.textContent).toContain('55 %');
    const card = await loader.getHarness(MatCardHarness);
    expect(await card.getSubtitleText()).toContain('warming trend · watch');
  });

  it('shows the parts and checks of the most likely cause, and of another one when picked', async () => {
    const { fixture, element } = await render();
    expect(element.querySelector('.repair')?.textContent).toContain(CAUSES['condenser-airflow'].parts[0]!);
    expect(element.querySelectorAll('.repair ol li').length).toBe(CAUSES['condenser-airflow'].checks.length);
    element.querySelectorAll<HTMLButtonElement>('button.cause')[1]!.click();
    await fixture.whenStable();
    expect(element.querySelector('.repair')?.textContent).toContain(CAUSES['door-seal'].checks[0]!);
    expect(element.querySelectorAll<HTMLButtonElement>('button.cause')[1]!.getAttribute('aria-pressed')).toBe('true');
  });

  it('always shows the cautions: power off and a meter, EPA Section 608 for sealed-system work, local codes', async () => {
    for (const incident of [openIncident(), null]) {
      const { element } = await render(incident);
      const cautions = element.querySelector('.cautions')?.textContent ?? '';
      expect(cautions).toContain('Disconnect power');
      expect(cautions).toContain('meter');
      expect(cautions).toContain('EPA Section 608');
      expect(cautions).toContain('local');
    }
  });

  it('says when there is nothing to diagnose', async () => {
    const { element } = await render(null);
    expect(element.textContent).toContain('No open incident');
    expect(element.querySelector('.causes')).toBeNull();
  });
});
