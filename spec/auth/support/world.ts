import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import pino, { type Logger } from 'pino';
import { createApp } from '../../../server/app';
import type { AccountsOptions } from '../../../server/auth/accounts';
import type { RateLimitSettings } from '../../../server/auth/rate-limits';
import { newLinkToken } from '../../../server/auth/tokens';
import { loadConfig } from '../../../server/config';
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import type { InboxMessage } from '../../../server/mail/inbox';
import { createSmtpMailer, type Mailer } from '../../../server/mail/mailer';
import { EventBus } from '../../../server/events/bus';
import { probe } from '../../../server/services/health';
import { startLocalS3, type ObjectStorage } from '../../../server/storage/setup';
import { createWorkOrders, type WorkOrders } from '../../../server/work-orders/create';
import type { Role } from '../../../shared/domain';
import { createTestDatabase, type TestDatabase } from '../../support/test-db';
import { Browser } from './browser';
import { ManualClock } from './manual-clock';

/** Set-up and tear-down make a database and run every migration: give them room on a busy machine. */
export const SPEC_TIMEOUT_MS = 60_000;

/** Low bcrypt cost keeps specs fast; production uses DEFAULT_PASSWORD_HASH_ROUNDS. */
export const SPEC_HASH_ROUNDS = 4;

export interface SeededUser {
  id: string;
  email: string;
  password: string;
  role: Role;
  isAdmin: boolean;
  organizationId: string;
  unitId: string | null;
}

/** The people of the access matrix, and a bystander the admin routes act on. */
export const PEOPLE = ['tenantA', 'tenantB', 'contractorWithJob', 'contractorWithoutJob', 'managerOrg1', 'adminOrg1', 'adminOrg2', 'bystander'] as const;
export type Person = (typeof PEOPLE)[number];

export interface Fixtures {
  org1: { id: string; propertyId: string; unitA: string; unitB: string; applianceA: string };
  org2: { id: string; propertyId: string; unitC: string; applianceC: string };
  users: Record<Person, SeededUser>;
  /** A pending invitation of org 1, and its token. */
  invitation: { id: string; token: string };
}

export interface World {
  db: TestDatabase;
  app: Express;
  smtp: FakeSmtp;
  clock: ManualClock;
  /** Every line the app logged, at trace level. */
  logs: string[];
  fixtures: Fixtures;
  browser(): Browser;
  signedIn(person: Person): Promise<Browser>;
  close(): Promise<void>;
}

/** Limits high enough that only the rate-limit spec ever meets them. */
export const GENEROUS_LIMITS: Partial<RateLimitSettings> = {
  signInFailuresPerAccount: 1000,
  signInFailuresPerIp: 1000,
  resetRequestsPerAccount: 1000,
  resetRequestsPerIp: 1000,
  tokenFailuresPerIp: 1000,
};

async function insert(db: TestDatabase, sql: string, params: unknown[]): Promise<string> {
  const [row] = await db.dataSource.query(sql, params);
  return row.id;
}

async function seedPlaces(db: TestDatabase): Promise<Omit<Fixtures, 'users' | 'invitation'>> {
  const org1 = await insert(db, `INSERT INTO organization (name) VALUES ('Maplewood Homes (spec)') RETURNING id`, []);
  const org2 = await insert(db, `INSERT INTO organization (name) VALUES ('Birchline Lettings (spec)') RETURNING id`, []);
  const property = (org: string, name: string) =>
    insert(db, `INSERT INTO property (organization_id, name, address_line1, city, time_zone) VALUES ($1, $2, '1 Example Road', 'Springfield', 'America/Chicago') RETURNING id`, [org, name]);
  const unit = (propertyId: string, label: string) => insert(db, `INSERT INTO unit (property_id, label) VALUES ($1, $2) RETURNING id`, [propertyId, label]);
  const appliance = (unitId: string) => insert(db, `INSERT INTO appliance (unit_id, style) VALUES ($1, 'top-freezer') RETURNING id`, [unitId]);
  const property1 = await property(org1, 'Cedar Row');
  const property2 = await property(org2, 'Quarry Lane');
  const unitA = await unit(property1, '1A');
  const unitB = await unit(property1, '1B');
  const unitC = await unit(property2, '7C');
  return {
    org1: { id: org1, propertyId: property1, unitA, unitB, applianceA: await appliance(unitA) },
    org2: { id: org2, propertyId: property2, unitC, applianceC: await appliance(unitC) },
  };
}

async function seedUser(db: TestDatabase, person: string, user: Omit<SeededUser, 'id' | 'email' | 'password'>): Promise<SeededUser> {
  const email = `${person.toLowerCase()}@example.com`;
  const password = `${person}-secret-passphrase`;
  const hash = await bcrypt.hash(password, SPEC_HASH_ROUNDS);
  const id = await insert(
    db,
    `INSERT INTO app_user (email, display_name, role, is_admin, organization_id, unit_id, password_hash) VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
    [email, `Spec ${person}`, user.role, user.isAdmin, user.organizationId, user.unitId, hash],
  );
  return { id, email, password, ...user };
}

async function seedPeople(db: TestDatabase, places: Omit<Fixtures, 'users' | 'invitation'>): Promise<Record<Person, SeededUser>> {
  const { org1, org2 } = places;
  const tenant = (organizationId: string, unitId: string) => ({ role: 'tenant' as const, isAdmin: false, organizationId, unitId });
  const contractor = { role: 'contractor' as const, isAdmin: false, organizationId: org1.id, unitId: null };
  const manager = (organizationId: string, isAdmin: boolean) => ({ role: 'manager' as const, isAdmin, organizationId, unitId: null });
  return {
    tenantA: await seedUser(db, 'tenantA', tenant(org1.id, org1.unitA)),
    tenantB: await seedUser(db, 'tenantB', tenant(org1.id, org1.unitB)),
    contractorWithJob: await seedUser(db, 'contractorWithJob', contractor),
    contractorWithoutJob: await seedUser(db, 'contractorWithoutJob', contractor),
    managerOrg1: await seedUser(db, 'managerOrg1', manager(org1.id, false)),
    adminOrg1: await seedUser(db, 'adminOrg1', manager(org1.id, true)),
    adminOrg2: await seedUser(db, 'adminOrg2', manager(org2.id, true)),
    bystander: await seedUser(db, 'bystander', tenant(org1.id, org1.unitA)),
  };
}

async function seedInvitation(db: TestDatabase, fixtures: Omit<Fixtures, 'invitation'>, clock: ManualClock): Promise<Fixtures['invitation']> {
  const link = newLinkToken();
  const expiresAt = new Date(clock.now().getTime() + 7 * 24 * 3600_000);
  const id = await insert(
    db,
    `INSERT INTO invitation (organization_id, email, display_name, role, unit_id, token_hash, invited_by_user_id, expires_at)
     VALUES ($1, 'pending.tenant@example.com', 'Pending Tenant', 'tenant', $2, $3, $4, $5) RETURNING id`,
    [fixtures.org1.id, fixtures.org1.unitB, link.tokenHash, fixtures.users.adminOrg1.id, expiresAt],
  );
  return { id, token: link.token };
}

export interface WorldOptions {
  rateLimits?: Partial<RateLimitSettings>;
  publicUrl?: string;
  accounts?: Partial<AccountsOptions>;
  /** Replace the SMTP mailer, e.g. with one that fails. */
  mailer?: Mailer;
  /** Mount the work-order loop (requests, jobs, contractors, tenant side), as main.ts does. */
  workOrders?: boolean;
}

interface WorkOrderParts {
  workOrders: WorkOrders;
  storage: ObjectStorage;
  folder: string;
  bus: EventBus;
}

/** The loop with its local S3 fake; its timers stay off, so nothing moves unless a spec asks. */
async function startWorkOrders(dataSource: TestDatabase['dataSource'], logger: Logger, clock: ManualClock, mailer: Mailer, publicUrl: string): Promise<WorkOrderParts> {
  const folder = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-auth-s3-'));
  const storage = await startLocalS3(folder);
  const bus = new EventBus(logger);
  const workOrders = createWorkOrders({ dataSource, publicUrl, logger, bus, clock, mailer, store: storage.store });
  await workOrders.start(0);
  return { workOrders, storage, folder, bus };
}

/** A throwaway database with two organizations and every role, the fake SMTP server and the app. */
export async function createWorld(options: WorldOptions = {}): Promise<World> {
  const db = await createTestDatabase('cw_auth');
  const clock = new ManualClock();
  const inboxFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-inbox-'));
  const smtp = await startFakeSmtp({ inboxFolder });
  const mailer = options.mailer ?? createSmtpMailer({ smtpUrl: smtp.url, from: 'Chillwarden <no-reply@chillwarden.example.com>', local: true });
  const places = await seedPlaces(db);
  const users = await seedPeople(db, places);
  const invitation = await seedInvitation(db, { ...places, users }, clock);
  const fixtures: Fixtures = { ...places, users, invitation };
  const logs: string[] = [];
  const logger = pino({ level: 'trace' }, { write: (line: string) => logs.push(line) });
  const config = { ...loadConfig({ NODE_ENV: 'test' }), clientDir: '/nonexistent', publicUrl: options.publicUrl ?? 'http://127.0.0.1:4280' };
  const loop = options.workOrders ? await startWorkOrders(db.dataSource, logger, clock, mailer, config.publicUrl) : null;
  const app = createApp({
    config,
    dataSource: db.dataSource,
    logger,
    brokerProbe: () => probe(async () => 'fake broker'),
    version: '0.0.0-spec',
    accounts: {
      mailer,
      devInbox: smtp.inbox,
      clock,
      sessionSecret: 'spec-session-secret-that-is-long-enough',
      passwordHashRounds: SPEC_HASH_ROUNDS,
      rateLimits: { ...GENEROUS_LIMITS, ...options.rateLimits },
      ...options.accounts,
    },
    ...(loop ? { bus: loop.bus, workOrders: loop.workOrders } : {}),
  });
  const browser = () => new Browser(app);
  return {
    db,
    app,
    smtp,
    clock,
    logs,
    fixtures,
    browser,
    async signedIn(person) {
      const session = browser();
      const user = users[person];
      const res = await session.signIn(user.email, user.password);
      if (res.status !== 200) throw new Error(`${person} could not sign in: ${res.status} ${JSON.stringify(res.body)}`);
      return session;
    },
    async close() {
      if (loop) {
        await loop.workOrders.stop();
        await loop.storage.close();
        fs.rmSync(loop.folder, { recursive: true, force: true });
      }
      mailer.close();
      await smtp.close();
      await db.drop();
      fs.rmSync(inboxFolder, { recursive: true, force: true });
    },
  };
}

/** Runs `action`, then waits for a message to `address` that was not in the inbox before. */
export async function mailAfter(world: World, address: string, action: () => Promise<unknown>, what = (message: InboxMessage) => !!message): Promise<InboxMessage> {
  const known = new Set(world.smtp.inbox.ids());
  await action();
  for (let tries = 0; tries < 150; tries++) {
    for (const id of world.smtp.inbox.ids()) {
      if (known.has(id)) continue;
      const message = await world.smtp.inbox.get(id);
      if (message && message.to.toLowerCase().includes(address.toLowerCase()) && what(message)) return message;
    }
    await new Promise((resolve) => setTimeout(resolve, 20));
  }
  throw new Error(`no new mail to ${address}`);
}

/** The link's token from an e-mail: it travels in the URL fragment. */
export function tokenFromLink(link: string): string {
  return new URL(link).hash.slice(1);
}
