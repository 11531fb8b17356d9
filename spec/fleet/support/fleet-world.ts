/**
 * A throwaway database, the real app (accounts included) and small seeding helpers for the
 * fleet, appliance and live-feed specs. People sign in through the API as the client does.
 */
import bcrypt from 'bcryptjs';
import type { Express } from 'express';
import pino from 'pino';
import { createApp, type AppDeps } from '../../../server/app';
import { loadConfig } from '../../../server/config';
import { newEngineState, type EngineState } from '../../../server/detection/state';
import { EventBus } from '../../../server/events/bus';
import { probe } from '../../../server/services/health';
import { probesOf, type ApplianceStyle, type Health, type Role } from '../../../shared/domain';
import { Browser } from '../../auth/support/browser';
import { ManualClock } from '../../auth/support/manual-clock';
import { createTestDatabase, type TestDatabase } from '../../support/test-db';

export const SPEC_NOW = '2026-03-02T15:00:00Z';
/** A fresh database is migrated in beforeAll: allow for a busy machine. */
export const SETUP_TIMEOUT_MS = 60_000;
const HASH_ROUNDS = 4;

export interface FleetWorld {
  db: TestDatabase;
  app: Express;
  bus: EventBus;
  clock: ManualClock;
  seed: Seeder;
  /** Signs a seeded person in; returns their browser. */
  signIn(email: string): Promise<Browser>;
  close(): Promise<void>;
}

export interface PersonSeed {
  id: string;
  email: string;
}

export interface MonitorSeed {
  health: Health;
  sinceIso?: string;
  lastReadingIso?: string | null;
  freshFoodC?: number | null;
  freezerC?: number | null;
  engineState?: EngineState;
}

export interface IncidentSeed {
  organizationId: string;
  propertyId: string;
  unitId?: string | null;
  applianceId?: string | null;
  kind?: string;
  severity?: string;
  openedAtIso: string;
  closedAtIso?: string | null;
  causes?: { code: string; confidence: number }[];
}

export interface FindingSeed {
  organizationId: string;
  propertyId: string;
  applianceId: string;
  incidentId: string;
  kind: string;
  compartment: string;
  startedAtIso: string;
  detectedAtIso: string;
  endedAtIso?: string | null;
  severity?: string;
  summary?: string;
  forecastCrossingAtIso?: string | null;
}

let deviceCounter = 0;

/** Inserts rows the way the inventory and the monitor would have. */
export class Seeder {
  constructor(private readonly db: TestDatabase) {}

  private async one(sql: string, params: unknown[]): Promise<string> {
    const [row] = await this.db.dataSource.query(sql, params);
    return row.id;
  }

  organization(name: string): Promise<string> {
    return this.one(`INSERT INTO organization (name) VALUES ($1) RETURNING id`, [name]);
  }

  property(organizationId: string, name: string, timeZone = 'America/Chicago'): Promise<string> {
    return this.one(
      `INSERT INTO property (organization_id, name, address_line1, city, region, postal_code, time_zone) VALUES ($1, $2, '12 Example Avenue', 'Riverton', 'IL', '60000', $3) RETURNING id`,
      [organizationId, name, timeZone],
    );
  }

  unit(propertyId: string, label: string, floor: number | null = null): Promise<string> {
    return this.one(`INSERT INTO unit (property_id, label, floor) VALUES ($1, $2, $3) RETURNING id`, [propertyId, label, floor]);
  }

  appliance(unitId: string, style: ApplianceStyle = 'top-freezer', extra: { installedOn?: string | null; warrantyEndsOn?: string | null; model?: string; serial?: string } = {}): Promise<string> {
    return this.one(`INSERT INTO appliance (unit_id, style, model, serial, installed_on, warranty_ends_on) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`, [
      unitId,
      style,
      extra.model ?? '',
      extra.serial ?? '',
      extra.installedOn ?? null,
      extra.warrantyEndsOn ?? null,
    ]);
  }

  async sensor(applianceId: string, deviceId = `cw-fleet${String(++deviceCounter).padStart(4, '0')}`): Promise<string> {
    await this.db.dataSource.query(`INSERT INTO sensor (device_id, appliance_id, secret_hash, interval_seconds) VALUES ($1, $2, 'not-a-real-hash', 300)`, [deviceId, applianceId]);
    return deviceId;
  }

  async monitor(applianceId: string, style: ApplianceStyle, state: MonitorSeed): Promise<void> {
    await this.db.dataSource.query(
      `INSERT INTO appliance_monitor (appliance_id, style, engine_state, tracker_state, health, health_since, last_reading_at, fresh_food_c, freezer_c)
       VALUES ($1, $2, $3, '{"open":[]}', $4, $5, $6, $7, $8)`,
      [
        applianceId,
        style,
        JSON.stringify(state.engineState ?? newEngineState(style, probesOf(style))),
        state.health,
        state.sinceIso ?? SPEC_NOW,
        state.lastReadingIso === undefined ? SPEC_NOW : state.lastReadingIso,
        state.freshFoodC ?? null,
        state.freezerC ?? null,
      ],
    );
  }

  incident(seed: IncidentSeed): Promise<string> {
    const level = seed.applianceId ? 'appliance' : 'property';
    const kind = seed.kind ?? 'over-temperature';
    const causes = seed.causes ?? [];
    return this.one(
      `INSERT INTO incident (organization_id, property_id, unit_id, appliance_id, level, engine_incident_id, lane, kind, kinds, started_at, opened_at, closed_at, severity, top_cause, probable_causes)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, ARRAY[$8], $9, $9, $10, $11, $12, $13) RETURNING id`,
      [
        seed.organizationId,
        seed.propertyId,
        seed.unitId ?? null,
        seed.applianceId ?? null,
        level,
        `spec-${Math.random().toString(36).slice(2)}`,
        kind === 'power-loss' ? 'power' : kind === 'sensor-fault' ? 'sensor' : 'repair',
        kind,
        seed.openedAtIso,
        seed.closedAtIso ?? null,
        seed.severity ?? 'urgent',
        causes[0]?.code ?? null,
        JSON.stringify(causes),
      ],
    );
  }

  finding(seed: FindingSeed): Promise<string> {
    return this.one(
      `INSERT INTO finding (organization_id, property_id, appliance_id, incident_id, engine_finding_id, kind, compartment, started_at, detected_at, ended_at, severity, summary, forecast_crossing_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12, $13) RETURNING id`,
      [
        seed.organizationId,
        seed.propertyId,
        seed.applianceId,
        seed.incidentId,
        `spec-${Math.random().toString(36).slice(2)}`,
        seed.kind,
        seed.compartment,
        seed.startedAtIso,
        seed.detectedAtIso,
        seed.endedAtIso ?? null,
        seed.severity ?? 'watch',
        seed.summary ?? '',
        seed.forecastCrossingAtIso ?? null,
      ],
    );
  }

  async person(role: Role, organizationId: string, unitId: string | null = null, name: string = role): Promise<PersonSeed> {
    const email = `${name.toLowerCase().replace(/\W+/g, '.')}.${Math.random().toString(36).slice(2, 8)}@example.com`;
    const hash = await bcrypt.hash(passwordOf(email), HASH_ROUNDS);
    const id = await this.one(
      `INSERT INTO app_user (email, display_name, role, organization_id, unit_id, password_hash) VALUES ($1, $2, $3, $4, $5, $6) RETURNING id`,
      [email, `Spec ${name}`, role, organizationId, unitId, hash],
    );
    return { id, email };
  }
}

export function passwordOf(email: string): string {
  return `pass-${email}-phrase`;
}

export async function createFleetWorld(options: { webApp?: AppDeps['webApp'] } = {}): Promise<FleetWorld> {
  const db = await createTestDatabase('cw_fleet');
  const clock = new ManualClock(Date.parse(SPEC_NOW));
  const bus = new EventBus();
  const config = { ...loadConfig({ NODE_ENV: 'test' }), clientDir: '/nonexistent', publicUrl: 'http://127.0.0.1:4280' };
  const app = createApp({
    config,
    dataSource: db.dataSource,
    logger: pino({ level: 'silent' }),
    brokerProbe: () => probe(async () => 'fake broker'),
    version: '0.0.0-spec',
    accounts: { clock, sessionSecret: 'fleet-spec-session-secret-long-enough', passwordHashRounds: HASH_ROUNDS },
    bus,
    webApp: options.webApp,
  });
  return {
    db,
    app,
    bus,
    clock,
    seed: new Seeder(db),
    async signIn(email) {
      const browser = new Browser(app);
      const res = await browser.signIn(email, passwordOf(email));
      if (res.status !== 200) throw new Error(`${email} could not sign in: ${res.status} ${JSON.stringify(res.body)}`);
      return browser;
    },
    close: () => db.drop(),
  };
}
