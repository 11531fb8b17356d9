import type { Request, Response } from 'express';
import type { FleetQuery } from '../../shared/api/fleet';
import { actorOf } from '../auth/actor';
import type { FleetService } from '../services/fleet';

export function fleetController(fleet: FleetService) {
  return {
    overview: async (req: Request, res: Response) => {
      const startedMs = performance.now();
      const overview = await fleet.overview(actorOf(req), req.query as unknown as FleetQuery);
      res.setHeader('Server-Timing', `fleet;dur=${(performance.now() - startedMs).toFixed(1)}`);
      res.json(overview);
    },
  };
}
