import type { Page } from 'playwright-core';
import sharp from 'sharp';
import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import type { FleetOverview } from '../../shared/api/fleet';
import { accessibilityViolations } from './support/accessibility';
import { BASE_URL, openPage, screenshot, waitInPage, type WatchedPage } from './support/browser';

/**
 * The newcomer's path on the seeded demo, as the README tells it: the manager watches the
 * storyline's evaporator-fan failure in unit 304 turn its tile warm without a reload and
 * opens the chart; it becomes an urgent work order; the tenant of 304 sees the status and
 * the food guidance and reports the warm fridge, which joins the open request; the
 * contractor takes the job on a phone, records the fan motor with a photo and completes it. Every
 * page passes axe-core's WCAG 2 A/AA rules at serious and critical impact; screenshots go to
 * the test artifacts. The storyline runs at 90×: the fault starts about 20 s after the
 * simulator and its work order follows within a few minutes.
 */
const account = (role: string) => DEMO_ACCOUNTS.find((a) => a.role === role && !a.isAdmin)!;
const PHONE = { width: 390, height: 844 };
const STORY_TIMEOUT_MS = 8 * 60_000;

async function signIn(page: Page, role: string): Promise<void> {
  const { email, password } = account(role);
  await page.goto(`${BASE_URL}/sign-in`);
  await page.getByLabel('E-mail address').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

async function expectAccessible(page: Page, what: string): Promise<void> {
  expect(await accessibilityViolations(page)).withContext(`axe-core on ${what}`).toEqual([]);
}

/** The appliance of unit 304 at Harrowgate Commons, where the storyline's fan stops. */
async function fanApplianceId(page: Page): Promise<string> {
  const fleet = (await page.evaluate(() => fetch('/api/fleet').then((res) => res.json()))) as FleetOverview;
  const property = fleet.properties.find((p) => p.name === 'Harrowgate Commons');
  const unit = property?.units.find((u) => u.label === '304');
  expect(unit).withContext('unit 304 at Harrowgate Commons in the demo').toBeDefined();
  return unit!.appliances[0].id;
}

function expectClean(watched: WatchedPage): void {
  expect(watched.consoleErrors).withContext('console errors').toEqual([]);
  expect(watched.foreignRequests).withContext('requests to other hosts').toEqual([]);
}

describe('the newcomer path on the seeded demo', () => {
  let applianceId: string;
  let workOrderId: string;

  it('shows the manager the fault live on the fleet, then its chart and its urgent work order', async () => {
    const watched = await openPage();
    try {
      const { page } = watched;
      await signIn(page, 'manager');
      await page.waitForURL(/\/fleet$/);
      applianceId = await fanApplianceId(page);
      const cell = page.locator(`[data-appliance="${applianceId}"]`);
      await cell.waitFor();
      await expectAccessible(page, 'the fleet');
      // No reload from here: the tile turns as the live feed tells it.
      await page.waitForFunction((id) => ['warm', 'no-cooling'].includes(document.querySelector(`[data-appliance="${id}"]`)?.getAttribute('data-health') ?? ''), applianceId, { timeout: STORY_TIMEOUT_MS, polling: 1000 });
      await screenshot(page, 'manager-fleet-fault');

      await cell.click();
      await page.waitForURL(new RegExp(`/appliances/${applianceId}$`));
      await page.locator('cw-reading-chart canvas').first().waitFor({ timeout: 60_000 });
      await expectAccessible(page, 'the appliance page');
      await screenshot(page, 'manager-appliance-fault');

      workOrderId = await waitInPage(
        page,
        async (id) => {
          const list = await fetch('/api/work-orders?status=open').then((res) => res.json());
          const job = list.items.find((item: { applianceId?: string; appliance?: { id: string } }) => (item.applianceId ?? item.appliance?.id) === id);
          return job ? (job.id as string) : null;
        },
        applianceId,
        { timeoutMs: STORY_TIMEOUT_MS, pollMs: 2000, what: "the fan job's work order" },
      );
      await page.goto(`${BASE_URL}/work-orders`);
      await page.locator(`a[href="/work-orders/${workOrderId}"]`).first().waitFor();
      await expectAccessible(page, 'the work-order table');
      await screenshot(page, 'manager-work-orders');

      // The seeded months of repairs fill the reports on first sign-in.
      await page.goto(`${BASE_URL}/reports`);
      await page.getByText('First-visit fix rate').waitFor();
      await page.locator('cw-past-life-table a[href^="/appliances/"]').first().waitFor();
      await expectAccessible(page, 'the reports');
      await screenshot(page, 'manager-reports');

      // 502's freezer probe reports its disconnected value: the sensor's page counts it.
      const sensorId = await page.evaluate(async () => {
        const list = await fetch('/api/inventory/sensors?q=502').then((res) => res.json());
        return (list.items as { id: string; unitLabel: string; propertyName: string }[]).find((s) => s.unitLabel === '502' && s.propertyName === 'Harrowgate Commons')?.id ?? null;
      });
      expect(sensorId).withContext('the sensor of 502 at Harrowgate Commons').not.toBeNull();
      await waitInPage(
        page,
        async (id) => ((await fetch(`/api/sensors/${id}/rejects`).then((res) => res.json())).countsByReason['sensor-error-value'] ?? 0) > 0,
        sensorId,
        { timeoutMs: STORY_TIMEOUT_MS, pollMs: 2000, what: "502's probe error value among its rejects" },
      );
      await page.goto(`${BASE_URL}/inventory/sensors/${sensorId}`);
      await page.locator('.latest .reason', { hasText: 'sensor-error-value' }).first().waitFor();
      await expectAccessible(page, 'the sensor page');
      await screenshot(page, 'manager-sensor');
      expectClean(watched);
    } finally {
      await watched.close();
    }
  }, STORY_TIMEOUT_MS * 2 + 120_000);

  it('shows the tenant the status and the food guidance, and takes a report of the warm fridge', async () => {
    const watched = await openPage(PHONE);
    try {
      const { page } = watched;
      await signIn(page, 'tenant');
      await page.waitForURL(/\/home$/);
      await page.getByText(/USDA/).first().waitFor();
      await expectAccessible(page, "the tenant's page");
      await screenshot(page, 'tenant-home');

      await page.getByRole('checkbox', { name: 'The fridge is not cold' }).check();
      await page.getByLabel('Tell us more (optional)').fill('The milk felt warm this morning.');
      await page.getByRole('button', { name: 'Send report' }).click();
      await page.getByRole('button', { name: 'Report something else' }).waitFor();
      const home = await page.evaluate(() => fetch('/api/tenant/home').then((res) => res.json()));
      const requests = (home.appliances as { openRequest?: { id: string; reports?: unknown[] } | null }[]).map((a) => a.openRequest).filter(Boolean);
      expect(requests.length).withContext('one open request: the report joined the fan job').toBe(1);
      await screenshot(page, 'tenant-reported');
      expectClean(watched);
    } finally {
      await watched.close();
    }
  }, 180_000);
  it('lets the contractor take the job on a phone, record the fan motor with a photo and complete it', async () => {
    const watched = await openPage(PHONE);
    try {
      const { page } = watched;
      await signIn(page, 'contractor');
      await page.waitForURL(/\/jobs$/);
      await page.locator(`a[href="/work-orders/${workOrderId}"]`).waitFor();
      await expectAccessible(page, 'my jobs');
      await screenshot(page, 'contractor-jobs');
      await page.locator(`a[href="/work-orders/${workOrderId}"]`).click();
      await page.getByRole('button', { name: 'Accept the job' }).click();
      await page.getByRole('button', { name: 'I am on site' }).click();

      await page.getByLabel('Part', { exact: true }).fill('Evaporator fan motor');
      await page.getByLabel('Quantity').fill('1');
      await page.getByLabel(/^Cost each/).fill('86.50');
      await page.getByRole('button', { name: 'Add part' }).click();
      await page.getByText('Evaporator fan motor', { exact: false }).first().waitFor();

      const photo = await sharp({ create: { width: 320, height: 240, channels: 3, background: '#4a7a9c' } }).jpeg().toBuffer();
      await page.locator('[data-testid="files"]').setInputFiles({ name: 'fan-motor.jpg', mimeType: 'image/jpeg', buffer: photo });
      await page.locator('img[src*="/api/attachments/"]').first().waitFor({ timeout: 60_000 });
      await expectAccessible(page, 'the job page');
      await screenshot(page, 'contractor-job');

      await page.getByRole('button', { name: 'Complete the job…' }).click();
      const dialog = page.getByRole('dialog');
      await dialog.getByRole('combobox', { name: 'Cause found' }).click();
      await page.getByRole('option', { name: 'Evaporator fan motor stopped' }).click();
      await dialog.getByLabel('Findings').fill('Fan motor seized; replaced it and checked the blade turns freely.');
      await dialog.getByRole('button', { name: 'Complete', exact: true }).click();
      // Completed, or already verified by the telemetry that follows the repair.
      await waitInPage(
        page,
        async (id) => ['completed', 'verified'].includes((await fetch(`/api/work-orders/${id}`).then((res) => res.json())).state),
        workOrderId,
        { timeoutMs: 30_000, pollMs: 500, what: 'the job to be completed' },
      );
      expectClean(watched);
    } finally {
      await watched.close();
    }
  }, 240_000);

});
