import { hashToken } from '../../server/auth/tokens';
import { INVALID_INVITATION_LINK } from '../../server/services/invitations';
import { INVALID_RESET_LINK } from '../../server/services/passwords';
import type { InboxMessage } from '../../server/mail/inbox';
import { createWorld, mailAfter, tokenFromLink, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('password reset links', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  async function requestReset(email: string): Promise<string> {
    const browser = world.browser();
    await browser.get('/api/auth/session');
    const message = await mailAfter(world, email, async () => expect((await browser.post('/api/auth/forgot-password', { email })).status).toBe(202));
    const link = message.links.find((url) => url.includes('/reset-password#'));
    expect(link).withContext('reset link in the text body').toBeDefined();
    return tokenFromLink(link as string);
  }

  async function reset(token: string, password: string) {
    const browser = world.browser();
    await browser.get('/api/auth/session');
    return browser.post('/api/auth/reset-password', { token, password });
  }

  it('e-mails a link that sets a new password once, then never again', async () => {
    const { tenantB } = world.fixtures.users;
    const token = await requestReset(tenantB.email);
    expect((await reset(token, 'first new passphrase')).status).toBe(204);
    expect((await world.browser().signIn(tenantB.email, 'first new passphrase')).status).toBe(200);
    expect((await world.browser().signIn(tenantB.email, tenantB.password)).status).toBe(401);

    const again = await reset(token, 'second new passphrase');
    expect(again.status).toBe(400);
    expect(again.body.error).toBe(INVALID_RESET_LINK);
    expect((await world.browser().signIn(tenantB.email, 'second new passphrase')).status).toBe(401);
    await world.db.dataSource.query('UPDATE app_user SET password_hash = (SELECT password_hash FROM app_user WHERE id = $1) WHERE id = $1', [tenantB.id]);
  }, SPEC_TIMEOUT_MS);

  it('refuses a link after an hour', async () => {
    const { contractorWithJob } = world.fixtures.users;
    const token = await requestReset(contractorWithJob.email);
    world.clock.advance(60 * 60_000 + 1000);
    const res = await reset(token, 'too late passphrase');
    expect(res.status).toBe(400);
    expect(res.body.error).toBe(INVALID_RESET_LINK);
  }, SPEC_TIMEOUT_MS);

  it('accepts a link just inside the hour', async () => {
    const { contractorWithoutJob } = world.fixtures.users;
    const token = await requestReset(contractorWithoutJob.email);
    world.clock.advance(59 * 60_000);
    expect((await reset(token, 'just in time passphrase')).status).toBe(204);
  }, SPEC_TIMEOUT_MS);

  it('lets only the newest link work', async () => {
    const { managerOrg1 } = world.fixtures.users;
    const older = await requestReset(managerOrg1.email);
    const newer = await requestReset(managerOrg1.email);
    expect(newer).not.toBe(older);
    expect((await reset(older, 'from the older link')).status).toBe(400);
    expect((await reset(newer, 'from the newer link')).status).toBe(204);
  }, SPEC_TIMEOUT_MS);

  it('stores only the hash of the token', async () => {
    const { adminOrg2 } = world.fixtures.users;
    const token = await requestReset(adminOrg2.email);
    const rows = await world.db.dataSource.query('SELECT token_hash FROM password_reset WHERE user_id = $1', [adminOrg2.id]);
    expect(rows.map((row: { token_hash: string }) => row.token_hash)).toContain(hashToken(token));
    expect(JSON.stringify(rows)).not.toContain(token);
  }, SPEC_TIMEOUT_MS);

  it('keeps the token out of the URL the server sees (it is in the fragment)', async () => {
    const token = await requestReset(world.fixtures.users.tenantA.email);
    const message = await world.smtp.inbox.latestTo(world.fixtures.users.tenantA.email);
    const link = new URL((message as InboxMessage).links.find((url) => url.includes(token)) as string);
    expect(link.pathname).toBe('/reset-password');
    expect(link.search).toBe('');
    expect(link.hash).toBe(`#${token}`);
  }, SPEC_TIMEOUT_MS);

  it('signs the account out everywhere after a reset', async () => {
    const { adminOrg1 } = world.fixtures.users;
    const elsewhere = await world.signedIn('adminOrg1');
    const token = await requestReset(adminOrg1.email);
    const notice = await mailAfter(world, adminOrg1.email, async () => expect((await reset(token, 'after the reset passphrase')).status).toBe(204));
    expect(notice.subject).toBe('Your Chillwarden password was changed');
    expect((await elsewhere.get('/api/profile')).status).toBe(401);
  }, SPEC_TIMEOUT_MS);

  it('sends nothing for an unknown or deactivated address, with the same answer', async () => {
    const { bystander } = world.fixtures.users;
    await world.db.dataSource.query('UPDATE app_user SET deactivated_at = now() WHERE id = $1', [bystander.id]);
    const known = new Set(world.smtp.inbox.ids());
    const browser = world.browser();
    await browser.get('/api/auth/session');
    for (const email of ['never-registered@example.com', bystander.email]) {
      const res = await browser.post('/api/auth/forgot-password', { email });
      expect(res.status).toBe(202);
      expect(res.body.message).toMatch(/^If an account uses this address/);
    }
    await new Promise((resolve) => setTimeout(resolve, 200));
    const fresh = await Promise.all(world.smtp.inbox.ids().filter((id) => !known.has(id)).map((id) => world.smtp.inbox.get(id)));
    expect(fresh.filter((message) => /never-registered|bystander/.test(message?.to ?? ''))).toEqual([]);
    await world.db.dataSource.query('UPDATE app_user SET deactivated_at = NULL WHERE id = $1', [bystander.id]);
  }, SPEC_TIMEOUT_MS);
});

describe('invitation links', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  async function invite(email: string, extra: Record<string, unknown> = {}): Promise<string> {
    const admin = await world.signedIn('adminOrg1');
    const message = await mailAfter(world, email, async () => {
      const res = await admin.post('/api/invitations', { email, displayName: 'Invited Person', role: 'tenant', unitId: world.fixtures.org1.unitB, ...extra });
      expect(res.status).withContext(JSON.stringify(res.body)).toBe(201);
      expect(res.body.status).toBe('pending');
    });
    expect(message.subject).toBe('Spec adminOrg1 invited you to Chillwarden');
    const link = message.links.find((url) => url.includes('/accept-invitation#'));
    return tokenFromLink(link as string);
  }

  async function anonymous() {
    const browser = world.browser();
    await browser.get('/api/auth/session');
    return browser;
  }

  it('previews, accepts once, and the new tenant signs in to their unit', async () => {
    const token = await invite('new.tenant@example.com');
    const browser = await anonymous();
    const preview = await browser.post('/api/invitations/preview', { token });
    expect(preview.status).toBe(200);
    expect(preview.body).toEqual(jasmine.objectContaining({ email: 'new.tenant@example.com', role: 'tenant', unitLabel: '1B', propertyName: 'Cedar Row', organizationName: 'Maplewood Homes (spec)' }));

    const accepted = await browser.post('/api/invitations/accept', { token, password: 'my own passphrase' });
    expect(accepted.status).toBe(201);
    const signedIn = await world.browser().signIn('new.tenant@example.com', 'my own passphrase');
    expect(signedIn.body.user).toEqual(jasmine.objectContaining({ role: 'tenant', unitId: world.fixtures.org1.unitB, organizationId: world.fixtures.org1.id }));

    const again = await browser.post('/api/invitations/accept', { token, password: 'someone elses passphrase' });
    expect(again.status).toBe(400);
    expect(again.body.error).toBe(INVALID_INVITATION_LINK);
    expect((await browser.post('/api/invitations/preview', { token })).status).toBe(400);
  }, SPEC_TIMEOUT_MS);

  it('expires after seven days', async () => {
    const token = await invite('slow.reader@example.com');
    world.clock.advance(7 * 24 * 3600_000 + 1000);
    const browser = await anonymous();
    expect((await browser.post('/api/invitations/preview', { token })).status).toBe(400);
    expect((await browser.post('/api/invitations/accept', { token, password: 'a late passphrase' })).status).toBe(400);
  }, SPEC_TIMEOUT_MS);

  it('stops working when withdrawn, or replaced by a newer invitation', async () => {
    const first = await invite('twice.invited@example.com');
    const second = await invite('twice.invited@example.com');
    const browser = await anonymous();
    expect((await browser.post('/api/invitations/preview', { token: first })).status).toBe(400);
    expect((await browser.post('/api/invitations/preview', { token: second })).status).toBe(200);
    const admin = await world.signedIn('adminOrg1');
    const pending = (await admin.get('/api/invitations')).body.find((row: { email: string; status: string }) => row.email === 'twice.invited@example.com' && row.status === 'pending');
    expect((await admin.delete(`/api/invitations/${pending.id}`)).status).toBe(204);
    expect((await browser.post('/api/invitations/accept', { token: second, password: 'withdrawn passphrase' })).status).toBe(400);
  }, SPEC_TIMEOUT_MS);

  it('refuses a weak password without spending the link', async () => {
    const token = await invite('careful.chooser@example.com');
    const browser = await anonymous();
    const weak = await browser.post('/api/invitations/accept', { token, password: 'short' });
    expect(weak.status).toBe(400);
    const common = await browser.post('/api/invitations/accept', { token, password: 'password1234' });
    expect(common.status).toBe(400);
    expect(common.body.details[0].message).toMatch(/too common/);
    expect((await browser.post('/api/invitations/accept', { token, password: 'a better passphrase' })).status).toBe(201);
  }, SPEC_TIMEOUT_MS);

  it('lets only an administrator invite a manager', async () => {
    const manager = await world.signedIn('managerOrg1');
    const res = await manager.post('/api/invitations', { email: 'new.manager@example.com', displayName: 'New Manager', role: 'manager' });
    expect(res.status).toBe(403);
    const admin = await world.signedIn('adminOrg1');
    expect((await admin.post('/api/invitations', { email: 'new.manager@example.com', displayName: 'New Manager', role: 'manager', isAdmin: true })).status).toBe(201);
  }, SPEC_TIMEOUT_MS);

  it("refuses a unit of another organization as if it did not exist", async () => {
    const admin = await world.signedIn('adminOrg1');
    const res = await admin.post('/api/invitations', { email: 'wrong.unit@example.com', displayName: 'Wrong Unit', role: 'tenant', unitId: world.fixtures.org2.unitC });
    expect(res.status).toBe(404);
    expect(res.body.error).toBe('unit not found');
  }, SPEC_TIMEOUT_MS);

  it('refuses to invite an address that already has an account', async () => {
    const admin = await world.signedIn('adminOrg1');
    const res = await admin.post('/api/invitations', { email: world.fixtures.users.tenantB.email.toUpperCase(), displayName: 'Again', role: 'contractor' });
    expect(res.status).toBe(409);
  }, SPEC_TIMEOUT_MS);

  it('withdraws the invitation when the e-mail cannot be sent', async () => {
    const failing = await createWorld({ mailer: { send: async () => Promise.reject(new Error('relay down')), close() {} } });
    try {
      const admin = await failing.signedIn('adminOrg1');
      const res = await admin.post('/api/invitations', { email: 'unlucky@example.com', displayName: 'Unlucky', role: 'contractor' });
      expect(res.status).toBe(502);
      const [row] = await failing.db.dataSource.query(`SELECT revoked_at FROM invitation WHERE email = 'unlucky@example.com'`);
      expect(row.revoked_at).not.toBeNull();
    } finally {
      await failing.close();
    }
  }, SPEC_TIMEOUT_MS);
});
