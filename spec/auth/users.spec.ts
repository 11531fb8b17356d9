import pino from 'pino';
import { buildAccountServices } from '../../server/auth/accounts';
import { loadConfig } from '../../server/config';
import type { UserSummary } from '../../shared/api/users';
import { createWorld, mailAfter, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('user management (administrators)', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it("lists only the organization's users, paged, filtered and sorted", async () => {
    const admin = await world.signedIn('adminOrg1');
    const all = await admin.get('/api/users?pageSize=200');
    expect(all.status).toBe(200);
    const emails = all.body.items.map((user: UserSummary) => user.email);
    expect(emails).toContain('tenanta@example.com');
    expect(emails).not.toContain('adminorg2@example.com');
    expect(all.body.total).toBe(emails.length);

    const tenants = await admin.get('/api/users?role=tenant&sort=email&direction=desc');
    expect(tenants.body.items.map((user: UserSummary) => user.email)).toEqual(['tenantb@example.com', 'tenanta@example.com', 'bystander@example.com']);
    expect(tenants.body.items[1].unit).toEqual({ id: world.fixtures.org1.unitA, label: '1A', propertyName: 'Cedar Row' });

    const page = await admin.get('/api/users?pageSize=2&page=1&sort=email');
    expect(page.body.items.length).toBe(2);
    expect(page.body.page).toBe(1);
    expect((await admin.get('/api/users?q=TENANTB')).body.items.map((user: UserSummary) => user.email)).toEqual(['tenantb@example.com']);
    expect((await admin.get('/api/users?q=%25')).body.items).toEqual([]);
    expect((await admin.get('/api/users?pageSize=5000')).status).toBe(400);
  }, SPEC_TIMEOUT_MS);

  it('moves a tenant to another unit of the organization, but not to one elsewhere', async () => {
    const admin = await world.signedIn('adminOrg1');
    const { bystander } = world.fixtures.users;
    const moved = await admin.patch(`/api/users/${bystander.id}`, { unitId: world.fixtures.org1.unitB });
    expect(moved.status).toBe(200);
    expect(moved.body.unit.label).toBe('1B');
    const elsewhere = await admin.patch(`/api/users/${bystander.id}`, { unitId: world.fixtures.org2.unitC });
    expect(elsewhere.status).toBe(404);
    await admin.patch(`/api/users/${bystander.id}`, { unitId: world.fixtures.org1.unitA });
  }, SPEC_TIMEOUT_MS);

  it('changes a role, clearing what the new role does not have, and takes effect on the next request', async () => {
    const admin = await world.signedIn('adminOrg1');
    const { bystander } = world.fixtures.users;
    const asBystander = await world.signedIn('bystander');
    expect((await asBystander.get('/api/invitations')).status).toBe(403);

    const promoted = await admin.patch(`/api/users/${bystander.id}`, { role: 'manager' });
    expect(promoted.body).toEqual(jasmine.objectContaining({ role: 'manager', unit: null, isAdmin: false }));
    expect((await asBystander.get('/api/invitations')).status).toBe(200);

    const asTenantWithoutUnit = await admin.patch(`/api/users/${bystander.id}`, { role: 'tenant' });
    expect(asTenantWithoutUnit.status).toBe(400);
    expect((await admin.patch(`/api/users/${bystander.id}`, { role: 'contractor', isAdmin: true })).status).toBe(400);
    const back = await admin.patch(`/api/users/${bystander.id}`, { role: 'tenant', unitId: world.fixtures.org1.unitA });
    expect(back.body).toEqual(jasmine.objectContaining({ role: 'tenant', isAdmin: false }));

    const entries = await world.db.dataSource.query(`SELECT detail FROM audit_log WHERE action = 'role-changed' AND target_id = $1 AND detail->'to'->>'role' = 'manager'`, [bystander.id]);
    expect(entries.length).toBe(1);
    expect(entries[0].detail.from).toEqual({ role: 'tenant', isAdmin: false, unitId: world.fixtures.org1.unitA });
  }, SPEC_TIMEOUT_MS);

  it('refuses to change or deactivate oneself, so an organization keeps its administrator', async () => {
    const admin = await world.signedIn('adminOrg1');
    const self = world.fixtures.users.adminOrg1.id;
    expect((await admin.patch(`/api/users/${self}`, { isAdmin: false })).status).toBe(409);
    expect((await admin.post(`/api/users/${self}/deactivate`)).status).toBe(409);
  }, SPEC_TIMEOUT_MS);

  it('deactivates and reactivates, recording both', async () => {
    const admin = await world.signedIn('adminOrg1');
    const { tenantB } = world.fixtures.users;
    const off = await admin.post(`/api/users/${tenantB.id}/deactivate`);
    expect(off.body.deactivatedAt).not.toBeNull();
    expect((await world.browser().signIn(tenantB.email, tenantB.password)).status).toBe(401);
    expect((await admin.get('/api/users?status=deactivated')).body.items.map((user: UserSummary) => user.id)).toEqual([tenantB.id]);
    const on = await admin.post(`/api/users/${tenantB.id}/reactivate`);
    expect(on.body.deactivatedAt).toBeNull();
    expect((await world.browser().signIn(tenantB.email, tenantB.password)).status).toBe(200);
    const audit = await admin.get('/api/audit-log?pageSize=200');
    const actions = audit.body.items.filter((entry: { targetId: string }) => entry.targetId === tenantB.id).map((entry: { action: string }) => entry.action);
    expect(actions).toEqual(jasmine.arrayContaining(['user-deactivated', 'user-reactivated']));
  }, SPEC_TIMEOUT_MS);

  it("keeps each organization's audit log to itself", async () => {
    const admin2 = await world.signedIn('adminOrg2');
    const log = await admin2.get('/api/audit-log?pageSize=200');
    const orgOneUsers = new Set([world.fixtures.users.tenantB.id, world.fixtures.users.bystander.id]);
    expect(log.body.items.filter((entry: { targetId: string }) => orgOneUsers.has(entry.targetId))).toEqual([]);
  }, SPEC_TIMEOUT_MS);

  it('offers the units of the organization for invitations', async () => {
    const manager = await world.signedIn('managerOrg1');
    const options = await manager.get('/api/invitations/unit-options');
    expect(options.body).toEqual([
      { id: world.fixtures.org1.unitA, label: '1A', propertyName: 'Cedar Row' },
      { id: world.fixtures.org1.unitB, label: '1B', propertyName: 'Cedar Row' },
    ]);
  }, SPEC_TIMEOUT_MS);

  it('refuses user management to a service caller that is not an administrator (defence behind the route)', async () => {
    const services = buildAccountServices(world.db.dataSource, loadConfig({ NODE_ENV: 'test' }), pino({ level: 'silent' }));
    const tenant = (await (await world.signedIn('tenantA')).get('/api/auth/session')).body.user;
    const manager = (await (await world.signedIn('managerOrg1')).get('/api/auth/session')).body.user;
    for (const actor of [tenant, manager]) {
      await expectAsync(services.users.list(actor, { status: 'all', sort: 'email', direction: 'asc', page: 0, pageSize: 10 })).toBeRejectedWith(jasmine.objectContaining({ status: 403 }));
      await expectAsync(services.users.get(actor, world.fixtures.users.bystander.id)).toBeRejectedWith(jasmine.objectContaining({ status: 403 }));
    }
    await expectAsync(services.invitations.list(tenant)).toBeRejectedWith(jasmine.objectContaining({ status: 403 }));
    await expectAsync(services.audit.list(manager, { page: 0, pageSize: 10 })).toBeRejectedWith(jasmine.objectContaining({ status: 403 }));
  }, SPEC_TIMEOUT_MS);
});

describe('profile', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it("shows a tenant their own unit and organization", async () => {
    const tenant = await world.signedIn('tenantA');
    const profile = await tenant.get('/api/profile');
    expect(profile.body).toEqual(jasmine.objectContaining({ role: 'tenant', organizationName: 'Maplewood Homes (spec)', unit: { id: world.fixtures.org1.unitA, label: '1A', propertyName: 'Cedar Row' } }));
  }, SPEC_TIMEOUT_MS);

  it('updates name, phone, temperature unit and time zone, and checks each', async () => {
    const browser = await world.signedIn('managerOrg1');
    const res = await browser.patch('/api/profile', { displayName: '  Riley Manager ', phone: '+1 (555) 010-0199', temperatureUnit: 'C', timeZone: 'America/Denver' });
    expect(res.status).toBe(200);
    expect(res.body).toEqual(jasmine.objectContaining({ displayName: 'Riley Manager', phone: '+1 (555) 010-0199', temperatureUnit: 'C', timeZone: 'America/Denver' }));
    expect((await browser.get('/api/auth/session')).body.user.temperatureUnit).toBe('C');
    const bad = await browser.patch('/api/profile', { timeZone: 'Mars/Olympus', temperatureUnit: 'K' });
    expect(bad.status).toBe(400);
    expect(bad.body.details.map((detail: { path: string }) => detail.path).sort()).toEqual(['temperatureUnit', 'timeZone']);
    expect((await browser.patch('/api/profile', { role: 'manager', isAdmin: true })).status).toBe(400);
  }, SPEC_TIMEOUT_MS);

  it('changes the password with the current one, keeping this session and ending the others', async () => {
    const here = await world.signedIn('contractorWithJob');
    const elsewhere = await world.signedIn('contractorWithJob');
    const { contractorWithJob } = world.fixtures.users;
    const wrong = await here.post('/api/profile/password', { currentPassword: 'not the current one', newPassword: 'a fresh passphrase' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.details).toEqual([{ path: 'currentPassword', message: 'your current password is not correct' }]);
    const same = await here.post('/api/profile/password', { currentPassword: contractorWithJob.password, newPassword: contractorWithJob.password });
    expect(same.status).toBe(400);
    const ok = await here.post('/api/profile/password', { currentPassword: contractorWithJob.password, newPassword: 'a fresh passphrase' });
    expect(ok.status).toBe(204);
    expect((await here.get('/api/profile')).status).toBe(200);
    expect((await elsewhere.get('/api/profile')).status).toBe(401);
    expect((await world.browser().signIn(contractorWithJob.email, 'a fresh passphrase')).status).toBe(200);
  }, SPEC_TIMEOUT_MS);

  it('changes the e-mail address with the current password and tells the old address', async () => {
    const browser = await world.signedIn('tenantB');
    const { tenantB, tenantA } = world.fixtures.users;
    expect((await browser.post('/api/profile/email', { email: tenantA.email, currentPassword: tenantB.password })).status).toBe(409);
    const notice = await mailAfter(world, tenantB.email, async () => {
      const res = await browser.post('/api/profile/email', { email: 'Tenant.B.New@Example.com', currentPassword: tenantB.password });
      expect(res.status).toBe(200);
      expect(res.body.email).toBe('tenant.b.new@example.com');
    });
    expect(notice.subject).toBe('Your Chillwarden e-mail address was changed');
    expect(notice.text).toContain('tenant.b.new@example.com');
    expect((await world.browser().signIn('tenant.b.new@example.com', tenantB.password)).status).toBe(200);
  }, SPEC_TIMEOUT_MS);
});
