import { Router, type Request, type RequestHandler } from 'express';
import { z } from 'zod';
import { RouteGroup } from '../auth/route-table';
import type { HistoryService } from '../telemetry/history-service';
import type { RejectsService } from '../telemetry/rejects-service';

const DAY_MS = 86_400_000;

/** ?from=&to= (ISO 8601; default the last 24 hours), ?maxPoints= (10…5000), ?method=auto|lttb. */
export const historyQuerySchema = z
  .object({
    from: z.iso.datetime({ offset: true }).optional(),
    to: z.iso.datetime({ offset: true }).optional(),
    maxPoints: z.coerce.number().int().min(10).max(5000).optional(),
    method: z.enum(['auto', 'lttb']).optional(),
  })
  .strict();

const idParams = z.object({ id: z.uuid() });

export interface TelemetryRouteDeps<Actor> {
  history: HistoryService<Actor>;
  rejects: RejectsService<Actor>;
  /** Role checks, one per route (requireRole from the accounts work). Scope is checked in the services. */
  mayReadHistory: RequestHandler;
  mayReadRejects: RequestHandler;
  actorOf(req: Request): Actor;
}

/**
 * GET /appliances/:id/history — one appliance's readings for any range, at most about
 * maxPoints per probe, saying which resolution it used.
 * GET /sensors/:id/rejects — counts per reason and the latest rejected messages (managers).
 */
export function telemetryRouter<Actor>(deps: TelemetryRouteDeps<Actor>): Router {
  const router = Router();
  router.get('/appliances/:id/history', deps.mayReadHistory, async (req, res) => {
    const { id } = idParams.parse(req.params);
    const query = historyQuerySchema.parse(req.query);
    const toMs = query.to ? Date.parse(query.to) : Date.now();
    const fromMs = query.from ? Date.parse(query.from) : toMs - DAY_MS;
    const startedMs = performance.now();
    const history = await deps.history.applianceHistory(deps.actorOf(req), id, { fromMs, toMs, maxPoints: query.maxPoints, method: query.method });
    res.setHeader('Server-Timing', `history;dur=${(performance.now() - startedMs).toFixed(1)}`);
    res.json(history);
  });
  router.get('/sensors/:id/rejects', deps.mayReadRejects, async (req, res) => {
    const { id } = idParams.parse(req.params);
    res.json(await deps.rejects.sensorRejects(deps.actorOf(req), id));
  });
  return router;
}

/**
 * The sensor-rejects route declared in the route table, like historyRoutes in
 * routes/appliances.ts: the telemetry router answers `/sensors/:id/rejects` under `/api`,
 * managers only, and RejectsService checks the organization through the appliance.
 */
export function sensorRejectsRoutes(telemetry: RequestHandler): RouteGroup {
  return new RouteGroup('/api').get(
    '/sensors/:id/rejects',
    { access: ['manager'], scope: 'organization', summary: "a sensor's rejected messages: counts per reason and the latest samples" },
    telemetry,
  );
}
