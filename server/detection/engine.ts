/**
 * The detection engine for one appliance: readings in time order go in, findings come out
 * as events. Pure (no I/O, no clock): live ingest, the logger-file analysis and the tests
 * all drive it the same way. snapshot() is plain JSON, so live ingest can persist it and
 * resume after a restart without re-reading the history.
 *
 * Per reading (hot path, no allocation unless an event happens): sensor checks, quarter-hour
 * bucket sums, the compressor cycle and defrost trackers, over-temperature. Per bucket:
 * the level, the learned baseline, warming-trend and no-cooling, and the diagnosis.
 */
import type { ApplianceStyle, Health, Probe } from '../../shared/domain';
import { probesOf } from '../../shared/domain';
import { defrostProbe, hasOpenRepair, isTrusted, type EngineContext } from './context';
import { closeFinding, countFreshAbove, noteAboveHistory, openFinding, updateFinding, type FindingPatch } from './finding-book';
import { addToBucket, adaptBaseline, bucketMs, closeBucket, finishLearning, learnLevel, resetWindow } from './level';
import { judgeOverTemp, overTempPatch } from './over-temperature';
import { judgeValue, recordVerdict } from './probe-check';
import { cyclePeriodMinutes, doorOpeningsPerDay, trackCycle, trackDoor, trackExcursion, transientLimitMinutes } from './rhythm';
import { DEFAULT_SETTINGS, type DetectionSettings } from './settings';
import { currentCauses, forgetEvidence } from './signature';
import { levelsOfState, newEngineState, STATE_VERSION, upgradeState, type EngineState, type ProbeState } from './state';
import { SENSOR_CAUSES } from './diagnosis';
import { sensorSummary } from './summaries';
import type { EngineEvent, EngineReading, Finding, LearnedNormal, ProbeLevelNow } from './types';
import { isRepairFinding } from './types';
import { judgeNoCooling, judgeWarming, noCoolingPatch, warmingPatch } from './warming';
import { closeDutyBucket, finishDutyLearning, trackDuty } from './duty';
import { judgeRhythmChange, rhythmChangePatch } from './rhythm-change';

const MINUTE_MS = 60_000;

// tsx/esbuild turn each imported name into a getter on the module object; the functions used
// for every reading are bound once here so the per-reading path makes plain calls.
const hot = { judgeValue, recordVerdict, addToBucket, trackCycle, trackExcursion, judgeOverTemp, countFreshAbove, trackDoor, hasOpenRepair, trackDuty };

const NO_EVENTS: readonly EngineEvent[] = Object.freeze([]);
const INTERVAL_WEIGHT = 0.05;

export interface EngineOptions {
  /** Probes actually present (a logger file may lack one); default: those of the style. */
  probes?: readonly Probe[];
}

export class DetectionEngine {
  private readonly state: EngineState;
  private readonly settings: DetectionSettings;
  private readonly ctx: EngineContext;
  private readonly bucketLengthMs: number;
  private readonly defrostCarrier: ProbeState | undefined;

  constructor(style: ApplianceStyle, settings: DetectionSettings = { ...DEFAULT_SETTINGS }, state?: EngineState, options: EngineOptions = {}) {
    const upgraded = state ? upgradeState(state) : undefined;
    if (state && !upgraded) throw new Error(`engine state version ${state.version} is not ${STATE_VERSION}`);
    if (state && state.style !== style) throw new Error(`engine state is for a ${state.style}, not a ${style}`);
    this.settings = settings;
    this.state = upgraded ? structuredClone(upgraded) : newEngineState(style, options.probes ?? probesOf(style));
    this.ctx = { state: this.state, settings, events: [] };
    this.bucketLengthMs = bucketMs(settings);
    this.defrostCarrier = defrostProbe(this.state);
  }

  /** Feeds one reading; readings at or before the last one are ignored (duplicates, late arrivals). */
  push(reading: EngineReading): readonly EngineEvent[] {
    const s = this.state;
    const atMs = reading.atMs;
    if (!Number.isFinite(atMs) || (s.lastAtMs !== null && atMs <= s.lastAtMs)) return NO_EVENTS;
    const events = this.ctx.events;
    events.length = 0;
    const gapMs = s.lastAtMs === null ? 0 : atMs - s.lastAtMs;
    s.nowMs = atMs;
    this.noteTime(atMs, gapMs);
    hot.trackDoor(s, reading.doorOpen, atMs);
    const bucket = Math.floor(atMs / this.bucketLengthMs);
    if (s.bucketIndex !== null && bucket !== s.bucketIndex) this.closeBuckets((s.bucketIndex + 1) * this.bucketLengthMs, atMs, gapMs);
    s.bucketIndex = bucket;
    const stuckAllowed = !hot.hasOpenRepair(s);
    for (let i = 0; i < s.probes.length; i++) {
      const p = s.probes[i];
      this.takeValue(p, p.probe === 'fresh_food' ? reading.freshFoodC : reading.freezerC, atMs, gapMs, stuckAllowed);
    }
    s.lastAtMs = atMs;
    return events.length ? events.slice() : NO_EVENTS;
  }

  private noteTime(atMs: number, gapMs: number): void {
    const s = this.state;
    s.firstAtMs ??= atMs;
    if (gapMs > 0) {
      const gapMin = gapMs / MINUTE_MS;
      s.intervalMin = s.intervalMin === null ? gapMin : s.intervalMin + INTERVAL_WEIGHT * (Math.min(gapMin, 60) - s.intervalMin);
    }
    hot.countFreshAbove(s, gapMs);
  }

  private takeValue(p: ProbeState, valueC: number | null, atMs: number, gapMs: number, stuckAllowed: boolean): void {
    const settings = this.settings;
    const verdict = hot.judgeValue(p.validation, valueC, atMs, settings, stuckAllowed);
    const change = hot.recordVerdict(p.validation, verdict, valueC, atMs, settings);
    if (change) this.sensorFaultChanged(p, change, atMs);
    if (verdict !== 'valid') return;
    const value = valueC as number;
    hot.addToBucket(p.level, value);
    hot.trackCycle(p.rhythm, value, atMs, gapMs, settings);
    if (p === this.defrostCarrier) hot.trackDuty(this.state.duty, value, atMs, settings);
    hot.trackExcursion(this.state, p.rhythm, value, p.level.levelC ?? p.rhythm.smoothC, atMs, settings, p === this.defrostCarrier);
    hot.judgeOverTemp(this.ctx, p, value, atMs);
    if (p.probe === 'fresh_food') this.state.lastFreshAbove = value > settings.freshFoodLimitC;
  }

  private sensorFaultChanged(p: ProbeState, change: 'opened' | 'closed', atMs: number): void {
    const v = p.validation;
    if (change === 'closed') {
      closeFinding(this.state, v.faultFindingId, v.goodSinceMs ?? atMs, this.ctx.events);
      v.faultFindingId = null;
      return;
    }
    const reason = v.faultReason ?? 'dropout';
    const startedAtMs = reason === 'stuck' ? (v.sameSinceMs ?? atMs) : (v.badSinceMs ?? atMs);
    const finding = openFinding(
      this.state,
      {
        kind: 'sensor-fault',
        compartment: p.probe,
        startedAtMs,
        detectedAtMs: atMs,
        severity: 'info',
        probableCauses: [...SENSOR_CAUSES],
        summary: sensorSummary(p.probe, reason),
      },
      this.ctx.events,
    );
    v.faultFindingId = finding.id;
  }

  private closeBuckets(bucketEndMs: number, atMs: number, gapMs: number): void {
    const s = this.state;
    const settings = this.settings;
    const longGap = gapMs > settings.levelWindowMinutes * MINUTE_MS;
    for (const p of s.probes) {
      if (longGap) resetWindow(p.level);
      const hasLevel = closeBucket(p.level, bucketEndMs, settings, this.isTransient(p));
      if (hasLevel && p.level.baselineC === null) learnLevel(p.level);
    }
    closeDutyBucket(s.duty, !s.ready || s.duty.baseline === null, settings);
    if (!s.ready) this.maybeFinishLearning(bucketEndMs);
    // A state from before the duty estimate (or a day without movement) learns its normal late.
    else if (s.duty.baseline === null && s.duty.learnChangeMs >= (settings.learningHours / 2) * 60 * MINUTE_MS) finishDutyLearning(s.duty);
    if (s.ready) this.judgeBucket(bucketEndMs, atMs);
    noteAboveHistory(s, bucketEndMs);
  }

  /** Whether this bucket is kept out of the level: a brief excursion, unless it has lasted too long. */
  private isTransient(p: ProbeState): boolean {
    const r = p.rhythm;
    const transient = r.transientInBucket && r.skippedBuckets * this.settings.bucketMinutes < transientLimitMinutes(this.state, this.settings);
    r.skippedBuckets = transient ? r.skippedBuckets + 1 : 0;
    r.transientInBucket = r.excursionStartMs !== null;
    return transient;
  }

  private maybeFinishLearning(bucketEndMs: number): void {
    const s = this.state;
    if (s.firstAtMs === null || bucketEndMs - s.firstAtMs < this.settings.learningHours * 60 * MINUTE_MS) return;
    let learned = 0;
    for (const p of s.probes) if (p.level.baselineC !== null || finishLearning(p.level, this.spreadFloorC(p.probe))) learned++;
    s.ready = learned > 0;
    if (s.ready) finishDutyLearning(s.duty);
  }

  private spreadFloorC(probe: Probe): number {
    return probe === 'fresh_food' ? this.settings.minSpreadFreshC : this.settings.minSpreadFreezerC;
  }

  /** A probe that had no data during the learning day learns its own day later. */
  private learnLateProbe(p: ProbeState): void {
    const levelsPerDay = (this.settings.learningHours * 60) / this.settings.bucketMinutes;
    if (p.level.learnLevelsC.length >= levelsPerDay) finishLearning(p.level, this.spreadFloorC(p.probe));
  }

  private judgeBucket(bucketEndMs: number, atMs: number): void {
    const s = this.state;
    const repairOpen = hasOpenRepair(s);
    for (const p of s.probes) {
      if (p.level.baselineC === null) {
        this.learnLateProbe(p);
        continue;
      }
      judgeWarming(this.ctx, p, bucketEndMs, atMs);
      if (!repairOpen && isTrusted(p)) adaptBaseline(p.level, this.settings);
    }
    judgeNoCooling(this.ctx, bucketEndMs, atMs);
    judgeRhythmChange(this.ctx, bucketEndMs, atMs);
    this.refreshOpenFindings(atMs);
  }

  private refreshOpenFindings(atMs: number): void {
    const s = this.state;
    if (!s.findings.some(isRepairFinding)) {
      forgetEvidence(this.ctx);
      return;
    }
    const causes = currentCauses(this.ctx);
    const patches: { finding: Finding; patch: FindingPatch }[] = [];
    for (const p of s.probes) {
      const warming = warmingPatch(this.ctx, p, atMs);
      if (warming) patches.push(warming);
      const over = overTempPatch(this.ctx, p, atMs);
      if (over) patches.push(over);
    }
    const noCooling = noCoolingPatch(this.ctx);
    if (noCooling) patches.push(noCooling);
    const rhythmChange = rhythmChangePatch(this.ctx);
    if (rhythmChange) patches.push(rhythmChange);
    for (const { finding, patch } of patches) {
      updateFinding(s, finding, { ...patch, probableCauses: causes }, atMs, this.settings, this.ctx.events);
    }
  }

  /** Plain JSON copy of the whole state. */
  snapshot(): EngineState {
    return structuredClone(this.state);
  }

  openFindings(): Finding[] {
    return this.state.findings.map((f) => ({ ...f, probableCauses: [...f.probableCauses] }));
  }

  /**
   * Health by the words of the design brief. `nowMs` (the caller's clock) makes a sensor
   * that stopped reporting `silent`; without it the last reading's time is used.
   */
  health(nowMs?: number): Health {
    const s = this.state;
    if (s.lastAtMs === null) return 'silent';
    if (nowMs !== undefined && nowMs - s.lastAtMs > this.settings.silentAfterMinutes * MINUTE_MS) return 'silent';
    if (s.probes.every((p) => p.validation.faultReason !== null && !isTrusted(p))) return 'silent';
    if (s.probes.every((p) => p.validation.faultReason === 'dropout' || p.validation.faultReason === 'disconnected')) return 'silent';
    const kinds = new Set(s.findings.map((f) => f.kind));
    if (kinds.has('no-cooling')) return 'no-cooling';
    if (kinds.has('over-temperature')) return 'warm';
    if (kinds.has('warming-trend')) return 'drifting';
    return 'cold';
  }

  learned(): LearnedNormal {
    const s = this.state;
    const rhythm = s.defrostRhythm;
    const byProbe = <T>(pick: (p: ProbeState) => T | null) => ({
      fresh_food: s.probes.find((p) => p.probe === 'fresh_food') ? pick(s.probes.find((p) => p.probe === 'fresh_food')!) : null,
      freezer: s.probes.find((p) => p.probe === 'freezer') ? pick(s.probes.find((p) => p.probe === 'freezer')!) : null,
    });
    return {
      ready: s.ready,
      baselineC: byProbe((p) => p.level.baselineC),
      spreadC: byProbe((p) => p.level.spreadC),
      cyclePeriodMinutes: this.cyclePeriodMinutes(),
      defrostIntervalHours: rhythm.intervalHours,
      defrostRiseC: rhythm.riseC,
      defrostDurationMinutes: rhythm.durationMinutes,
      doorOpeningsPerDay: doorOpeningsPerDay(s),
      doorOpeningsByHourUtc: [...s.doorOpeningsByHourUtc],
    };
  }

  cyclePeriodMinutes(): number | null {
    const cycling = defrostProbe(this.state);
    return cycling ? cyclePeriodMinutes(cycling.rhythm, this.state.intervalMin) : null;
  }

  defrostIntervalHours(): number | null {
    return this.state.defrostRhythm.intervalHours;
  }

  defrostRiseC(): number | null {
    return this.state.defrostRhythm.riseC;
  }

  doorOpeningsPerDay(): number | null {
    return doorOpeningsPerDay(this.state);
  }

  /** Each present probe's current level and baseline (what live status and verification read). */
  probeLevels(): Partial<Record<Probe, ProbeLevelNow>> {
    return levelsOfState(this.state);
  }

  baselineC(probe: Probe): number | null {
    return this.state.probes.find((p) => p.probe === probe)?.level.baselineC ?? null;
  }

  /** Fresh-food minutes above 40 °F over the whole history. */
  freshMinutesAboveLimit(): number {
    return Math.round(this.state.freshMinutesAboveTotal);
  }
}
