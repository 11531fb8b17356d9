import { Router } from 'express';
import type { HealthService } from '../services/health';

/**
 * Public. `/api/health` always answers 200 with the report (the status page reads it);
 * `/api/health/ready` answers 503 while a component is down, for load balancers.
 */
export function healthRouter(health: HealthService): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    res.json(await health.report());
  });
  router.get('/ready', async (_req, res) => {
    const report = await health.report();
    res.status(report.status === 'ok' ? 200 : 503).json(report);
  });
  return router;
}
