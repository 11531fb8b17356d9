import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import type { HttpTestingController } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MatSlideToggleHarness } from '@angular/material/slide-toggle/testing';
import { configureSpec, settle } from '../inventory/testing';
import { EmailPreferences } from './email-preferences';

describe('EmailPreferences', () => {
  let backend: HttpTestingController;

  beforeEach(() => (backend = configureSpec()));
  afterEach(() => backend.verify());

  it('mutes routine e-mail when the toggle is turned off, and puts it back if saving fails', async () => {
    const fixture = TestBed.createComponent(EmailPreferences);
    fixture.detectChanges();
    backend.expectOne('/api/notification-preferences').flush({ muteNonUrgent: false });
    await settle(fixture);
    const toggle = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSlideToggleHarness);
    expect(await toggle.isChecked()).toBeTrue();
    await toggle.toggle();
    const call = backend.expectOne('/api/notification-preferences');
    expect(call.request.method).toBe('PUT');
    expect(call.request.body).toEqual({ muteNonUrgent: true });
    call.flush({ muteNonUrgent: true });
    await settle(fixture);
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('Only urgent e-mail from now on.');

    await toggle.toggle();
    backend.expectOne('/api/notification-preferences').flush({ error: 'the server is busy' }, { status: 503, statusText: 'Unavailable' });
    await settle(fixture);
    expect(await toggle.isChecked()).toBeFalse();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role="alert"]')?.textContent).toContain('The server is busy');
  });
});
