/** What `GET /api/health` answers. */
export type ComponentState = 'up' | 'down';

export interface ComponentHealth {
  state: ComponentState;
  latencyMs: number | null;
  detail: string;
}

export interface HealthReport {
  status: 'ok' | 'degraded';
  version: string;
  startedAt: string;
  checkedAt: string;
  components: {
    server: ComponentHealth;
    database: ComponentHealth;
    broker: ComponentHealth;
    /** The ingest in the server process; absent when separate workers ingest (INGEST_IN_SERVER=false). */
    ingest?: ComponentHealth;
  };
}
