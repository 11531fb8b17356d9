import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';
import type { HealthReport } from '../../../shared/api/health';

/** `GET /api/health`: the status of the server, the database and the broker. */
@Injectable({ providedIn: 'root' })
export class HealthApi {
  private readonly http = inject(HttpClient);

  report(): Observable<HealthReport> {
    return this.http.get<HealthReport>('/api/health');
  }
}
