import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { Page } from '../../../shared/api/inventory';
import type { AttachLoggerFileResult, LoggerFileSummaryView, LoggerFileView } from '../../../shared/api/logger-files';
import type { ApplianceStyle } from '../../../shared/domain';
import { toParams } from '../inventory/http-params';

/** `/api/logger-files`: upload and analyse a logger CSV, list past files, attach one to an appliance. */
@Injectable({ providedIn: 'root' })
export class LoggerFilesApi {
  private readonly http = inject(HttpClient);
  private readonly base = '/api/logger-files';

  list(query: { page: number; pageSize: number }): Observable<Page<LoggerFileSummaryView>> {
    return this.http.get<Page<LoggerFileSummaryView>>(this.base, { params: toParams(query) });
  }

  upload(file: File, style: ApplianceStyle | null): Observable<LoggerFileView> {
    const form = new FormData();
    if (style) form.append('style', style);
    form.append('file', file, file.name);
    return this.http.post<LoggerFileView>(this.base, form);
  }

  get(loggerFileId: string): Observable<LoggerFileView> {
    return this.http.get<LoggerFileView>(`${this.base}/${loggerFileId}`);
  }

  remove(loggerFileId: string): Observable<void> {
    return this.http.delete<void>(`${this.base}/${loggerFileId}`);
  }

  attach(loggerFileId: string, applianceId: string): Observable<AttachLoggerFileResult> {
    return this.http.post<AttachLoggerFileResult>(`${this.base}/${loggerFileId}/attach`, { applianceId });
  }
}
