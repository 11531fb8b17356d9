/**
 * The live monitor: the ingest's committed-batch hook. Per appliance it keeps a detection
 * engine and an incident tracker (cached in memory, persisted once per batch), stores
 * findings, incidents and health, checks each property for a power loss, and publishes
 * what changed on the event bus. Batches are handled one at a time, in arrival order.
 */
import type { Logger } from 'pino';
import type { DataSource, EntityManager } from 'typeorm';
import type { EventPlace } from '../../shared/api/monitor';
import type { Clock } from '../auth/clock';
import type { BusEvent, EventBus } from '../events/bus';
import type { ApplianceStatusEvent } from '../events/internal';
import type { CommittedBatch, CommittedBatchHook } from '../ingest/pipeline';
import type { StoredReading } from '../ingest/store';
import { BatchChanges, incidentEventTypes } from './batch-changes';
import { groupByAppliance } from './readings';
import { loadAppliances, readingsBetween, linkFindings, saveStates, upsertFindings, upsertIncidents, type CatchUpReading } from './monitor-store';
import { MonitoredAppliance } from './monitored-appliance';
import { PowerLossWatch, type PropertyIncidentChange } from './power-loss';
import { INCIDENT_COLUMNS, incidentViewOf } from './views';
import { LivenessSweep } from './liveness-sweep';
import { SerialQueue } from './serial-queue';
import { EffectiveSettingsCache, type SettingsSource } from './settings-cache';
import { DetectionSettingsService } from '../services/detection-settings';

export interface MonitorDeps {
  dataSource: DataSource;
  bus: EventBus;
  logger: Logger;
  clock: Clock;
  /** Appliances kept in memory; the least recently reporting ones are reloaded when needed. */
  cacheLimit?: number;
  /** Where the organization's detection settings come from (default: the stored overrides). */
  settings?: SettingsSource;
}

const DEFAULT_CACHE_LIMIT = 50_000;

type FeedReading = CatchUpReading | StoredReading;

export function placeOf(appliance: MonitoredAppliance): EventPlace {
  const { organizationId, propertyId, unitId, applianceId } = appliance.ref;
  return { organizationId, propertyId, unitId, applianceId };
}

export class MonitorService {
  /** Pass this to startIngestInServer. */
  readonly hook: CommittedBatchHook = (batch) => this.handleBatch(batch);
  private readonly cache = new Map<string, MonitoredAppliance>();
  private readonly queue = new SerialQueue();
  private readonly powerLoss = new PowerLossWatch();
  private readonly liveness: LivenessSweep;
  private readonly settings: EffectiveSettingsCache;

  constructor(private readonly deps: MonitorDeps) {
    const source = deps.settings ?? new DetectionSettingsService(deps.dataSource);
    this.settings = new EffectiveSettingsCache(source, () => deps.clock.now().getTime());
    this.liveness = new LivenessSweep({ dataSource: deps.dataSource, bus: deps.bus, logger: deps.logger, cached: (id) => this.cache.get(id) });
  }

  handleBatch(batch: CommittedBatch): Promise<void> {
    return this.queue.run(() => this.process(batch.readings));
  }

  /** Marks appliances whose sensor stopped reporting as silent (run it every minute or so). */
  sweepLiveness(): Promise<number> {
    return this.queue.run(() => this.liveness.sweep(this.deps.clock.now().getTime()));
  }

  /** Resolves when every batch handed in so far is handled. */
  idle(): Promise<void> {
    return this.queue.run(async () => undefined);
  }

  /** Stops listening for settings changes once the batches handed in are handled. */
  async close(): Promise<void> {
    await this.idle();
    this.settings.close();
  }

  private async process(readings: readonly StoredReading[]): Promise<void> {
    const groups: Map<string, FeedReading[]> = groupByAppliance(readings);
    if (!groups.size) return;
    const appliances = await this.appliancesFor(groups);
    await this.applySettings(appliances);
    const nowMs = this.deps.clock.now().getTime();
    const changes = new BatchChanges();
    for (const [applianceId, group] of groups) {
      const appliance = appliances.get(applianceId);
      if (!appliance) continue;
      changes.take(appliance, appliance.feed(group));
      appliance.lastHeardMs = nowMs;
      const previous = appliance.restored ? appliance.health : null;
      if (appliance.updateHealth(nowMs) || previous === null) changes.noteHealth(appliance, previous);
    }
    const events = await this.persist(changes);
    await this.deps.bus.publishAll(events);
  }

  /** Cached appliances, the rest loaded in one query (plus any readings they missed while down). */
  private async appliancesFor(groups: Map<string, FeedReading[]>): Promise<Map<string, MonitoredAppliance>> {
    const found = new Map<string, MonitoredAppliance>();
    const missing: string[] = [];
    for (const id of groups.keys()) {
      const cached = this.cache.get(id);
      if (cached) {
        this.cache.delete(id);
        this.cache.set(id, cached);
        found.set(id, cached);
      } else missing.push(id);
    }
    if (!missing.length) return found;
    const nowMs = this.deps.clock.now().getTime();
    const loaded = await loadAppliances(this.deps.dataSource, missing);
    for (const { ref, saved } of loaded.values()) {
      const appliance = new MonitoredAppliance(ref, saved, nowMs, await this.settings.get(ref.organizationId, ref.style));
      await this.catchUp(appliance, groups.get(ref.applianceId) ?? []);
      this.remember(appliance);
      found.set(ref.applianceId, appliance);
    }
    return found;
  }

  /** Cached appliances pick up settings a manager changed since their last batch. */
  private async applySettings(appliances: Map<string, MonitoredAppliance>): Promise<void> {
    for (const appliance of appliances.values()) {
      appliance.useSettings(await this.settings.get(appliance.ref.organizationId, appliance.ref.style));
    }
  }

  private async catchUp(appliance: MonitoredAppliance, group: FeedReading[]): Promise<void> {
    const lastAtMs = appliance.lastAtMs;
    if (lastAtMs === null || !group.length) return;
    const missed = await readingsBetween(this.deps.dataSource, appliance.ref.applianceId, lastAtMs, group[0].atMs);
    if (missed.length) group.unshift(...missed);
  }

  private remember(appliance: MonitoredAppliance): void {
    this.cache.set(appliance.ref.applianceId, appliance);
    const limit = this.deps.cacheLimit ?? DEFAULT_CACHE_LIMIT;
    while (this.cache.size > limit) this.cache.delete(this.cache.keys().next().value as string);
  }

  private async persist(changes: BatchChanges): Promise<BusEvent[]> {
    try {
      return await this.deps.dataSource.transaction((db) => this.write(db, changes));
    } catch (error) {
      // The memory is ahead of the database now: forget it, the next batch reloads and catches up.
      for (const appliance of changes.touched) this.cache.delete(appliance.ref.applianceId);
      throw error;
    }
  }

  private async write(db: EntityManager, changes: BatchChanges): Promise<BusEvent[]> {
    const snapshots = changes.touched.map((appliance) => ({ appliance, engineState: appliance.engine.snapshot() }));
    await saveStates(db, snapshots);
    for (const appliance of changes.touched) appliance.restored = true;
    await upsertFindings(db, [...changes.findings.values()]);
    const writes = [...changes.incidents.values()];
    const ids = await upsertIncidents(db, writes);
    await linkFindings(
      db,
      writes.map((w) => ({ applianceId: w.ref.applianceId, incidentId: ids.get(`${w.ref.applianceId}|${w.incident.id}`) as string, findingIds: w.incident.findingIds })),
    );
    const events: BusEvent[] = [...this.healthEvents(changes), ...(await this.incidentEvents(db, changes, ids))];
    for (const propertyId of changes.propertiesToCorrelate) events.push(...propertyEvents(await this.powerLoss.check(db, propertyId)));
    events.push(...statusEvents(changes.touched));
    return events;
  }

  private healthEvents(changes: BatchChanges): BusEvent[] {
    return changes.health.map(({ appliance, previous }) => ({
      type: 'appliance.health-changed',
      ...placeOf(appliance),
      atMs: appliance.healthSinceMs,
      health: appliance.health,
      previous,
    }));
  }

  private async incidentEvents(db: EntityManager, changes: BatchChanges, ids: Map<string, string>): Promise<BusEvent[]> {
    if (!ids.size) return [];
    const rows: Record<string, unknown>[] = await db.query(`SELECT ${INCIDENT_COLUMNS} FROM incident i WHERE i.id = ANY($1::uuid[])`, [[...ids.values()]]);
    const views = new Map(rows.map((row) => [row.id as string, incidentViewOf(row)]));
    const events: BusEvent[] = [];
    for (const [key, entry] of changes.incidents) {
      const incident = views.get(ids.get(key) as string);
      if (!incident) continue;
      for (const type of incidentEventTypes(entry.changes)) {
        events.push({ type: `incident.${type}`, ...placeOfIncident(incident), atMs: entry.incident.closedAtMs ?? entry.incident.openedAtMs, incident });
      }
    }
    return events;
  }
}

function placeOfIncident(incident: { organizationId: string; propertyId: string; unitId: string | null; applianceId: string | null }): EventPlace {
  return { organizationId: incident.organizationId, propertyId: incident.propertyId, unitId: incident.unitId, applianceId: incident.applianceId };
}

function propertyEvents(changes: PropertyIncidentChange[]): BusEvent[] {
  return changes.map(({ type, incident }) => ({
    type: `incident.${type}` as const,
    ...placeOfIncident(incident),
    atMs: Date.parse(incident.closedAt ?? incident.openedAt),
    incident,
  }));
}

function statusEvents(touched: readonly MonitoredAppliance[]): BusEvent[] {
  return touched.flatMap((appliance) => {
    if (!appliance.lastReading) return [];
    const event: ApplianceStatusEvent = {
      type: 'appliance.status',
      ...placeOf(appliance),
      applianceId: appliance.ref.applianceId,
      unitId: appliance.ref.unitId,
      lastReadingAtMs: appliance.lastReading.atMs,
      probes: appliance.engine.probeLevels(),
      openRepairFindings: appliance.openRepairFindings(),
      trail: appliance.trail.take(),
    };
    return [event];
  });
}
