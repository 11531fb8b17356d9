import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { ApplianceDetail } from '../../../shared/api/appliances';
import type { TemperatureUnit } from '../../../shared/temperature';
import { ApplianceFacts } from './appliance-facts';
import { sampleDetail } from './appliance-fixtures';

@Component({
  imports: [ApplianceFacts],
  template: `<cw-appliance-facts [detail]="detail()" [unit]="unit()" />`,
})
class Host {
  readonly detail = signal<ApplianceDetail>(sampleDetail());
  readonly unit = signal<TemperatureUnit>('F');
}

describe('ApplianceFacts', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideRouter([])] }));

  async function render(detail = sampleDetail(), unit: TemperatureUnit = 'F') {
    const fixture = TestBed.createComponent(Host);
    fixture.componentInstance.detail.set(detail);
    fixture.componentInstance.unit.set(unit);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  it('lists model, serial, install date, warranty and sensor', async () => {
    const element = await render();
    expect(element.querySelector('.sensor a')?.getAttribute('href')).toBe('/inventory/sensors/s-birch-4b');
    const text = element.querySelector('.facts')?.textContent ?? '';
    expect(text).toContain('TF-18 (demo)');
    expect(text).toContain('SN-0042');
    expect(text).toContain('Mar 2, 2018');
    expect(text).toContain('ended Mar 2, 2019');
    expect(text).toContain('cw-birch-4b, every 5 min');
  });

  it('draws the age as a meter against the expected life (NAHB / Bank of America Home Equity, 2007: refrigerator 13 years)', async () => {
    const element = await render();
    const meter = element.querySelector('[role="meter"]')!;
    expect(meter.getAttribute('aria-valuenow')).toBe('8');
    expect(meter.getAttribute('aria-valuemax')).toBe('13');
    expect(meter.getAttribute('aria-valuetext')).toBe('8 of about 13 years');
    expect(meter.classList).toContain('late');
    expect(element.querySelector('.source')?.textContent).toContain('Study of Life Expectancy of Home Components');
  });

  it('shows the repair-or-replace hint as a rule of thumb with the setting it follows', async () => {
    const hint = (await render()).querySelector('.hint')!;
    expect(hint.querySelector('h3')?.textContent).toContain('Compare the quote');
    expect(hint.textContent).toContain('$600');
    expect(hint.textContent).toContain('Repairs in the last 12 months: $420.00');
    expect(hint.textContent).toContain('A rule of thumb, not a quote: past 50 % of the expected life, replace when a repair costs 50 % of a new unit or more');
  });

  it('gives the learned normal in the person’s unit, a spread without the 32 °F offset', async () => {
    const fahrenheit = (await render()).querySelector('.normal')?.textContent ?? '';
    // 2.6 °C = 36.7 °F and ±0.3 °C = ±0.5 °F (NIST SP 811: °F = °C × 9/5 + 32; a difference scales by 9/5 only).
    expect(fahrenheit).toContain('36.7 °F ± 0.5 °F');
    expect(fahrenheit).toContain('every 10 h, about 28 min');
    const celsius = (await render(sampleDetail(), 'C')).querySelector('.normal')?.textContent ?? '';
    expect(celsius).toContain('2.6 °C ± 0.3 °C');
  });

  it('copes with an unknown install date and nothing learned yet', async () => {
    const element = await render(sampleDetail({ installedOn: null, life: { ...sampleDetail().life, ageYears: null, lifeFraction: null }, normal: null }));
    expect(element.querySelector('[role="meter"]')).toBeNull();
    expect(element.textContent).toContain('Install date unknown');
    expect(element.textContent).toContain('Nothing learned yet');
  });
});
