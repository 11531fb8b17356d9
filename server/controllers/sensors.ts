import type { Request, Response } from 'express';
import type { SensorChange, SensorQuery } from '../../shared/api/inventory';
import { actorOf } from '../auth/actor';
import type { SensorsService } from '../services/sensors';

export function sensorsController(sensors: SensorsService) {
  const id = (req: Request) => req.params.sensorId as string;
  return {
    list: async (req: Request, res: Response) => {
      res.json(await sensors.list(actorOf(req), req.query as unknown as SensorQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await sensors.get(actorOf(req), id(req)));
    },
    change: async (req: Request, res: Response) => {
      const body: SensorChange = req.body;
      res.json(await sensors.change(actorOf(req), id(req), body));
    },
    newSecret: async (req: Request, res: Response) => {
      res.setHeader('Cache-Control', 'no-store');
      res.json(await sensors.newSecret(actorOf(req), id(req)));
    },
    archive: async (req: Request, res: Response) => {
      res.json(await sensors.archive(actorOf(req), id(req)));
    },
    restore: async (req: Request, res: Response) => {
      res.json(await sensors.restore(actorOf(req), id(req)));
    },
  };
}
