import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import bcrypt from 'bcryptjs';
import pino from 'pino';
import type { Express } from 'express';
import { createApp } from '../../../server/app';
import { loadConfig } from '../../../server/config';
import { EventBus, type BusEvent } from '../../../server/events/bus';
import { startFakeSmtp, type FakeSmtp } from '../../../server/mail/fake-smtp';
import type { InboxMessage } from '../../../server/mail/inbox';
import { createSmtpMailer, type Mailer } from '../../../server/mail/mailer';
import { MonitorService } from '../../../server/monitor/monitor-service';
import { probe } from '../../../server/services/health';
import { startLocalS3, type ObjectStorage } from '../../../server/storage/setup';
import { createWorkOrders, type WorkOrders } from '../../../server/work-orders/create';
import type { ApplianceStyle, Role } from '../../../shared/domain';
import { Browser } from '../../auth/support/browser';
import { GENEROUS_LIMITS } from '../../auth/support/world';
import { createTestDatabase, type TestDatabase } from '../../support/test-db';
import { createDevice, type TestDevice } from '../../telemetry/support/telemetry-fixture';
import { SpecClock, silentLogger } from '../../monitor/support/monitor-rig';

export const PUBLIC_URL = 'http://127.0.0.1:4280';
const HASH_ROUNDS = 4;
/** SPEC_LOG=warn shows what the loop logged (failed e-mails, failed handlers) while a spec runs. */
const logger = process.env.SPEC_LOG ? pino({ level: process.env.SPEC_LOG }) : silentLogger;

export interface Person {
  id: string;
  email: string;
  password: string;
  role: Role;
}

export interface Place {
  organizationId: string;
  propertyId: string;
  units: string[];
}

/**
 * One organization with a property, contractor companies with their people, a manager
 * and tenants; the app with the work-order loop, the monitor on a shared bus, the fake
 * SMTP server, the local S3 fake and a clock the spec sets. A second organization
 * holds an outsider manager.
 */
export interface WorkOrderWorld {
  db: TestDatabase;
  app: Express;
  smtp: FakeSmtp;
  storage: ObjectStorage;
  clock: SpecClock;
  bus: EventBus;
  events: BusEvent[];
  monitor: MonitorService;
  workOrders: WorkOrders;
  place: Place;
  contractors: { primary: string; backup: string };
  people: Record<'manager' | 'outsider' | 'primaryTech' | 'backupTech' | 'idleTech' | 'tenantA' | 'tenantB', Person>;
  /** A new appliance (with a registered sensor) in one of the property's units. */
  device(unitIndex: number, style?: ApplianceStyle): Promise<TestDevice>;
  signedIn(person: Person): Promise<Browser>;
  /** Messages to an address, oldest first. */
  mailTo(address: string): Promise<InboxMessage[]>;
  close(): Promise<void>;
}

async function one(db: TestDatabase, sql: string, params: unknown[] = []): Promise<string> {
  const [row] = await db.dataSource.query(sql, params);
  return row.id;
}

async function person(db: TestDatabase, name: string, role: Role, organizationId: string, unitId: string | null = null): Promise<Person> {
  const email = `${name.toLowerCase()}@example.com`;
  const password = `${name}-spec-passphrase`;
  const id = await one(
    db,
    `INSERT INTO app_user (email, display_name, role, organization_id, unit_id, password_hash) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
    [email, `Spec ${name}`, role, organizationId, unitId, await bcrypt.hash(password, HASH_ROUNDS)],
  );
  return { id, email, password, role };
}

async function seedPlace(db: TestDatabase, units: number): Promise<Place> {
  const organizationId = await one(db, `INSERT INTO organization (name) VALUES ('Hollowbrook Homes (spec)') RETURNING id`);
  const propertyId = await one(
    db,
    `INSERT INTO property (organization_id, name, address_line1, city, region, time_zone) VALUES ($1, 'Fernhill Court', '12 Example Lane', 'Millbrook', 'OR', 'America/Los_Angeles') RETURNING id`,
    [organizationId],
  );
  const unitIds: string[] = [];
  for (let i = 0; i < units; i++) unitIds.push(await one(db, `INSERT INTO unit (property_id, label) VALUES ($1, $2) RETURNING id`, [propertyId, `${i + 1}A`]));
  return { organizationId, propertyId, units: unitIds };
}

async function seedContractor(db: TestDatabase, organizationId: string, name: string, email: string, member: Person): Promise<string> {
  const id = await one(db, `INSERT INTO contractor (organization_id, name, email, phone) VALUES ($1, $2, $3, '555-0100') RETURNING id`, [organizationId, name, email]);
  await db.dataSource.query(`INSERT INTO contractor_member (contractor_id, user_id) VALUES ($1, $2)`, [id, member.id]);
  return id;
}

export interface WorldOptions {
  units?: number;
  /** Cover the property with a primary and a backup (default), only a primary, or nobody. */
  coverage?: 'primary-and-backup' | 'primary-only' | 'none';
}

export async function createWorkOrderWorld(options: WorldOptions = {}): Promise<WorkOrderWorld> {
  const db = await createTestDatabase('cw_wo');
  const place = await seedPlace(db, options.units ?? 3);
  const other = await one(db, `INSERT INTO organization (name) VALUES ('Elsewhere Lettings (spec)') RETURNING id`);
  const people = {
    manager: await person(db, 'manager', 'manager', place.organizationId),
    outsider: await person(db, 'outsider', 'manager', other),
    primaryTech: await person(db, 'primaryTech', 'contractor', place.organizationId),
    backupTech: await person(db, 'backupTech', 'contractor', place.organizationId),
    idleTech: await person(db, 'idleTech', 'contractor', place.organizationId),
    tenantA: await person(db, 'tenantA', 'tenant', place.organizationId, place.units[0]),
    tenantB: await person(db, 'tenantB', 'tenant', place.organizationId, place.units[1]),
  };
  const primary = await seedContractor(db, place.organizationId, 'Frostline Repair (spec)', 'dispatch@frostline.example.com', people.primaryTech);
  const backup = await seedContractor(db, place.organizationId, 'Coldbay Service (spec)', 'jobs@coldbay.example.com', people.backupTech);
  await seedContractor(db, place.organizationId, 'Idle Appliance Co (spec)', 'office@idle.example.com', people.idleTech);
  const coverage = options.coverage ?? 'primary-and-backup';
  if (coverage !== 'none') await db.dataSource.query(`INSERT INTO coverage (organization_id, contractor_id, property_id, appliance_style, rank) VALUES ($1, $2, $3, NULL, 'primary')`, [place.organizationId, primary, place.propertyId]);
  if (coverage === 'primary-and-backup') await db.dataSource.query(`INSERT INTO coverage (organization_id, contractor_id, property_id, appliance_style, rank) VALUES ($1, $2, $3, NULL, 'backup')`, [place.organizationId, backup, place.propertyId]);

  const inboxFolder = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-wo-inbox-'));
  const smtp = await startFakeSmtp({ inboxFolder });
  const mailer: Mailer = createSmtpMailer({ smtpUrl: smtp.url, from: 'Chillwarden <no-reply@chillwarden.example.com>', local: true });
  const s3Folder = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-wo-s3-'));
  const storage = await startLocalS3(s3Folder);
  const clock = new SpecClock();
  const bus = new EventBus(logger);
  const events: BusEvent[] = [];
  bus.onAny((event) => {
    events.push(event);
  });
  const monitor = new MonitorService({ dataSource: db.dataSource, bus, logger, clock });
  const workOrders = createWorkOrders({ dataSource: db.dataSource, publicUrl: PUBLIC_URL, logger, bus, clock, mailer, store: storage.store });
  await workOrders.start(0);
  const config = { ...loadConfig({ NODE_ENV: 'test' }), clientDir: '/nonexistent', publicUrl: PUBLIC_URL };
  const app = createApp({
    config,
    dataSource: db.dataSource,
    logger,
    brokerProbe: () => probe(async () => 'fake broker'),
    version: '0.0.0-spec',
    accounts: { mailer, sessionSecret: 'work-order-spec-session-secret-long-enough', passwordHashRounds: HASH_ROUNDS, rateLimits: GENEROUS_LIMITS },
    bus,
    workOrders,
  });

  return {
    db,
    app,
    smtp,
    storage,
    clock,
    bus,
    events,
    monitor,
    workOrders,
    place,
    contractors: { primary, backup },
    people,
    device: (unitIndex, style = 'top-freezer') =>
      createDevice(db.dataSource, { organizationId: place.organizationId, propertyId: place.propertyId, unitId: place.units[unitIndex] }, style, 300),
    async signedIn(who) {
      const browser = new Browser(app);
      const res = await browser.signIn(who.email, who.password);
      if (res.status !== 200) throw new Error(`${who.email} could not sign in: ${res.status} ${JSON.stringify(res.body)}`);
      return browser;
    },
    async mailTo(address) {
      const messages = [];
      for (const id of [...smtp.inbox.ids()].reverse()) {
        const message = await smtp.inbox.get(id);
        if (message && message.to.toLowerCase().includes(address.toLowerCase())) messages.push(message);
      }
      return messages;
    },
    async close() {
      await workOrders.stop();
      mailer.close();
      await smtp.close();
      await storage.close();
      await db.drop();
      fs.rmSync(inboxFolder, { recursive: true, force: true });
      fs.rmSync(s3Folder, { recursive: true, force: true });
    },
  };
}
