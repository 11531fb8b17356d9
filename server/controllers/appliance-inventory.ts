import type { Request, Response } from 'express';
import type { ApplianceChange, ApplianceInput, ApplianceQuery, PairSensorRequest } from '../../shared/api/inventory';
import { actorOf } from '../auth/actor';
import type { ApplianceInventoryService } from '../services/appliance-inventory';
import type { SensorsService } from '../services/sensors';

export function applianceInventoryController(appliances: ApplianceInventoryService, sensors: SensorsService) {
  const id = (req: Request) => req.params.applianceId as string;
  return {
    list: async (req: Request, res: Response) => {
      res.json(await appliances.list(actorOf(req), req.query as unknown as ApplianceQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await appliances.get(actorOf(req), id(req)));
    },
    create: async (req: Request, res: Response) => {
      const body: ApplianceInput = req.body;
      res.status(201).json(await appliances.create(actorOf(req), body));
    },
    change: async (req: Request, res: Response) => {
      const body: ApplianceChange = req.body;
      res.json(await appliances.change(actorOf(req), id(req), body));
    },
    archive: async (req: Request, res: Response) => {
      res.json(await appliances.archive(actorOf(req), id(req)));
    },
    restore: async (req: Request, res: Response) => {
      res.json(await appliances.restore(actorOf(req), id(req)));
    },
    pairSensor: async (req: Request, res: Response) => {
      const body: PairSensorRequest = req.body;
      // The secret is in this answer only: keep it out of every cache.
      res.setHeader('Cache-Control', 'no-store');
      res.status(201).json(await sensors.pair(actorOf(req), id(req), body));
    },
  };
}
