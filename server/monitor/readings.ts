import { PROBE_ERROR_VALUES } from '../../shared/telemetry';
import type { EngineReading } from '../detection/types';
import type { StoredReading } from '../ingest/store';

/**
 * The engine judges sensor faults from the raw values, so a probe error the ingest stored
 * as a flag goes back in as the sentinel the probe sent (−127 disconnected, 85 power-on).
 */
export function engineReadingOf(reading: Pick<StoredReading, 'atMs' | 'freshFoodC' | 'freezerC' | 'freshFoodFlag' | 'freezerFlag' | 'doorOpen'>): EngineReading {
  return {
    atMs: reading.atMs,
    freshFoodC: reading.freshFoodFlag ? PROBE_ERROR_VALUES[reading.freshFoodFlag] : reading.freshFoodC,
    freezerC: reading.freezerFlag ? PROBE_ERROR_VALUES[reading.freezerFlag] : reading.freezerC,
    doorOpen: reading.doorOpen ?? undefined,
  };
}

/** Readings of one batch grouped per appliance, keeping their order (time within each). */
export function groupByAppliance(readings: readonly StoredReading[]): Map<string, StoredReading[]> {
  const groups = new Map<string, StoredReading[]>();
  for (const reading of readings) {
    if (!reading.applianceId) continue;
    const group = groups.get(reading.applianceId);
    if (group) group.push(reading);
    else groups.set(reading.applianceId, [reading]);
  }
  return groups;
}
