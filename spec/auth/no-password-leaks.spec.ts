import type { Response } from 'supertest';
import { routeTableOf } from '../../server/auth/route-table';
import { createWorld, mailAfter, tokenFromLink, type World, SPEC_TIMEOUT_MS } from './support/world';

/**
 * Passwords never come back from any route and never reach the log: every response body
 * of a run through all account flows, and every log line, is searched for the passwords
 * used, for bcrypt hashes and for the password_hash column.
 */
describe('passwords are never returned or logged', () => {
  let world: World;
  const responses: Response[] = [];
  const PASSWORDS = {
    invitee: 'invitee chosen passphrase',
    reset: 'reset chosen passphrase',
    changed: 'changed chosen passphrase',
    wrongGuess: 'a wrong guess passphrase',
  };

  /** supertest keeps the request on the response; its types do not say so. */
  const requestOf = (res: Response) => (res as unknown as { req: { method: string; path: string } }).req;
  const keep = (res: Response) => {
    responses.push(res);
    return res;
  };

  beforeAll(async () => {
    world = await createWorld();
    const { users, org1 } = world.fixtures;
    const admin = await world.signedIn('adminOrg1');
    keep(await admin.get('/api/auth/session'));
    keep(await admin.get('/api/profile'));
    keep(await admin.get('/api/users?pageSize=200&status=all'));
    keep(await admin.get(`/api/users/${users.tenantA.id}`));
    keep(await admin.patch(`/api/users/${users.bystander.id}`, { role: 'tenant', unitId: org1.unitB }));
    keep(await admin.get('/api/audit-log?pageSize=200'));

    const invitation = await mailAfter(world, 'leak.check@example.com', async () =>
      keep(await admin.post('/api/invitations', { email: 'leak.check@example.com', displayName: 'Leak Check', role: 'tenant', unitId: org1.unitA })),
    );
    keep(await admin.get('/api/invitations'));
    const invitee = world.browser();
    await invitee.get('/api/auth/session');
    const token = tokenFromLink(invitation.links.find((link) => link.includes('accept-invitation')) as string);
    keep(await invitee.post('/api/invitations/preview', { token }));
    keep(await invitee.post('/api/invitations/accept', { token, password: PASSWORDS.invitee }));
    keep(await invitee.post('/api/auth/sign-in', { email: 'leak.check@example.com', password: PASSWORDS.wrongGuess }));
    keep(await invitee.post('/api/auth/sign-in', { email: 'leak.check@example.com', password: PASSWORDS.invitee }));
    keep(await invitee.post('/api/profile/password', { currentPassword: PASSWORDS.wrongGuess, newPassword: PASSWORDS.changed }));
    keep(await invitee.post('/api/profile/password', { currentPassword: PASSWORDS.invitee, newPassword: PASSWORDS.changed }));
    keep(await invitee.post('/api/profile/email', { email: 'leak.check2@example.com', currentPassword: PASSWORDS.changed }));

    const reset = await mailAfter(world, 'leak.check2@example.com', async () => keep(await invitee.post('/api/auth/forgot-password', { email: 'leak.check2@example.com' })), (m) => m.subject.startsWith('Reset'));
    const resetToken = tokenFromLink(reset.links.find((link) => link.includes('reset-password')) as string);
    keep(await invitee.post('/api/auth/reset-password', { token: resetToken, password: PASSWORDS.reset }));
    keep(await invitee.post('/api/auth/reset-password', { token: resetToken, password: PASSWORDS.reset }));
    keep(await invitee.post('/api/auth/sign-in', { email: 'leak.check2@example.com', password: PASSWORDS.reset }));
    keep(await invitee.post('/api/auth/sign-out'));
    // Let background e-mails and their log lines finish.
    await new Promise((resolve) => setTimeout(resolve, 200));
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('went through every account flow successfully', () => {
    const statuses = responses.map((res) => `${requestOf(res).method} ${requestOf(res).path} ${res.status}`);
    expect(statuses).toContain('POST /api/invitations/accept 201');
    expect(statuses).toContain('POST /api/profile/password 204');
    expect(statuses).toContain('POST /api/auth/reset-password 204');
    expect(statuses).toContain('POST /api/auth/sign-in 200');
    expect(statuses).toContain('POST /api/auth/sign-in 401');
  });

  it('returns no password, hash or hash column in any response', () => {
    const seeded = Object.values(world.fixtures.users).map((user) => user.password);
    for (const res of responses) {
      const body = JSON.stringify(res.body) + (res.text ?? '');
      for (const password of [...Object.values(PASSWORDS), ...seeded]) expect(body).withContext(requestOf(res).path).not.toContain(password);
      expect(body).not.toMatch(/\$2[aby]\$\d\d\$/);
      expect(body).not.toMatch(/password_?hash/i);
    }
  });

  it('writes no password, hash or link token to the log', () => {
    expect(world.logs.length).toBeGreaterThan(10);
    const log = world.logs.join('\n');
    for (const password of Object.values(PASSWORDS)) expect(log).not.toContain(password);
    expect(log).not.toMatch(/\$2[aby]\$\d\d\$/);
    expect(log).not.toMatch(/"token"/);
  });

  it('declares no route whose path would carry a secret (tokens travel in bodies)', () => {
    const paths = routeTableOf(world.app).records.map((record) => record.path);
    expect(paths.filter((path) => /:(token|password)/i.test(path))).toEqual([]);
  });
});
