import fs from 'node:fs';
import path from 'node:path';
import { accessibilityViolations } from './support/accessibility';
import { BASE_URL, openPage, screenshot, type WatchedPage } from './support/browser';

describe('the served app shell', () => {
  let watched: WatchedPage;

  beforeEach(async () => {
    watched = await openPage();
  });

  afterEach(async () => {
    expect(watched.consoleErrors).withContext('console errors').toEqual([]);
    expect(watched.foreignRequests).withContext('requests to other hosts').toEqual([]);
    await watched.close();
  });

  it('renders the toolbar, the navigation and the status read from the API', async () => {
    const { page } = watched;
    await page.goto(`${BASE_URL}/status`);
    await page.getByRole('heading', { name: 'System status' }).waitFor();
    expect(await page.locator('.brand-name').textContent()).toBe('Chillwarden');
    await page.locator('[data-component="database"] .state').getByText('Up').waitFor();
    expect(await page.locator('[data-component="server"] .state').textContent()).toBe('Up');
    // The stack's server runs the ingest, so its card is there and connected to the broker.
    await page.locator('[data-component="ingest"] .state').getByText('Up').waitFor();
    expect(await page.getByRole('link', { name: 'Sign in' }).count()).toBeGreaterThan(0);
    expect(await page.title()).toBe('System status · Chillwarden');
    expect(await accessibilityViolations(page)).withContext('axe-core on the status page').toEqual([]);
    await screenshot(page, 'shell-status');
  });

  it('answers a client route with the app, sending a signed-out visitor to sign-in', async () => {
    const { page } = watched;
    await page.goto(`${BASE_URL}/fleet`);
    await page.waitForURL(/\/sign-in\?returnUrl=%2Ffleet$/);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    expect(await accessibilityViolations(page)).withContext('axe-core on the sign-in page').toEqual([]);
  });

  it('fits a 375 px phone with the navigation behind a menu button', async () => {
    await watched.close();
    watched = await openPage({ width: 375, height: 740 });
    const { page } = watched;
    await page.goto(`${BASE_URL}/status`);
    const menu = page.getByRole('button', { name: 'Open navigation' });
    await menu.waitFor();
    await menu.click();
    await page.getByRole('navigation').getByRole('link', { name: 'System status' }).waitFor();
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    expect(overflow).withContext('horizontal overflow in px').toBeLessThanOrEqual(0);
    await screenshot(page, 'shell-phone');
  });

  it('switches to the dark theme and remembers it', async () => {
    const { page } = watched;
    await page.goto(`${BASE_URL}/status`);
    await page.getByRole('button', { name: 'Use dark theme' }).click();
    expect(await page.evaluate(() => document.documentElement.classList.contains('cw-dark'))).toBeTrue();
    await page.reload();
    await page.getByRole('button', { name: 'Use light theme' }).waitFor();
    expect(await page.evaluate(() => getComputedStyle(document.documentElement).colorScheme)).toBe('dark');
  });
});

describe('the built client', () => {
  const browserDir = path.resolve('dist', 'client', 'browser');
  const files = fs.existsSync(browserDir) ? fs.readdirSync(browserDir).filter((name) => /\.(html|css|js)$/.test(name)) : [];

  it('references no font, stylesheet or script on another host', () => {
    expect(files.length).toBeGreaterThan(2);
    const external = /(?:url\(\s*['"]?|(?:src|href)\s*=\s*['"]|@import\s+['"])https?:\/\//i;
    const offenders = files.filter((name) => external.test(fs.readFileSync(path.join(browserDir, name), 'utf8')));
    expect(offenders).toEqual([]);
  });

  it('ships the Roboto and icon fonts itself', () => {
    const media = fs.readdirSync(path.join(browserDir, 'media'));
    expect(media.some((name) => /^roboto-latin-400-normal.*\.woff2$/.test(name))).toBeTrue();
    expect(media.some((name) => /^material-icons.*\.woff2$/.test(name))).toBeTrue();
  });
});
