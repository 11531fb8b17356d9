import type { DataSource } from 'typeorm';
import type { ComponentHealth, HealthReport } from '../../shared/api/health';

export type ComponentProbe = () => Promise<ComponentHealth>;

const PROBE_TIMEOUT_MS = 2000;

function withTimeout<T>(work: Promise<T>, timeoutMs: number): Promise<T> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error(`no answer within ${timeoutMs} ms`)), timeoutMs);
  });
  return Promise.race([work, timeout]).finally(() => clearTimeout(timer));
}

/** Times a check; any failure (or a hang) reports the component as down with the reason. */
export async function probe(check: () => Promise<string>): Promise<ComponentHealth> {
  const startedMs = performance.now();
  try {
    const detail = await withTimeout(check(), PROBE_TIMEOUT_MS);
    return { state: 'up', latencyMs: Math.round(performance.now() - startedMs), detail };
  } catch (error) {
    return { state: 'down', latencyMs: null, detail: (error as Error).message };
  }
}

export function databaseProbe(dataSource: DataSource): ComponentProbe {
  return () =>
    probe(async () => {
      const [row] = await dataSource.query('SELECT current_setting($1) AS version', ['server_version']);
      return `PostgreSQL ${row.version}`;
    });
}

/** The report as anyone may see it: each component's state, none of the details. */
export function withoutDetails(report: HealthReport): HealthReport {
  const components = Object.fromEntries(
    Object.entries(report.components).map(([key, component]) => [key, { state: component.state, latencyMs: null, detail: '' }]),
  ) as unknown as HealthReport['components'];
  return { ...report, components };
}

export class HealthService {
  private readonly startedAt = new Date();

  constructor(
    private readonly version: string,
    private readonly probes: { database: ComponentProbe; broker: ComponentProbe; ingest?: ComponentProbe },
  ) {}

  async report(): Promise<HealthReport> {
    const [database, broker, ingest] = await Promise.all([this.probes.database(), this.probes.broker(), this.probes.ingest?.()]);
    const uptimeS = Math.round((Date.now() - this.startedAt.getTime()) / 1000);
    const allUp = [database, broker, ingest].every((component) => !component || component.state === 'up');
    return {
      status: allUp ? 'ok' : 'degraded',
      version: this.version,
      startedAt: this.startedAt.toISOString(),
      checkedAt: new Date().toISOString(),
      components: {
        server: { state: 'up', latencyMs: 0, detail: `up ${uptimeS} s, Node ${process.version}` },
        database,
        broker,
        ...(ingest ? { ingest } : {}),
      },
    };
  }
}
