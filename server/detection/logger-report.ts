/**
 * The logger-file JSON document of DESIGN.md: findings with snake_case fields and ISO 8601
 * UTC timestamps, and a summary. Used by the CLI and, later, by the web upload.
 */
import type { AnalysisResult } from './analyze';
import type { LoggerFileReport } from './logger-csv';
import type { Finding } from './types';

function iso(atMs: number | null | undefined): string | null {
  return atMs === null || atMs === undefined ? null : new Date(atMs).toISOString();
}

function round(value: number | null, digits = 2): number | null {
  if (value === null || !Number.isFinite(value)) return null;
  const scale = 10 ** digits;
  return Math.round(value * scale) / scale;
}

export function findingJson(f: Finding) {
  return {
    kind: f.kind,
    compartment: f.compartment,
    started_at: iso(f.startedAtMs),
    detected_at: iso(f.detectedAtMs),
    ended_at: iso(f.endedAtMs),
    severity: f.severity,
    probable_causes: f.probableCauses.map((c) => ({ code: c.code, confidence: c.confidence })),
    minutes_above_4c: f.minutesAbove4c,
    forecast_crossing_at: f.forecastCrossingAtMs === undefined ? undefined : iso(f.forecastCrossingAtMs),
    summary: f.summary,
  };
}

export function loggerReportJson(result: AnalysisResult, file?: LoggerFileReport) {
  const s = result.summary;
  const l = s.learned;
  return {
    findings: result.findings.map(findingJson),
    summary: {
      style: s.style,
      probes: s.probes,
      readings: s.readings,
      first_at: iso(s.firstAtMs),
      last_at: iso(s.lastAtMs),
      median_interval_minutes: round(s.medianIntervalMinutes),
      health_at_end: s.health,
      fresh_food_minutes_above_4c: s.freshMinutesAbove4c,
      findings_by_kind: s.findingsByKind,
      learned: {
        baseline_c: { fresh_food: round(l.baselineC.fresh_food), freezer: round(l.baselineC.freezer) },
        cycle_period_minutes: round(l.cyclePeriodMinutes, 0),
        defrost_interval_hours: round(l.defrostIntervalHours, 1),
        defrost_rise_c: round(l.defrostRiseC, 1),
        door_openings_per_day: round(l.doorOpeningsPerDay, 1),
      },
      ...(file
        ? {
            file: {
              rows: file.rows,
              rows_skipped: file.rowsSkipped,
              duplicates_merged: file.duplicatesMerged,
              cells_unreadable: file.cellsUnreadable,
              temperature_unit: file.temperatureUnit,
              timestamps_without_offset_read_as_utc: file.timestampsWithoutOffset,
            },
          }
        : {}),
    },
  };
}
