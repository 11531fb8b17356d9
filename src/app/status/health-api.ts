import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { HealthReport } from '../../../shared/api/health';

/**
 * The status of the server, the database, the broker and the ingest: `GET /api/health`
 * (states only, for anyone) or, for a manager, `GET /api/health/details` (with versions and
 * why a component is down).
 */
@Injectable({ providedIn: 'root' })
export class HealthApi {
  private readonly http = inject(HttpClient);

  report(withDetails: boolean): Observable<HealthReport> {
    return this.http.get<HealthReport>(withDetails ? '/api/health/details' : '/api/health');
  }
}
