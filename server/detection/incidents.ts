/**
 * Groups one appliance's findings into incidents: one failure, one incident. An incident
 * opens with its first finding, gathers the findings that follow, and closes only when all
 * of them have closed and the cabinet has stayed recovered for the reopen window; trouble
 * returning inside that window rejoins the same incident (hysteresis). Sensor faults form
 * their own incidents: a broken probe is a different failure from a broken appliance, and
 * never sends a technician to the appliance.
 */
import type { CauseCode, FindingKind, Severity } from '../../shared/domain';
import { SEVERITIES } from '../../shared/domain';
import { DEFAULT_SETTINGS, type DetectionSettings } from './settings';
import { isRepairFinding, type EngineEvent, type Finding, type ProbableCause } from './types';

export type IncidentLane = 'repair' | 'sensor';

export interface Incident {
  id: string;
  lane: IncidentLane;
  startedAtMs: number;
  openedAtMs: number;
  closedAtMs: number | null;
  findingIds: string[];
  kinds: FindingKind[];
  severity: Severity;
  probableCauses: ProbableCause[];
  minutesAbove4c: number;
  /** Ids of its findings still open. */
  openFindingIds: string[];
  /** When its last finding closed; null while one is open. */
  quietSinceMs: number | null;
}

export interface IncidentEvent {
  type: 'opened' | 'updated' | 'closed';
  incident: Incident;
}

export interface IncidentTrackerState {
  open: Incident[];
}

function laneOf(finding: Finding): IncidentLane {
  return isRepairFinding(finding) ? 'repair' : 'sensor';
}

function worse(a: Severity, b: Severity): Severity {
  return SEVERITIES.indexOf(a) >= SEVERITIES.indexOf(b) ? a : b;
}

function copy(incident: Incident): Incident {
  return structuredClone(incident);
}

export class IncidentTracker {
  private readonly state: IncidentTrackerState;

  constructor(
    private readonly settings: DetectionSettings = { ...DEFAULT_SETTINGS },
    state?: IncidentTrackerState,
  ) {
    this.state = state ? structuredClone(state) : { open: [] };
  }

  /** Takes one engine event; the event's own times drive the incident (no clock). */
  handle(event: EngineEvent): IncidentEvent[] {
    const finding = event.finding;
    const out = this.tick(event.atMs);
    const lane = laneOf(finding);
    let incident = this.state.open.find((i) => i.lane === lane);
    if (!incident) {
      if (event.type === 'closed') return out;
      incident = this.openIncident(finding, lane);
      out.push({ type: 'opened', incident: copy(incident) });
      return out;
    }
    this.apply(incident, event);
    out.push({ type: 'updated', incident: copy(incident) });
    return out;
  }

  /** Closes incidents that have stayed quiet (recovered) for the reopen window. */
  tick(nowMs: number): IncidentEvent[] {
    const out: IncidentEvent[] = [];
    const holdMs = this.settings.incidentReopenMinutes * 60_000;
    this.state.open = this.state.open.filter((incident) => {
      if (incident.quietSinceMs === null || nowMs - incident.quietSinceMs < holdMs) return true;
      incident.closedAtMs = incident.quietSinceMs;
      out.push({ type: 'closed', incident: copy(incident) });
      return false;
    });
    return out;
  }

  openIncidents(): Incident[] {
    return this.state.open.map(copy);
  }

  snapshot(): IncidentTrackerState {
    return structuredClone(this.state);
  }

  private openIncident(finding: Finding, lane: IncidentLane): Incident {
    const incident: Incident = {
      id: `incident:${lane}:${new Date(finding.startedAtMs).toISOString()}`,
      lane,
      startedAtMs: finding.startedAtMs,
      openedAtMs: finding.detectedAtMs,
      closedAtMs: null,
      findingIds: [finding.id],
      kinds: [finding.kind],
      severity: finding.severity,
      probableCauses: finding.probableCauses,
      minutesAbove4c: finding.minutesAbove4c,
      openFindingIds: [finding.id],
      quietSinceMs: null,
    };
    this.state.open.push(incident);
    return incident;
  }

  private apply(incident: Incident, event: EngineEvent): void {
    const finding = event.finding;
    if (!incident.findingIds.includes(finding.id)) incident.findingIds.push(finding.id);
    if (!incident.kinds.includes(finding.kind)) incident.kinds.push(finding.kind);
    incident.severity = worse(incident.severity, finding.severity);
    incident.minutesAbove4c = Math.max(incident.minutesAbove4c, finding.minutesAbove4c);
    if (finding.probableCauses.length) incident.probableCauses = finding.probableCauses;
    incident.startedAtMs = Math.min(incident.startedAtMs, finding.startedAtMs);
    if (event.type === 'closed') {
      incident.openFindingIds = incident.openFindingIds.filter((id) => id !== finding.id);
      if (incident.openFindingIds.length === 0) incident.quietSinceMs = finding.endedAtMs ?? finding.detectedAtMs;
    } else {
      if (!incident.openFindingIds.includes(finding.id)) incident.openFindingIds.push(finding.id);
      incident.quietSinceMs = null;
    }
  }
}

/** The most probable cause of an incident, for the work order. */
export function topCauseOf(incident: Incident): CauseCode | null {
  return incident.probableCauses[0]?.code ?? null;
}
