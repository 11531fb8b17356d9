import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Clock } from '../auth/clock';
import type { EventBus } from '../events/bus';
import { MonitorService } from './monitor-service';

export interface RunningMonitor {
  service: MonitorService;
  stop(): Promise<void>;
}

/** The liveness of a 5-minute sensor is judged within a minute of its limit (common practice). */
const LIVENESS_SWEEP_MS = 60_000;

/** The monitor as the server runs it: the ingest hook plus a periodic liveness sweep. */
export function startMonitor(deps: { dataSource: DataSource; bus: EventBus; logger: Logger; clock: Clock }): RunningMonitor {
  const logger = deps.logger.child({ component: 'monitor' });
  const service = new MonitorService({ ...deps, logger });
  const timer = setInterval(() => {
    service.sweepLiveness().catch((error) => logger.warn({ err: error }, 'monitor: liveness sweep failed'));
  }, LIVENESS_SWEEP_MS);
  timer.unref();
  return {
    service,
    async stop() {
      clearInterval(timer);
      await service.close();
    },
  };
}
