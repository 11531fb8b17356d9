import { Router } from 'express';
import type { HealthService } from '../services/health';

/** Public: a load balancer and the status page read it. 503 when a component is down. */
export function healthRouter(health: HealthService): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const report = await health.report();
    res.status(report.status === 'ok' ? 200 : 503).json(report);
  });
  return router;
}
