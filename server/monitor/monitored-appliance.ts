import { probesOf, type ApplianceStyle, type Health } from '../../shared/domain';
import { DetectionEngine } from '../detection/engine';
import { IncidentTracker, type IncidentEvent, type IncidentTrackerState } from '../detection/incidents';
import { settingsFor, type DetectionSettings } from '../detection/settings';
import type { EngineState } from '../detection/state';
import { isRepairFinding, type EngineEvent } from '../detection/types';
import type { StoredReading } from '../ingest/store';
import { isSilent } from '../telemetry/liveness';
import { LevelTrail } from './level-trail';
import { engineReadingOf } from './readings';

/** Where an appliance sits and how its sensor reports. */
export interface ApplianceRef {
  applianceId: string;
  unitId: string;
  propertyId: string;
  organizationId: string;
  style: ApplianceStyle;
  /** The shortest reporting interval of its sensors (liveness is judged against it). */
  intervalSeconds: number;
}

export interface LastReading {
  atMs: number;
  freshFoodC: number | null;
  freezerC: number | null;
}

export interface SavedMonitorState {
  engineState: EngineState;
  trackerState: IncidentTrackerState;
  health: Health;
  healthSinceMs: number;
  lastReading: LastReading | null;
}

export interface FeedResult {
  engineEvents: EngineEvent[];
  incidentEvents: IncidentEvent[];
}

/** A saved engine state the current engine cannot take (another version) starts afresh. */
function restoreEngine(style: ApplianceStyle, settings: DetectionSettings, saved: EngineState | undefined): DetectionEngine {
  if (!saved) return new DetectionEngine(style, settings);
  try {
    return new DetectionEngine(style, settings, saved);
  } catch {
    return new DetectionEngine(style, settings);
  }
}

/** One appliance under watch: its engine, its incident tracker and what it last reported. */
export class MonitoredAppliance {
  private currentEngine: DetectionEngine;
  private currentTracker: IncidentTracker;
  private currentSettings: DetectionSettings;
  /** Quarter-hour levels for the work-order verification (rebuilt within the level window after a restart). */
  readonly trail: LevelTrail;
  health: Health;
  healthSinceMs: number;
  lastReading: LastReading | null;
  /** False until its state is first written (a new row) or after a failed write. */
  restored: boolean;
  /**
   * When this process last received readings for it, on the wall clock. A sensor that
   * reports is not silent even when its readings are old: a backlog after an outage, or the
   * demo's accelerated replay of the hours before start.
   */
  lastHeardMs: number | null = null;

  constructor(
    readonly ref: ApplianceRef,
    saved: SavedMonitorState | null,
    nowMs: number,
    /** The organization's effective settings for the style (defaults when not given). */
    settings: DetectionSettings = settingsFor(ref.style),
  ) {
    this.currentSettings = settings;
    this.currentEngine = restoreEngine(ref.style, settings, saved?.engineState);
    this.currentTracker = new IncidentTracker(settings, saved?.trackerState);
    this.trail = new LevelTrail(probesOf(ref.style), settings);
    this.health = saved?.health ?? 'silent';
    this.healthSinceMs = saved?.healthSinceMs ?? nowMs;
    this.lastReading = saved?.lastReading ?? null;
    this.restored = saved !== null;
  }

  get engine(): DetectionEngine {
    return this.currentEngine;
  }

  get tracker(): IncidentTracker {
    return this.currentTracker;
  }

  get settings(): DetectionSettings {
    return this.currentSettings;
  }

  /**
   * Judges from now on with other settings (a manager changed them): the engine and the
   * tracker carry on from their current state, so nothing learned and no open finding is lost.
   * Returns false when these are the settings already in use.
   */
  useSettings(settings: DetectionSettings): boolean {
    if (settings === this.currentSettings) return false;
    this.currentSettings = settings;
    this.currentEngine = restoreEngine(this.ref.style, settings, this.currentEngine.snapshot());
    this.currentTracker = new IncidentTracker(settings, this.currentTracker.snapshot());
    return true;
  }

  /** Time of the newest reading the engine has taken, or null before the first. */
  get lastAtMs(): number | null {
    return this.lastReading?.atMs ?? null;
  }

  /** Feeds readings in time order; readings at or before the last one are skipped by the engine. */
  feed(readings: readonly Pick<StoredReading, 'atMs' | 'freshFoodC' | 'freezerC' | 'freshFoodFlag' | 'freezerFlag' | 'doorOpen'>[]): FeedResult {
    const engineEvents: EngineEvent[] = [];
    const incidentEvents: IncidentEvent[] = [];
    for (const reading of readings) {
      if (this.lastReading && reading.atMs <= this.lastReading.atMs) continue;
      for (const event of this.engine.push(engineReadingOf(reading))) {
        engineEvents.push(event);
        incidentEvents.push(...this.tracker.handle(event));
      }
      this.lastReading = { atMs: reading.atMs, freshFoodC: reading.freshFoodC, freezerC: reading.freezerC };
      this.trail.add(reading.atMs, {
        fresh_food: reading.freshFoodFlag ? null : reading.freshFoodC,
        freezer: reading.freezerFlag ? null : reading.freezerC,
      });
    }
    // Incidents that stayed recovered for the reopen window close on the reading clock.
    if (this.lastReading) incidentEvents.push(...this.tracker.tick(this.lastReading.atMs));
    return { engineEvents, incidentEvents };
  }

  /** Health by the brief's words; a sensor past its liveness limit is silent whatever the engine thinks. */
  healthAt(nowMs: number): Health {
    if (!this.lastReading) return 'silent';
    const heardMs = Math.max(this.lastReading.atMs, this.lastHeardMs ?? Number.NEGATIVE_INFINITY);
    if (isSilent(heardMs, this.ref.intervalSeconds, nowMs)) return 'silent';
    return this.engine.health();
  }

  /** Sets the health; true when it changed. */
  updateHealth(nowMs: number): boolean {
    const health = this.healthAt(nowMs);
    if (health === this.health) return false;
    this.health = health;
    // A change seen in the readings dates from the reading; silence from the clock.
    this.healthSinceMs = health === 'silent' || !this.lastReading ? nowMs : this.lastReading.atMs;
    return true;
  }

  openRepairFindings(): number {
    return this.engine.openFindings().filter(isRepairFinding).length;
  }
}
