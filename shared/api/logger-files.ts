/**
 * Logger-file analysis: a stand-alone logger's CSV (DESIGN.md, "Logger files") analysed by
 * the detection engine, shown as a chart with the findings, optionally attached to an
 * appliance's history. Shared by client and server.
 */
import { z } from 'zod';
import type { ApplianceStyle, CauseCode, Compartment, FindingKind, Health, Probe, Severity } from '../domain';
import { ApplianceStyleSchema } from './inventory';

/** A year of one-minute readings with both probes is about 20 MB. */
export const LOGGER_FILE_MAX_BYTES = 32 * 1024 * 1024;
/** The chart gets at most this many points per probe (LTTB); the engine always sees every reading. */
export const LOGGER_CHART_MAX_POINTS = 2000;

/** One finding, as the `analyze` command prints it (snake_case, ISO 8601 UTC). */
export interface LoggerFinding {
  kind: FindingKind;
  compartment: Compartment;
  started_at: string | null;
  detected_at: string | null;
  ended_at: string | null;
  severity: Severity;
  probable_causes: { code: CauseCode; confidence: number }[];
  minutes_above_4c: number;
  forecast_crossing_at?: string | null;
  summary: string;
}

export interface LoggerAnalysisSummary {
  style: ApplianceStyle;
  probes: Probe[];
  readings: number;
  first_at: string | null;
  last_at: string | null;
  median_interval_minutes: number | null;
  health_at_end: Health;
  fresh_food_minutes_above_4c: number;
  findings_by_kind: Partial<Record<FindingKind, number>>;
  learned: {
    baseline_c: { fresh_food: number | null; freezer: number | null };
    cycle_period_minutes: number | null;
    defrost_interval_hours: number | null;
    defrost_rise_c: number | null;
    door_openings_per_day: number | null;
  };
  file?: {
    rows: number;
    rows_skipped: number;
    duplicates_merged: number;
    cells_unreadable: number;
    temperature_unit: 'C' | 'F';
    timestamps_without_offset_read_as_utc: boolean;
  };
}

/** The same JSON document `npm run analyze` prints for the file. */
export interface LoggerAnalysis {
  findings: LoggerFinding[];
  summary: LoggerAnalysisSummary;
}

/** Per probe: [epoch ms, °C], downsampled to at most LOGGER_CHART_MAX_POINTS. */
export type LoggerChart = Partial<Record<Probe, { points: [number, number][]; readings: number }>>;

export interface LoggerAttachment {
  applianceId: string;
  propertyName: string;
  unitLabel: string;
  style: ApplianceStyle;
  attachedAt: string;
  /** Readings written to the appliance's history (marked as imported from this file). */
  readings: number;
}

export interface LoggerFileSummaryView {
  id: string;
  fileName: string;
  sizeBytes: number;
  style: ApplianceStyle;
  uploadedAt: string;
  uploadedBy: string | null;
  readings: number;
  firstAt: string | null;
  lastAt: string | null;
  findingCount: number;
  healthAtEnd: Health;
  attachment: LoggerAttachment | null;
}

export interface LoggerFileView extends LoggerFileSummaryView {
  analysis: LoggerAnalysis;
  chart: LoggerChart;
}

/** Multipart text fields beside the file; an empty field means "not given". */
export const LoggerUploadFields = z
  .object({ style: z.preprocess((value) => (value === '' ? undefined : value), ApplianceStyleSchema.optional()) })
  .strip();
export type LoggerUploadFields = z.infer<typeof LoggerUploadFields>;

export const LoggerFileQuery = z.object({
  page: z.coerce.number().int().min(0).default(0),
  pageSize: z.coerce.number().int().min(1).max(100).default(10),
});
export type LoggerFileQuery = z.infer<typeof LoggerFileQuery>;

export const LoggerFileIdParams = z.object({ loggerFileId: z.uuid('not a logger file id') });

export const AttachLoggerFileRequest = z.object({ applianceId: z.uuid('choose the appliance') }).strict();
export type AttachLoggerFileRequest = z.infer<typeof AttachLoggerFileRequest>;

export interface AttachLoggerFileResult {
  attachment: LoggerAttachment;
  /** Readings new to the history in this call: 0 when the file was already attached. */
  inserted: number;
  /** Readings later than now (a logger with a wrong clock) are not written. */
  skippedInFuture: number;
}
