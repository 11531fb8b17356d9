import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { MatNavListHarness } from '@angular/material/list/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { BreakpointObserver } from '@angular/cdk/layout';
import { Component } from '@angular/core';
import { MatSidenavHarness } from '@angular/material/sidenav/testing';
import { Router, provideRouter } from '@angular/router';
import { of } from 'rxjs';
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

@Component({ template: 'page' })
class SomePage {}

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

  describe('on a phone', () => {
    let releaseSlowPage: ((allowed: boolean) => void) | undefined;

    beforeEach(() => {
      releaseSlowPage = undefined;
      TestBed.resetTestingModule();
      TestBed.configureTestingModule({
        providers: [
          provideRouter([
            { path: 'page', component: SomePage },
            { path: 'slow', component: SomePage, canActivate: [() => new Promise<boolean>((resolve) => (releaseSlowPage = resolve))] },
          ]),
          provideHttpClient(),
          provideHttpClientTesting(),
          { provide: BreakpointObserver, useValue: { observe: () => of({ matches: true, breakpoints: {} }) } },
        ],
      });
      TestBed.inject(Session).set(admin);
    });

    async function openDrawer() {
      const fixture = TestBed.createComponent(Shell);
      const loader = TestbedHarnessEnvironment.loader(fixture);
      const drawer = await loader.getHarness(MatSidenavHarness);
      expect(await drawer.isOpen()).toBeFalse();
      await (await loader.getHarness(MatButtonHarness.with({ selector: '[aria-label="Open navigation"]' }))).click();
      expect(await drawer.isOpen()).toBeTrue();
      return { fixture, drawer };
    }

    it('closes the drawer once the page chosen in it has loaded', async () => {
      const { fixture, drawer } = await openDrawer();
      await TestBed.inject(Router).navigateByUrl('/page');
      await fixture.whenStable();
      expect(await drawer.isOpen()).toBeFalse();
    });

    it('keeps a drawer open that was opened while a page was still loading', async () => {
      const fixture = TestBed.createComponent(Shell);
      fixture.detectChanges();
      const navigation = TestBed.inject(Router).navigateByUrl('/slow');
      while (!releaseSlowPage) await new Promise((resolve) => setTimeout(resolve));
      // No harness until the page is let through: harnesses wait for the pending navigation.
      const menu = (fixture.nativeElement as HTMLElement).querySelector<HTMLButtonElement>('[aria-label="Open navigation"]')!;
      menu.click();
      fixture.detectChanges();
      expect(menu.getAttribute('aria-expanded')).toBe('true');
      releaseSlowPage(true);
      expect(await navigation).toBeTrue();
      const drawer = await TestbedHarnessEnvironment.loader(fixture).getHarness(MatSidenavHarness);
      expect(await drawer.isOpen()).toBeTrue();
    });
  });
});
