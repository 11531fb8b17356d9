/**
 * Sensor liveness: a sensor that has not reported for longer than this many of its own
 * intervals is `silent` (issue: "longer than 3 of its intervals").
 */
export const SILENT_AFTER_INTERVALS = 3;

export function isSilent(lastSeenAtMs: number | null, intervalSeconds: number, nowMs: number): boolean {
  if (lastSeenAtMs === null) return true;
  return nowMs - lastSeenAtMs > SILENT_AFTER_INTERVALS * intervalSeconds * 1000;
}

/** The same rule in SQL, for lists: `WHERE ${silentSql('s')}` over a sensor alias. */
export function silentSql(sensorAlias: string): string {
  return `(${sensorAlias}.last_seen_at IS NULL OR ${sensorAlias}.last_seen_at < now() - make_interval(secs => ${SILENT_AFTER_INTERVALS} * ${sensorAlias}.interval_seconds))`;
}
