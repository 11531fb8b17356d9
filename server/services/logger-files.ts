import { createHash } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { AttachLoggerFileResult, LoggerFileQuery, LoggerFileSummaryView, LoggerFileView } from '../../shared/api/logger-files';
import type { Page } from '../../shared/api/inventory';
import type { ApplianceStyle } from '../../shared/domain';
import type { Actor } from '../auth/actor';
import { analyzeSeries } from '../detection/analyze';
import { loggerReportJson } from '../detection/logger-report';
import { notFound } from '../errors';
import type { DetectionSettingsService } from './detection-settings';
import { organizationOf } from './inventory-support';
import { chartOf } from './logger-chart';
import { loggerFileSelect, toSummaryView, type LoggerFileRow } from './logger-file-views';
import type { LoggerHistoryImporter } from './logger-history';
import { defaultStyleFor, parseOrReject } from './logger-parse';

export interface LoggerUpload {
  fileName: string;
  text: string;
  sizeBytes: number;
  style?: ApplianceStyle;
}

/**
 * Logger files of the organization: analysed with the live engine and the organization's
 * settings for the style, kept (one row per content) so the page can show them again and
 * a manager can attach one to an appliance's history.
 */
export class LoggerFilesService {
  constructor(
    private readonly dataSource: DataSource,
    private readonly settings: DetectionSettingsService,
    private readonly history: LoggerHistoryImporter,
  ) {}

  /** Analyses the file; the same content uploaded again updates its analysis (created: false). */
  async upload(actor: Actor, upload: LoggerUpload): Promise<{ view: LoggerFileView; created: boolean }> {
    const organizationId = organizationOf(actor);
    const parsed = parseOrReject(upload.text);
    const style = upload.style ?? defaultStyleFor(parsed.series);
    const result = analyzeSeries(parsed.series, style, await this.settings.effective(organizationId, style));
    const analysis = loggerReportJson(result, parsed.report);
    const chart = chartOf(parsed.series);
    const sha256 = createHash('sha256').update(upload.text).digest('hex');
    const firstAt = result.summary.firstAtMs === null ? null : new Date(result.summary.firstAtMs);
    const lastAt = result.summary.lastAtMs === null ? null : new Date(result.summary.lastAtMs);
    const [row] = await this.dataSource.query(
      `INSERT INTO logger_file (organization_id, uploaded_by_user_id, file_name, size_bytes, content_sha256, content, style, readings, first_at, last_at, analysis, chart)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, $12)
       ON CONFLICT (organization_id, content_sha256) DO UPDATE
          SET file_name = EXCLUDED.file_name, style = EXCLUDED.style, analysis = EXCLUDED.analysis, chart = EXCLUDED.chart,
              uploaded_by_user_id = EXCLUDED.uploaded_by_user_id, uploaded_at = now()
       RETURNING id, (xmax = 0) AS created`,
      [organizationId, actor.id, upload.fileName, upload.sizeBytes, sha256, upload.text, style, result.summary.readings, firstAt, lastAt, JSON.stringify(analysis), JSON.stringify(chart)],
    );
    return { view: await this.get(actor, row.id), created: row.created };
  }

  async list(actor: Actor, query: LoggerFileQuery): Promise<Page<LoggerFileSummaryView>> {
    const organizationId = organizationOf(actor);
    const [{ total }] = await this.dataSource.query(`SELECT count(*)::int AS total FROM logger_file WHERE organization_id = $1`, [organizationId]);
    const rows: LoggerFileRow[] = await this.dataSource.query(
      `${loggerFileSelect(false)} WHERE f.organization_id = $1 ORDER BY f.uploaded_at DESC, f.id LIMIT ${query.pageSize} OFFSET ${query.page * query.pageSize}`,
      [organizationId],
    );
    return { items: rows.map(toSummaryView), total, page: query.page, pageSize: query.pageSize };
  }

  async get(actor: Actor, loggerFileId: string): Promise<LoggerFileView> {
    const organizationId = organizationOf(actor);
    const [row] = await this.dataSource.query(`${loggerFileSelect(true)} WHERE f.id = $1 AND f.organization_id = $2`, [loggerFileId, organizationId]);
    if (!row) throw notFound('logger file');
    return { ...toSummaryView(row), analysis: row.analysis, chart: row.chart };
  }

  /** Forgets the file and its analysis; readings already attached stay in the appliance's history. */
  async remove(actor: Actor, loggerFileId: string): Promise<void> {
    const organizationId = organizationOf(actor);
    // A SELECT around the DELETE: TypeORM answers a bare DELETE with [rows, count], not rows.
    const [{ deleted }] = await this.dataSource.query(
      `WITH gone AS (DELETE FROM logger_file WHERE id = $1 AND organization_id = $2 RETURNING id) SELECT count(*)::int AS deleted FROM gone`,
      [loggerFileId, organizationId],
    );
    if (!deleted) throw notFound('logger file');
  }

  async attach(actor: Actor, loggerFileId: string, applianceId: string): Promise<AttachLoggerFileResult> {
    const organizationId = organizationOf(actor);
    const outcome = await this.history.attach(organizationId, actor.id, loggerFileId, applianceId);
    const view = await this.get(actor, loggerFileId);
    return { attachment: view.attachment!, inserted: outcome.inserted, skippedInFuture: outcome.skippedInFuture };
  }
}
