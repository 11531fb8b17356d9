import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { TestBed } from '@angular/core/testing';
import { MatProgressBarHarness } from '@angular/material/progress-bar/testing';
import { ListStatus } from './list-status';

describe('ListStatus', () => {
  function render(inputs: { loading: boolean; error?: string | null }) {
    const fixture = TestBed.createComponent(ListStatus);
    fixture.componentRef.setInput('loadingLabel', 'Loading sensors');
    fixture.componentRef.setInput('loading', inputs.loading);
    if (inputs.error !== undefined) fixture.componentRef.setInput('error', inputs.error);
    fixture.detectChanges();
    return { element: fixture.nativeElement as HTMLElement, loader: TestbedHarnessEnvironment.loader(fixture) };
  }

  it('shows a labelled progress bar while loading, and no alert', async () => {
    const { element, loader } = render({ loading: true });
    const bar = await loader.getHarness(MatProgressBarHarness);
    expect(await bar.getMode()).toBe('indeterminate');
    expect(await (await bar.host()).getAttribute('aria-label')).toBe('Loading sensors');
    expect(element.querySelector('[role="alert"]')).toBeNull();
  });

  it('announces the error once loading is over and keeps the progress line empty', async () => {
    const { element, loader } = render({ loading: false, error: 'The server did not answer.' });
    expect(await loader.getAllHarnesses(MatProgressBarHarness)).toEqual([]);
    expect(element.querySelector('.progress')).not.toBeNull();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('The server did not answer.');
  });
});
