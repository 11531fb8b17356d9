import { createWorld, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('rate limits on sign-in and password reset', () => {
  let world: World;
  const PER_ACCOUNT = 3;
  const PER_IP = 6;

  beforeAll(async () => {
    world = await createWorld({
      rateLimits: { signInFailuresPerAccount: PER_ACCOUNT, signInFailuresPerIp: PER_IP, resetRequestsPerAccount: 2, resetRequestsPerIp: 1000, tokenFailuresPerIp: 4 },
    });
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  /** Each spec poses as its own client address, so per-IP counts do not leak between them. */
  const browserAt = (clientIp: string) => {
    const browser = world.browser();
    browser.clientIp = clientIp;
    return browser;
  };

  it('refuses the N+1th failed sign-in for an account with a clear message, even with the right password', async () => {
    const { tenantA } = world.fixtures.users;
    const browser = browserAt('192.0.2.1');
    await browser.get('/api/auth/session');
    for (let attempt = 1; attempt <= PER_ACCOUNT; attempt++) {
      expect((await browser.post('/api/auth/sign-in', { email: tenantA.email, password: `wrong guess ${attempt}` })).status).withContext(`attempt ${attempt}`).toBe(401);
    }
    const refused = await browser.post('/api/auth/sign-in', { email: tenantA.email, password: tenantA.password });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toBe('Too many failed sign-ins for this account. Wait 15 minutes, or reset your password.');
    expect(refused.body.retryAfterSeconds).toBeGreaterThan(0);
    expect(refused.headers['retry-after']).toBeDefined();
  }, SPEC_TIMEOUT_MS);

  it('does not count successful sign-ins', async () => {
    const { tenantB } = world.fixtures.users;
    for (let attempt = 0; attempt < PER_ACCOUNT + 2; attempt++) {
      const res = await browserAt('192.0.2.2').signIn(tenantB.email, tenantB.password);
      expect(res.status).withContext(`sign-in ${attempt}`).toBe(200);
    }
  }, SPEC_TIMEOUT_MS);

  it('limits failed sign-ins per IP address across accounts', async () => {
    const browser = browserAt('192.0.2.3');
    await browser.get('/api/auth/session');
    for (let attempt = 1; attempt <= PER_IP; attempt++) {
      const res = await browser.post('/api/auth/sign-in', { email: `stranger${attempt}@example.com`, password: 'guessing again' });
      expect(res.status).withContext(`attempt ${attempt}`).toBe(401);
    }
    const refused = await browser.post('/api/auth/sign-in', { email: 'yet-another@example.com', password: 'guessing again' });
    expect(refused.status).toBe(429);
    expect(refused.body.error).toBe('Too many failed sign-ins from your network. Wait 15 minutes and try again.');
    // Another address is not affected.
    const elsewhere = await browserAt('192.0.2.4').signIn('yet-another@example.com', 'guessing again');
    expect(elsewhere.status).toBe(401);
  }, SPEC_TIMEOUT_MS);

  it('limits reset requests per address, answering the same whether or not the account exists', async () => {
    const browser = browserAt('192.0.2.5');
    await browser.get('/api/auth/session');
    for (const email of ['managerorg1@example.com', 'no-such-person@example.com']) {
      expect((await browser.post('/api/auth/forgot-password', { email })).status).toBe(202);
      expect((await browser.post('/api/auth/forgot-password', { email })).status).toBe(202);
      const third = await browser.post('/api/auth/forgot-password', { email });
      expect(third.status).withContext(email).toBe(429);
      expect(third.body.error).toMatch(/Too many reset requests for this address/);
    }
  }, SPEC_TIMEOUT_MS);

  it('limits guesses at reset and invitation links per IP', async () => {
    const browser = browserAt('192.0.2.6');
    await browser.get('/api/auth/session');
    const statuses: number[] = [];
    for (let attempt = 0; attempt < 5; attempt++) {
      const res = await browser.post('/api/invitations/preview', { token: `${'B'.repeat(40)}${attempt}xyz` });
      statuses.push(res.status);
    }
    expect(statuses).toEqual([400, 400, 400, 400, 429]);
  }, SPEC_TIMEOUT_MS);
});
