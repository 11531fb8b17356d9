import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { EmptyState } from './empty-state';

@Component({
  imports: [EmptyState],
  template: `<cw-empty-state icon="kitchen" heading="No appliances yet" message="Pair a sensor to begin."><a href="/inventory">Open inventory</a></cw-empty-state>`,
})
class Host {}

describe('EmptyState', () => {
  it('shows the heading, the message, the icon and the projected action', async () => {
    const fixture = TestBed.createComponent(Host);
    await fixture.whenStable();
    const element: HTMLElement = fixture.nativeElement;
    expect(element.querySelector('h2')?.textContent).toBe('No appliances yet');
    expect(element.querySelector('p')?.textContent).toBe('Pair a sensor to begin.');
    expect(element.querySelector('mat-icon')?.textContent).toBe('kitchen');
    expect(element.querySelector('.actions a')?.getAttribute('href')).toBe('/inventory');
    expect(element.querySelector('[role="status"]')).not.toBeNull();
  });
});
