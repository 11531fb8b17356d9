import type { Request, Response } from 'express';
import { actorOf } from '../auth/actor';
import type { AppliancesService } from '../services/appliances';

export function appliancesController(appliances: AppliancesService) {
  return {
    detail: async (req: Request, res: Response) => {
      res.json(await appliances.detail(actorOf(req), req.params.id as string));
    },
  };
}
