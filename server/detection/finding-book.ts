/**
 * Opening, updating and closing findings, and the events that report them. The book keeps
 * only open findings in the engine state; a closed finding is reported once and dropped.
 */
import type { Compartment, FindingKind, Severity } from '../../shared/domain';
import { SEVERITIES } from '../../shared/domain';
import type { DetectionSettings } from './settings';
import type { EngineState } from './state';
import type { EngineEvent, Finding, ProbableCause } from './types';

const MINUTE_MS = 60_000;
const ABOVE_HISTORY = 400;

export interface NewFinding {
  kind: FindingKind;
  compartment: Compartment;
  startedAtMs: number;
  detectedAtMs: number;
  severity: Severity;
  probableCauses: ProbableCause[];
  summary: string;
  forecastCrossingAtMs?: number | null;
}

export function findingId(kind: FindingKind, compartment: Compartment, startedAtMs: number): string {
  return `${kind}:${compartment}:${new Date(startedAtMs).toISOString()}`;
}

export function openFinding(state: EngineState, draft: NewFinding, events: EngineEvent[]): Finding {
  const finding: Finding = {
    id: findingId(draft.kind, draft.compartment, draft.startedAtMs),
    kind: draft.kind,
    compartment: draft.compartment,
    startedAtMs: draft.startedAtMs,
    detectedAtMs: draft.detectedAtMs,
    endedAtMs: null,
    severity: draft.severity,
    probableCauses: draft.probableCauses,
    minutesAbove4c: 0,
    summary: draft.summary,
  };
  if (draft.forecastCrossingAtMs !== undefined) finding.forecastCrossingAtMs = draft.forecastCrossingAtMs;
  state.aboveBaseByFinding[finding.id] = aboveAt(state, draft.startedAtMs);
  finding.minutesAbove4c = minutesAboveSince(state, finding.id);
  state.findings.push(finding);
  state.lastUpdateAtMs[finding.id] = draft.detectedAtMs;
  events.push({ type: 'opened', atMs: draft.detectedAtMs, finding: { ...finding, probableCauses: [...finding.probableCauses] } });
  return finding;
}

export function findOpen(state: EngineState, id: string | null): Finding | undefined {
  if (id === null) return undefined;
  for (const f of state.findings) if (f.id === id) return f;
  return undefined;
}

export function closeFinding(state: EngineState, id: string | null, endedAtMs: number, events: EngineEvent[]): void {
  const index = state.findings.findIndex((f) => f.id === id);
  if (index < 0) return;
  const [finding] = state.findings.splice(index, 1);
  finding.minutesAbove4c = minutesAboveSince(state, finding.id);
  finding.endedAtMs = endedAtMs;
  delete state.lastUpdateAtMs[finding.id];
  delete state.aboveBaseByFinding[finding.id];
  state.closedFindings++;
  events.push({ type: 'closed', atMs: state.nowMs ?? endedAtMs, finding });
}

export interface FindingPatch {
  severity?: Severity;
  probableCauses?: ProbableCause[];
  summary?: string;
  forecastCrossingAtMs?: number | null;
}

function topCause(causes: readonly ProbableCause[]): string | null {
  return causes.length ? causes[0].code : null;
}

/** A change worth reporting at once: worse severity or a different most probable cause. */
function isMaterial(finding: Finding, patch: FindingPatch): boolean {
  if (patch.severity && SEVERITIES.indexOf(patch.severity) > SEVERITIES.indexOf(finding.severity)) return true;
  return patch.probableCauses !== undefined && topCause(patch.probableCauses) !== topCause(finding.probableCauses);
}

/** Applies the patch; reports it when material or when the reporting interval has passed. */
export function updateFinding(
  state: EngineState,
  finding: Finding,
  patch: FindingPatch,
  atMs: number,
  settings: DetectionSettings,
  events: EngineEvent[],
): void {
  const material = isMaterial(finding, patch);
  if (patch.severity && SEVERITIES.indexOf(patch.severity) > SEVERITIES.indexOf(finding.severity)) finding.severity = patch.severity;
  if (patch.probableCauses) finding.probableCauses = patch.probableCauses;
  if (patch.summary) finding.summary = patch.summary;
  if (patch.forecastCrossingAtMs !== undefined) finding.forecastCrossingAtMs = patch.forecastCrossingAtMs;
  const minutes = minutesAboveSince(state, finding.id);
  const minutesChanged = minutes !== finding.minutesAbove4c;
  finding.minutesAbove4c = minutes;
  const due = atMs - (state.lastUpdateAtMs[finding.id] ?? 0) >= settings.updateEveryMinutes * MINUTE_MS;
  if (material || (due && (minutesChanged || patch.summary))) {
    state.lastUpdateAtMs[finding.id] = atMs;
    events.push({ type: 'updated', atMs, finding: { ...finding, probableCauses: [...finding.probableCauses] } });
  }
}

/** Adds fresh-food time above the limit (left Riemann sum over the reading gaps). */
export function countFreshAbove(state: EngineState, gapMs: number): void {
  if (state.lastFreshAbove && gapMs > 0) state.freshMinutesAboveTotal += gapMs / MINUTE_MS;
}

/** Trimmed in steps of this many entries: shifting a 400-long array every bucket cost a long file a tenth of its analysis. */
const ABOVE_HISTORY_SLACK = 50;

export function noteAboveHistory(state: EngineState, atMs: number): void {
  const history = state.aboveHistory;
  history.atMs.push(atMs);
  history.minutes.push(state.freshMinutesAboveTotal);
  if (history.atMs.length <= ABOVE_HISTORY + ABOVE_HISTORY_SLACK) return;
  const excess = history.atMs.length - ABOVE_HISTORY;
  history.atMs.splice(0, excess);
  history.minutes.splice(0, excess);
}

/** Cumulative minutes above the limit at a past time, from the per-bucket history. */
function aboveAt(state: EngineState, atMs: number): number {
  const { atMs: times, minutes } = state.aboveHistory;
  let value = times.length ? minutes[0] : state.freshMinutesAboveTotal;
  for (let i = 0; i < times.length && times[i] <= atMs; i++) value = minutes[i];
  return Math.min(value, state.freshMinutesAboveTotal);
}

export function minutesAboveSince(state: EngineState, id: string): number {
  const base = state.aboveBaseByFinding[id] ?? state.freshMinutesAboveTotal;
  return Math.round(state.freshMinutesAboveTotal - base);
}
