import { createWorld, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('CSRF protection (double-submit token, Angular XSRF names)', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('refuses a state-changing request without the X-XSRF-TOKEN header', async () => {
    const browser = await world.signedIn('managerOrg1');
    browser.sendCsrfHeader = false;
    const res = await browser.patch('/api/profile', { temperatureUnit: 'C' });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/reload the page/);
    browser.sendCsrfHeader = true;
    expect((await browser.patch('/api/profile', { temperatureUnit: 'C' })).status).toBe(200);
  }, SPEC_TIMEOUT_MS);

  it('refuses a sign-in without the token too (login CSRF)', async () => {
    const { tenantA } = world.fixtures.users;
    const browser = world.browser();
    browser.sendCsrfHeader = false;
    await browser.get('/api/auth/session');
    expect((await browser.post('/api/auth/sign-in', { email: tenantA.email, password: tenantA.password })).status).toBe(403);
  }, SPEC_TIMEOUT_MS);

  it('refuses a header that does not match the cookie', async () => {
    const browser = await world.signedIn('tenantA');
    const real = browser.csrfToken;
    browser.csrfToken = real.replace(/.$/, (last) => (last === 'a' ? 'b' : 'a'));
    expect((await browser.post('/api/auth/sign-out')).status).toBe(403);
    browser.csrfToken = real;
    expect((await browser.post('/api/auth/sign-out')).status).toBe(204);
  }, SPEC_TIMEOUT_MS);

  it("refuses another session's token, even with matching cookie and header", async () => {
    const victim = await world.signedIn('tenantA');
    const attacker = await world.signedIn('tenantB');
    // The attacker plants their own valid token pair in the victim's request.
    const res = await victim.agent
      .patch('/api/profile')
      .set('Cookie', `XSRF-TOKEN=${encodeURIComponent(attacker.csrfToken)}`)
      .set('X-XSRF-TOKEN', attacker.csrfToken)
      .send({ temperatureUnit: 'C' });
    expect(res.status).toBe(403);
  }, SPEC_TIMEOUT_MS);

  it('issues a new token at sign-in: the one from before no longer works', async () => {
    const { contractorWithJob } = world.fixtures.users;
    const browser = world.browser();
    await browser.get('/api/auth/session');
    const anonymousToken = browser.csrfToken;
    expect(anonymousToken).toBeTruthy();
    await browser.post('/api/auth/sign-in', { email: contractorWithJob.email, password: contractorWithJob.password });
    expect(browser.csrfToken).not.toBe(anonymousToken);
    const signedInToken = browser.csrfToken;
    browser.csrfToken = anonymousToken;
    const stale = await browser.agent.patch('/api/profile').set('Cookie', `XSRF-TOKEN=${encodeURIComponent(anonymousToken)}`).set('X-XSRF-TOKEN', anonymousToken).send({ phone: '555-0100' });
    expect(stale.status).toBe(403);
    browser.csrfToken = signedInToken;
    expect((await browser.patch('/api/profile', { phone: '555-0100' })).status).toBe(200);
  }, SPEC_TIMEOUT_MS);

  it('needs no token for reads', async () => {
    const browser = await world.signedIn('adminOrg1');
    browser.sendCsrfHeader = false;
    expect((await browser.get('/api/users')).status).toBe(200);
  }, SPEC_TIMEOUT_MS);
});
