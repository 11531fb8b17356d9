/**
 * Power loss at the property: when many appliances of one property start warming together,
 * the cause is the supply (a tripped breaker, a utility outage), not each appliance. Given
 * the findings of the property's appliances, the correlator returns one property-level
 * power-loss finding per such episode and the unit findings it absorbs, so the caller opens
 * one incident for the property instead of one work order per unit. Pure: same input,
 * same answer; no state, no clock.
 */
import { CLOSED_FRIDGE_SAFE_HOURS } from '../../shared/temperature';
import { DEFAULT_SETTINGS, type DetectionSettings } from './settings';
import { isRepairFinding, type Finding } from './types';

export interface ApplianceFinding {
  applianceId: string;
  finding: Finding;
}

export interface PowerLossEpisode {
  finding: Finding;
  applianceIds: string[];
  /** Unit findings explained by the outage (no work order for them). */
  absorbedFindingIds: string[];
}

const MINUTE_MS = 60_000;

/** One appliance's trouble: its repair findings that overlap or follow each other closely. */
interface UnitEpisode {
  applianceId: string;
  startedAtMs: number;
  findings: ApplianceFinding[];
  endMs: number;
}

const UNIT_EPISODE_GAP_MS = 12 * 3_600_000;

function unitEpisodes(findings: ApplianceFinding[]): UnitEpisode[] {
  const repairs = findings.filter((f) => isRepairFinding(f.finding)).sort((a, b) => a.finding.startedAtMs - b.finding.startedAtMs);
  const open = new Map<string, UnitEpisode>();
  const episodes: UnitEpisode[] = [];
  for (const item of repairs) {
    const f = item.finding;
    const current = open.get(item.applianceId);
    const endMs = f.endedAtMs ?? Infinity;
    if (current && f.startedAtMs <= current.endMs + UNIT_EPISODE_GAP_MS) {
      current.findings.push(item);
      current.endMs = Math.max(current.endMs, endMs);
      continue;
    }
    const episode = { applianceId: item.applianceId, startedAtMs: f.startedAtMs, findings: [item], endMs };
    open.set(item.applianceId, episode);
    episodes.push(episode);
  }
  return episodes;
}

/** Appliance episodes whose starts fall within the window of the first one. */
function clusters(findings: ApplianceFinding[], windowMs: number): ApplianceFinding[][] {
  const episodes = unitEpisodes(findings).sort((a, b) => a.startedAtMs - b.startedAtMs);
  const groups: UnitEpisode[][] = [];
  for (const episode of episodes) {
    const group = groups[groups.length - 1];
    if (group && episode.startedAtMs - group[0].startedAtMs <= windowMs) group.push(episode);
    else groups.push([episode]);
  }
  return groups.map((group) => group.flatMap((e) => e.findings));
}

function applianceCount(group: ApplianceFinding[]): number {
  return new Set(group.map((g) => g.applianceId)).size;
}

/** Causal detection time: when the n-th distinct appliance's finding was detected. */
function detectedWhenEnough(group: ApplianceFinding[], needed: number): number {
  const firstDetection = new Map<string, number>();
  for (const g of group) {
    const seen = firstDetection.get(g.applianceId);
    if (seen === undefined || g.finding.detectedAtMs < seen) firstDetection.set(g.applianceId, g.finding.detectedAtMs);
  }
  const times = [...firstDetection.values()].sort((a, b) => a - b);
  return times[needed - 1];
}

function medianOf(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[(sorted.length - 1) >> 1];
}

export class PropertyCorrelator {
  constructor(private readonly settings: DetectionSettings = { ...DEFAULT_SETTINGS }) {}

  /** Minimum number of appliances warming together for a property with this many reporting. */
  needed(reportingAppliances: number): number {
    return Math.max(this.settings.powerLossMinAppliances, Math.ceil(this.settings.powerLossMinShare * reportingAppliances));
  }

  correlate(propertyId: string, findings: ApplianceFinding[], reportingAppliances: number, nowMs?: number): PowerLossEpisode[] {
    const needed = this.needed(reportingAppliances);
    const episodes: PowerLossEpisode[] = [];
    for (const group of clusters(findings, this.settings.powerLossWindowMinutes * MINUTE_MS)) {
      if (applianceCount(group) < needed) continue;
      episodes.push(this.episode(propertyId, group, needed, nowMs));
    }
    return episodes;
  }

  private episode(propertyId: string, group: ApplianceFinding[], needed: number, nowMs?: number): PowerLossEpisode {
    const firstStarts = new Map<string, number>();
    for (const g of group) firstStarts.set(g.applianceId, Math.min(firstStarts.get(g.applianceId) ?? Infinity, g.finding.startedAtMs));
    const startedAtMs = medianOf([...firstStarts.values()]);
    const ends = group.map((g) => g.finding.endedAtMs);
    const endedAtMs = ends.every((e) => e !== null) ? Math.max(...(ends as number[])) : null;
    const latestSeenMs = Math.max(...group.map((g) => g.finding.endedAtMs ?? g.finding.detectedAtMs));
    const hoursOut = ((endedAtMs ?? nowMs ?? latestSeenMs) - startedAtMs) / (60 * MINUTE_MS);
    const applianceIds = [...new Set(group.map((g) => g.applianceId))].sort();
    const finding: Finding = {
      id: `power-loss:${propertyId}:${new Date(startedAtMs).toISOString()}`,
      kind: 'power-loss',
      compartment: 'both',
      startedAtMs,
      detectedAtMs: detectedWhenEnough(group, needed),
      endedAtMs,
      // A closed refrigerator keeps food safe about 4 hours without power (USDA FSIS).
      severity: hoursOut >= CLOSED_FRIDGE_SAFE_HOURS ? 'critical' : 'urgent',
      probableCauses: [{ code: 'power-loss', confidence: 0.9 }],
      minutesAbove4c: Math.max(0, ...group.map((g) => g.finding.minutesAbove4c)),
      summary: `${applianceIds.length} appliances of this property started warming together: the power supply, not the appliances. Keep doors closed; check the breaker and the utility before sending anyone.`,
    };
    return { finding, applianceIds, absorbedFindingIds: group.map((g) => g.finding.id) };
  }
}
