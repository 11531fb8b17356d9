import type { RequestHandler } from 'express';
import { withoutDetails, type HealthService } from '../services/health';

/**
 * `/api/health` and `/api/health/ready` are public (the status page, load balancers) and say
 * only whether each component is up: no versions, addresses or error messages for anyone
 * who asks. `/api/health/details` adds them, for managers (the route table checks the role).
 * The readiness check answers 503 while a component is down.
 */
export function healthHandlers(health: HealthService): { report: RequestHandler; ready: RequestHandler; details: RequestHandler } {
  return {
    report: async (_req, res) => {
      res.json(withoutDetails(await health.report()));
    },
    ready: async (_req, res) => {
      const report = await health.report();
      res.status(report.status === 'ok' ? 200 : 503).json(withoutDetails(report));
    },
    details: async (_req, res) => {
      res.json(await health.report());
    },
  };
}
