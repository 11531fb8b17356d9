import { DEMO_ACCOUNTS } from '../../seeds/demo-accounts';
import type { FleetOverview } from '../../shared/api/fleet';
import type { TenantHomeView } from '../../shared/api/tenant';
import { BASE_URL, openPage, screenshot, type WatchedPage } from './support/browser';

/**
 * The invitation flow end to end, in the browser against the running stack: an
 * administrator invites a tenant to one unit, the invitation is read from the fake inbox,
 * the tenant sets a password and lands in the app, and reaches that unit only.
 */
const admin = DEMO_ACCOUNTS.find((account) => account.role === 'manager' && account.isAdmin)!;

interface InboxEntry {
  id: string;
  to: string;
}

async function invitationLinkFor(address: string): Promise<string> {
  for (let tries = 0; tries < 50; tries++) {
    const list = (await (await fetch(`${BASE_URL}/api/dev/inbox`)).json()) as InboxEntry[];
    const entry = list.find((message) => message.to.includes(address));
    if (entry) {
      const message = (await (await fetch(`${BASE_URL}/api/dev/inbox/${entry.id}`)).json()) as { links: string[] };
      const link = message.links.find((url) => url.includes('/accept-invitation#'));
      if (link) return link;
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no invitation reached ${address}`);
}

describe('inviting a tenant', () => {
  let watched: WatchedPage;
  const tenantEmail = `e2e.tenant.${Date.now()}@example.com`;
  const tenantPassword = 'tenant chosen passphrase';

  beforeAll(async () => {
    watched = await openPage();
  }, 60_000);

  afterAll(async () => {
    expect(watched.consoleErrors.filter((line) => !/status of 40[134]/.test(line))).withContext('console errors').toEqual([]);
    expect(watched.foreignRequests).withContext('requests to other hosts').toEqual([]);
    await watched.close();
  }, 60_000);

  it('invites, accepts from the fake inbox, signs in and reaches only that unit', async () => {
    const { page } = watched;

    // The administrator signs in and invites a tenant to the first unit of the fleet.
    await page.goto(`${BASE_URL}/sign-in`);
    await page.getByLabel('E-mail address').fill(admin.email);
    await page.getByLabel('Password').fill(admin.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/fleet$/);
    const fleet = (await page.evaluate(() => fetch('/api/fleet').then((res) => res.json()))) as FleetOverview;
    const units = fleet.properties.flatMap((property) => property.units.filter((unit) => unit.appliances.length > 0).map((unit) => ({ ...unit, propertyName: property.name })));
    expect(units.length).withContext('units with appliances in the demo fleet').toBeGreaterThan(1);
    const [home, elsewhere] = units;

    await page.goto(`${BASE_URL}/users`);
    await page.getByRole('button', { name: 'Invite someone' }).click();
    const dialog = page.getByRole('dialog');
    await dialog.getByLabel('E-mail address').fill(tenantEmail);
    await dialog.getByLabel('Name').fill('Casey Newtenant');
    await dialog.getByRole('combobox', { name: 'Unit' }).click();
    await page.getByRole('option', { name: `${home.propertyName} · ${home.label}`, exact: true }).click();
    await dialog.getByRole('button', { name: 'Send the invitation' }).click();
    await page.getByText(`Invitation sent to ${tenantEmail}.`).waitFor();
    await page.getByRole('cell', { name: new RegExp(tenantEmail.replace(/\./g, '\\.')) }).waitFor();
    await screenshot(page, 'people-after-invite');

    await page.getByRole('button', { name: /^Account menu for/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in$/);

    // The invitee opens the link from the fake inbox and chooses a password.
    const link = await invitationLinkFor(tenantEmail);
    expect(new URL(link).origin).toBe(BASE_URL);
    await page.goto(link);
    await page.getByText(`invited ${tenantEmail} as a tenant of unit ${home.label} at ${home.propertyName}.`).waitFor();
    await page.getByLabel('Password', { exact: true }).fill(tenantPassword);
    await page.getByLabel('Password again').fill(tenantPassword);
    await page.getByRole('button', { name: 'Create my account' }).click();
    await page.waitForURL(/\/home$/);
    await screenshot(page, 'tenant-first-sign-in');

    // Signed in as the tenant: their unit's home and readings, and nothing of the unit next door.
    // No named helpers inside evaluate: tsx would wrap them in a __name() the page lacks.
    const seen = await page.evaluate(
      async ([own, other]) => {
        const [tenantHome, ...statuses] = await Promise.all([
          fetch('/api/tenant/home').then((res) => res.json()),
          ...[`/api/appliances/${own}/history`, `/api/appliances/${other}/history`, '/api/fleet', '/api/users'].map((url) => fetch(url).then((res) => res.status)),
        ]);
        return { tenantHome, own: statuses[0], other: statuses[1], fleet: statuses[2], users: statuses[3] };
      },
      [home.appliances[0].id, elsewhere.appliances[0].id],
    );
    expect((seen.tenantHome as TenantHomeView).unit).toEqual({ id: home.id, label: home.label, propertyName: home.propertyName });
    expect(seen.own).toBe(200);
    expect(seen.other).withContext('another unit reads as missing').toBe(404);
    expect(seen.fleet).toBe(403);
    expect(seen.users).toBe(403);

    // The same password works again after signing out.
    await page.getByRole('button', { name: /^Account menu for/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in$/);
    await page.getByLabel('E-mail address').fill(tenantEmail);
    await page.getByLabel('Password').fill(tenantPassword);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/home$/);
  }, 120_000);
});
