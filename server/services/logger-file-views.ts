import type { LoggerAnalysis, LoggerChart, LoggerFileSummaryView } from '../../shared/api/logger-files';
import type { ApplianceStyle, Health } from '../../shared/domain';
import { isoOrNull } from './inventory-support';

/** A logger file with who uploaded it and where it was attached; the text itself is never selected. */
export function loggerFileSelect(withDetail: boolean): string {
  return `
  SELECT f.id, f.file_name, f.size_bytes, f.style, f.uploaded_at, up.display_name AS uploaded_by, f.readings, f.first_at, f.last_at,
         jsonb_array_length(f.analysis -> 'findings')::int AS finding_count, f.analysis -> 'summary' ->> 'health_at_end' AS health_at_end,
         f.attached_appliance_id, f.attached_at, f.attached_readings, a.style AS attached_style, u.label AS attached_unit_label,
         p.name AS attached_property_name${withDetail ? ', f.analysis, f.chart' : ''}
    FROM logger_file f
    LEFT JOIN app_user up ON up.id = f.uploaded_by_user_id
    LEFT JOIN appliance a ON a.id = f.attached_appliance_id
    LEFT JOIN unit u ON u.id = a.unit_id
    LEFT JOIN property p ON p.id = u.property_id`;
}

export interface LoggerFileRow {
  id: string;
  file_name: string;
  size_bytes: number;
  style: ApplianceStyle;
  uploaded_at: Date;
  uploaded_by: string | null;
  readings: number;
  first_at: Date | null;
  last_at: Date | null;
  finding_count: number;
  health_at_end: Health;
  attached_appliance_id: string | null;
  attached_at: Date | null;
  attached_readings: number | null;
  attached_style: ApplianceStyle | null;
  attached_unit_label: string | null;
  attached_property_name: string | null;
  analysis?: LoggerAnalysis;
  chart?: LoggerChart;
}

export function toSummaryView(row: LoggerFileRow): LoggerFileSummaryView {
  const attached = row.attached_appliance_id && row.attached_at;
  return {
    id: row.id,
    fileName: row.file_name,
    sizeBytes: row.size_bytes,
    style: row.style,
    uploadedAt: row.uploaded_at.toISOString(),
    uploadedBy: row.uploaded_by,
    readings: row.readings,
    firstAt: isoOrNull(row.first_at),
    lastAt: isoOrNull(row.last_at),
    findingCount: row.finding_count,
    healthAtEnd: row.health_at_end,
    attachment: attached
      ? {
          applianceId: row.attached_appliance_id!,
          propertyName: row.attached_property_name ?? '',
          unitLabel: row.attached_unit_label ?? '',
          style: row.attached_style ?? row.style,
          attachedAt: row.attached_at!.toISOString(),
          readings: row.attached_readings ?? 0,
        }
      : null,
  };
}
