import { SILENT_AFTER_INTERVALS } from '../../shared/api/telemetry';

// The rule lives in shared/ so the web app's sensor page judges a sensor the same way.
export { SILENT_AFTER_INTERVALS, isSilent } from '../../shared/api/telemetry';

/** The same rule in SQL, for lists: `WHERE ${silentSql('s')}` over a sensor alias. */
export function silentSql(sensorAlias: string): string {
  return `(${sensorAlias}.last_seen_at IS NULL OR ${sensorAlias}.last_seen_at < now() - make_interval(secs => ${SILENT_AFTER_INTERVALS} * ${sensorAlias}.interval_seconds))`;
}
