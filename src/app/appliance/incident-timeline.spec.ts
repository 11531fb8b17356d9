import { Component, signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatButtonHarness } from '@angular/material/button/testing';
import type { IncidentWithFindings } from '../../../shared/api/appliances';
import { openIncident } from './appliance-fixtures';
import { IncidentTimeline, TIMELINE_FIRST_SHOWN, timelineOf } from './incident-timeline';

@Component({
  imports: [IncidentTimeline],
  template: `<cw-incident-timeline [incidents]="incidents()" timeZone="America/New_York" />`,
})
class Host {
  readonly incidents = signal<IncidentWithFindings[]>([]);
}

describe('incident timeline', () => {
  it('tells an incident in time order: onset, finding, opening, end, recovery', () => {
    const incident = openIncident({
      closedAt: '2026-03-03T02:00:00.000Z',
      findings: [{ ...openIncident().findings[0]!, endedAt: '2026-03-03T01:00:00.000Z' }],
    });
    expect(timelineOf(incident).map((entry) => entry.text)).toEqual([
      'Trouble began (estimated)',
      'warming trend detected in the fresh food',
      'Incident opened, watch',
      'warming trend ended',
      'Recovered: incident closed',
    ]);
  });

  it('shows times in the property’s time zone and the first incidents, then all on demand', async () => {
    const fixture = TestBed.createComponent(Host);
    const many = Array.from({ length: TIMELINE_FIRST_SHOWN + 2 }, (_, i) => openIncident({ id: `i${i}`, closedAt: '2026-03-03T02:00:00.000Z' }));
    fixture.componentInstance.incidents.set(many);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    expect(element.querySelectorAll('section.incident').length).toBe(TIMELINE_FIRST_SHOWN);
    // 05:00 UTC is 12:00 AM in New York (EST, UTC−5).
    expect(element.querySelector('time')?.textContent).toBe('Mar 2, 12:00 AM');
    await (await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ text: /Show all/ }))).click();
    expect(element.querySelectorAll('section.incident').length).toBe(TIMELINE_FIRST_SHOWN + 2);
  });

  it('says when there has been no incident', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('No incidents on record');
  });
});
