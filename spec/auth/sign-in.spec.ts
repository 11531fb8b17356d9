import { BAD_CREDENTIALS } from '../../server/controllers/auth';
import { cookieFrom, setCookieLine } from './support/browser';
import { createWorld, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('sign-in and sessions', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('signs in with e-mail and password and answers who is signed in', async () => {
    const { tenantA } = world.fixtures.users;
    const browser = world.browser();
    const res = await browser.signIn(`  ${tenantA.email.toUpperCase()} `, tenantA.password);
    expect(res.status).toBe(200);
    expect(res.body.user).toEqual(jasmine.objectContaining({ id: tenantA.id, role: 'tenant', unitId: world.fixtures.org1.unitA, isAdmin: false }));
    const session = await browser.get('/api/auth/session');
    expect(session.body.user.email).toBe(tenantA.email);
  }, SPEC_TIMEOUT_MS);

  it('gives the same answer for an unknown address, a wrong password and a deactivated account', async () => {
    const { tenantB, bystander } = world.fixtures.users;
    await world.db.dataSource.query('UPDATE app_user SET deactivated_at = now() WHERE id = $1', [bystander.id]);
    try {
      const attempts = [
        ['nobody-here@example.com', 'whatever-password'],
        [tenantB.email, 'not-the-right-password'],
        [bystander.email, bystander.password],
      ];
      for (const [email, password] of attempts) {
        const res = await world.browser().signIn(email, password);
        expect(res.status).withContext(email).toBe(401);
        expect(res.body).withContext(email).toEqual({ error: BAD_CREDENTIALS });
      }
    } finally {
      await world.db.dataSource.query('UPDATE app_user SET deactivated_at = NULL WHERE id = $1', [bystander.id]);
    }
  }, SPEC_TIMEOUT_MS);

  it('changes the session id at sign-in, so a session id known before is worth nothing (fixation)', async () => {
    const browser = world.browser();
    const before = await browser.get('/api/auth/session');
    const sidBefore = cookieFrom(before, 'chillwarden.sid');
    expect(sidBefore).toBeTruthy();
    const { managerOrg1 } = world.fixtures.users;
    const signIn = await browser.post('/api/auth/sign-in', { email: managerOrg1.email, password: managerOrg1.password });
    const sidAfter = cookieFrom(signIn, 'chillwarden.sid');
    expect(sidAfter).toBeTruthy();
    expect(sidAfter).not.toBe(sidBefore);

    // An attacker holding the pre-sign-in cookie is still anonymous.
    const attacker = world.browser();
    const asAttacker = await attacker.agent.get('/api/auth/session').set('Cookie', `chillwarden.sid=${encodeURIComponent(sidBefore as string)}`);
    expect(asAttacker.body.user).toBeNull();
    expect((await browser.get('/api/profile')).status).toBe(200);
  }, SPEC_TIMEOUT_MS);

  it('sets the session cookie HttpOnly and SameSite=Lax, and the CSRF cookie readable by the page', async () => {
    const { tenantA } = world.fixtures.users;
    const browser = world.browser();
    await browser.get('/api/auth/session');
    const res = await browser.post('/api/auth/sign-in', { email: tenantA.email, password: tenantA.password });
    const session = setCookieLine(res, 'chillwarden.sid') ?? '';
    expect(session).toMatch(/HttpOnly/i);
    expect(session).toMatch(/SameSite=Lax/i);
    expect(session).not.toMatch(/Secure/i);
    const csrf = setCookieLine(res, 'XSRF-TOKEN') ?? '';
    expect(csrf).not.toMatch(/HttpOnly/i);
    expect(csrf).toMatch(/SameSite=Lax/i);
  }, SPEC_TIMEOUT_MS);

  it('destroys the session at sign-out: the old cookie no longer signs anyone in', async () => {
    const browser = await world.signedIn('tenantB');
    const profile = await browser.get('/api/profile');
    const sid = cookieFrom(profile, 'chillwarden.sid') as string;
    const out = await browser.post('/api/auth/sign-out');
    expect(out.status).toBe(204);
    expect(cookieFrom(out, 'chillwarden.sid')).toBe('');
    const replay = await world.browser().agent.get('/api/profile').set('Cookie', `chillwarden.sid=${encodeURIComponent(sid)}`);
    expect(replay.status).toBe(401);
    const [row] = await world.db.dataSource.query(`SELECT count(*)::int AS n FROM http_session WHERE sid = $1`, [sid.slice(2).split('.')[0]]);
    expect(row.n).toBe(0);
  }, SPEC_TIMEOUT_MS);

  it('ends the sessions of a user who is deactivated', async () => {
    const browser = await world.signedIn('contractorWithoutJob');
    expect((await browser.get('/api/profile')).status).toBe(200);
    const admin = await world.signedIn('adminOrg1');
    const res = await admin.post(`/api/users/${world.fixtures.users.contractorWithoutJob.id}/deactivate`);
    expect(res.status).toBe(200);
    expect((await browser.get('/api/profile')).status).toBe(401);
    await admin.post(`/api/users/${world.fixtures.users.contractorWithoutJob.id}/reactivate`);
  }, SPEC_TIMEOUT_MS);

  it('ends a session seven days after sign-in however active it was', async () => {
    const browser = await world.signedIn('tenantA');
    world.clock.advance(6 * 24 * 3600_000);
    expect((await browser.get('/api/profile')).status).toBe(200);
    world.clock.advance(1 * 24 * 3600_000 + 60_000);
    expect((await browser.get('/api/profile')).status).toBe(401);
    expect((await browser.get('/api/auth/session')).body.user).toBeNull();
  }, SPEC_TIMEOUT_MS);

  it('records sign-ins and failed sign-ins in the audit log, without the password', async () => {
    const { tenantB } = world.fixtures.users;
    await world.browser().signIn(tenantB.email, 'a-wrong-password-here');
    await world.signedIn('tenantB');
    const rows = await world.db.dataSource.query(`SELECT action, actor_user_id, detail::text AS detail FROM audit_log WHERE (detail->>'email' = $1 OR actor_user_id = $2) ORDER BY id`, [tenantB.email, tenantB.id]);
    const actions = rows.map((row: { action: string }) => row.action);
    expect(actions).toContain('sign-in-failed');
    expect(actions).toContain('sign-in');
    expect(JSON.stringify(rows)).not.toContain('a-wrong-password-here');
  }, SPEC_TIMEOUT_MS);
});

describe('sign-in behind HTTPS', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld({ publicUrl: 'https://chillwarden.example.com' });
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('marks the session and CSRF cookies Secure', async () => {
    const { tenantA } = world.fixtures.users;
    // supertest speaks plain HTTP: a TLS-terminating proxy on loopback says it was HTTPS.
    const viaTls = { 'X-Forwarded-Proto': 'https' };
    const first = await world.browser().agent.get('/api/auth/session').set(viaTls);
    const csrfLine = setCookieLine(first, 'XSRF-TOKEN') ?? '';
    expect(csrfLine).toMatch(/Secure/);
    const sid = cookieFrom(first, 'chillwarden.sid') as string;
    const csrf = cookieFrom(first, 'XSRF-TOKEN') as string;
    const res = await world
      .browser()
      .agent.post('/api/auth/sign-in')
      .set(viaTls)
      .set('Cookie', `chillwarden.sid=${encodeURIComponent(sid)}; XSRF-TOKEN=${encodeURIComponent(csrf)}`)
      .set('X-XSRF-TOKEN', csrf)
      .send({ email: tenantA.email, password: tenantA.password });
    expect(res.status).toBe(200);
    expect(setCookieLine(res, 'chillwarden.sid')).toMatch(/; Secure/);
  }, SPEC_TIMEOUT_MS);
});
