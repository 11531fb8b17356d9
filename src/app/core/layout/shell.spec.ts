import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatNavListHarness } from '@angular/material/list/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { provideRouter } from '@angular/router';
import type { SessionUser } from '../../../../shared/api/session';
import { Session } from '../auth/session';
import { ThemeService } from '../theme/theme';
import { Shell } from './shell';

const admin: SessionUser = {
  id: 'a1',
  email: 'admin@example.com',
  displayName: 'Alex Admin',
  role: 'manager',
  isAdmin: true,
  organizationId: 'o1',
  unitId: null,
  temperatureUnit: 'C',
  timeZone: null,
};

describe('Shell', () => {
  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
  });

  async function navTitles() {
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    const lists = await TestbedHarnessEnvironment.loader(fixture).getAllHarnesses(MatNavListHarness);
    const titles: string[] = [];
    for (const list of lists) for (const item of await list.getItems()) titles.push(await item.getTitle());
    return { fixture, titles };
  }

  it('shows a signed-out visitor the sign-in link', async () => {
    TestBed.inject(Session).set(null);
    const { titles, fixture } = await navTitles();
    expect(titles).toEqual(['Sign in', 'System status']);
    expect((fixture.nativeElement as HTMLElement).querySelector('.user-button')).toBeNull();
  });

  it('shows an admin manager the whole navigation with the people page, and their initials', async () => {
    TestBed.inject(Session).set(admin);
    const { titles, fixture } = await navTitles();
    expect(titles).toEqual(['Fleet', 'Incidents', 'Service requests', 'Work orders', 'Inventory', 'Logger files', 'Reports', 'Settings', 'People', 'System status']);
    expect((fixture.nativeElement as HTMLElement).querySelector('.avatar')?.textContent?.trim()).toBe('AA');
  });

  it('toggles the dark theme from the toolbar', async () => {
    const fixture = TestBed.createComponent(Shell);
    const theme = TestBed.inject(ThemeService);
    const before = theme.scheme();
    const toggle = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatButtonHarness.with({ selector: '[aria-label$="theme"]' }));
    await toggle.click();
    expect(theme.scheme()).not.toBe(before);
    expect(document.documentElement.classList.contains('cw-dark')).toBe(theme.scheme() === 'dark');
    theme.toggle();
  });
});
