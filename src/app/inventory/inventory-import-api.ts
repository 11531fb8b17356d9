import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { ImportJob, ImportPreview } from '../../../shared/api/inventory';

/** `/api/inventory/import`: check a CSV file, start the import, follow its progress. */
@Injectable({ providedIn: 'root' })
export class InventoryImportApi {
  private readonly http = inject(HttpClient);

  preview(file: File): Observable<ImportPreview> {
    return this.http.post<ImportPreview>('/api/inventory/import/preview', formWith(file));
  }

  start(file: File): Observable<ImportJob> {
    return this.http.post<ImportJob>('/api/inventory/import', formWith(file));
  }

  status(importId: string): Observable<ImportJob> {
    return this.http.get<ImportJob>(`/api/inventory/import/${importId}`);
  }
}

function formWith(file: File): FormData {
  const form = new FormData();
  form.append('file', file, file.name);
  return form;
}
