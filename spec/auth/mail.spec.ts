import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { simpleParser } from 'mailparser';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import { createSmtpMailer } from '../../server/mail/mailer';
import { devInboxAllowed, startMail } from '../../server/mail/setup';
import { invitationMail, passwordResetMail } from '../../server/mail/templates';
import { createWorld, mailAfter, type World, SPEC_TIMEOUT_MS } from './support/world';

describe('e-mail templates', () => {
  it('name the product, link the page, and say the same in text and HTML', () => {
    const mail = invitationMail({
      displayName: 'Sam <Tenant>',
      inviterName: 'Dana & Co',
      organizationName: 'Maplewood Homes',
      role: 'tenant',
      unitLabel: '2C',
      propertyName: 'Cedar Row',
      url: 'https://chillwarden.example.com/accept-invitation#abc',
      expiresAt: new Date('2026-03-09T15:00:00Z'),
    });
    expect(mail.subject).toBe('Dana & Co invited you to Chillwarden');
    expect(mail.text).toContain('https://chillwarden.example.com/accept-invitation#abc');
    expect(mail.text).toContain('unit 2C at Cedar Row');
    expect(mail.text).toContain('Mar 9, 2026');
    expect(mail.html).toContain('href="https://chillwarden.example.com/accept-invitation#abc"');
    expect(mail.html).toContain('Chillwarden');
    // Names are escaped in HTML, so a display name cannot inject markup.
    expect(mail.html).toContain('Sam &lt;Tenant&gt;');
    expect(mail.html).toContain('Dana &amp; Co');
    expect(mail.html).not.toContain('<Tenant>');
  });

  it('show the reset link expiry in the account holder\'s time zone', () => {
    const mail = passwordResetMail({ displayName: 'Jo', url: 'http://127.0.0.1:4280/reset-password#t', expiresAt: new Date('2026-07-01T16:00:00Z'), timeZone: 'America/Chicago' });
    expect(mail.text).toMatch(/Jul 1, 2026, 11:00\s?AM CDT/);
  });
});

describe('the fake SMTP server', () => {
  let smtp: FakeSmtp;
  let folder: string;

  beforeAll(async () => {
    folder = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-smtp-'));
    smtp = await startFakeSmtp({ inboxFolder: folder });
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => {
    await smtp.close();
    fs.rmSync(folder, { recursive: true, force: true });
  }, SPEC_TIMEOUT_MS);

  it('receives what nodemailer sends over SMTP and files it as an .eml file', async () => {
    const mailer = createSmtpMailer({ smtpUrl: smtp.url, from: 'Chillwarden <no-reply@chillwarden.example.com>', local: true });
    await mailer.send({ to: 'pat@example.com', subject: 'Hello from a spec', text: 'Open http://127.0.0.1:4280/sign-in now', html: '<p>Open it</p>' });
    mailer.close();
    const files = fs.readdirSync(folder).filter((name) => name.endsWith('.eml'));
    expect(files.length).toBe(1);
    const parsed = await simpleParser(fs.readFileSync(path.join(folder, files[0])));
    expect(parsed.subject).toBe('Hello from a spec');
    const message = await smtp.inbox.latestTo('pat@example.com');
    expect(message).toEqual(jasmine.objectContaining({ subject: 'Hello from a spec', links: ['http://127.0.0.1:4280/sign-in'], html: '<p>Open it</p>' }));
    expect(message?.from).toContain('no-reply@chillwarden.example.com');
  }, SPEC_TIMEOUT_MS);

  it('refuses to read files outside its folder', async () => {
    expect(smtp.inbox.raw('../../etc/passwd')).toBeNull();
    expect(await smtp.inbox.get('1234')).toBeNull();
  }, SPEC_TIMEOUT_MS);
});

describe('mail set-up', () => {
  it('serves the inbox over HTTP only on loopback unless told otherwise', () => {
    expect(devInboxAllowed({}, '127.0.0.1')).toBeTrue();
    expect(devInboxAllowed({}, '0.0.0.0')).toBeFalse();
    expect(devInboxAllowed({ DEV_INBOX: 'on' }, '0.0.0.0')).toBeTrue();
    expect(devInboxAllowed({ DEV_INBOX: 'off' }, '127.0.0.1')).toBeFalse();
  });

  it('starts the fake server when SMTP_URL is unset, and uses the relay when it is set', async () => {
    const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-mail-'));
    try {
      const local = await startMail({}, { dataDir, host: '127.0.0.1' });
      expect(local.inbox?.folder).toBe(path.join(dataDir, 'mail'));
      expect(local.inboxOverHttp).toBeTrue();
      await local.mailer.send({ to: 'x@example.com', subject: 'local', text: 't', html: '<p>t</p>' });
      expect(local.inbox?.ids().length).toBe(1);
      await local.close();
      const relay = await startMail({ SMTP_URL: 'smtp://relay.example.com:587' }, { dataDir, host: '127.0.0.1' });
      expect(relay.inbox).toBeNull();
      expect(relay.inboxOverHttp).toBeFalse();
      expect(relay.description).toContain('relay.example.com:587');
      await relay.close();
    } finally {
      fs.rmSync(dataDir, { recursive: true, force: true });
    }
  }, SPEC_TIMEOUT_MS);
});

describe('the dev inbox routes', () => {
  let world: World;

  beforeAll(async () => {
    world = await createWorld();
  }, SPEC_TIMEOUT_MS);
  afterAll(async () => world.close(), SPEC_TIMEOUT_MS);

  it('lists messages and shows one with its links, as JSON and as a page', async () => {
    const admin = await world.signedIn('adminOrg1');
    const message = await mailAfter(world, 'inbox.reader@example.com', () => admin.post('/api/invitations', { email: 'inbox.reader@example.com', displayName: 'Inbox Reader', role: 'contractor' }));
    const browser = world.browser();
    const list = await browser.get('/api/dev/inbox');
    expect(list.body.map((entry: { id: string }) => entry.id)).toContain(message.id);
    const one = await browser.get(`/api/dev/inbox/${message.id}`);
    expect(one.body.links.some((link: string) => link.startsWith('http://127.0.0.1:4280/accept-invitation#'))).toBeTrue();
    const page = await browser.get(`/dev/inbox/${message.id}`);
    expect(page.headers['content-type']).toContain('text/html');
    expect(page.text).toContain('<a href="http://127.0.0.1:4280/accept-invitation#');
    const html = await browser.get(`/dev/inbox/${message.id}/html`);
    expect(html.headers['content-security-policy']).toContain('sandbox');
    const raw = await browser.get(`/api/dev/inbox/${message.id}/raw`);
    expect(raw.headers['content-type']).toContain('message/rfc822');
    expect((await browser.get('/api/dev/inbox/0000000000000-00000000')).status).toBe(404);
  }, SPEC_TIMEOUT_MS);
});
