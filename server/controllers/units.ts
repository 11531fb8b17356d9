import type { Request, Response } from 'express';
import type { UnitChange, UnitInput, UnitQuery } from '../../shared/api/inventory';
import { actorOf } from '../auth/actor';
import type { UnitsService } from '../services/units';

export function unitsController(units: UnitsService) {
  const id = (req: Request) => req.params.unitId as string;
  return {
    list: async (req: Request, res: Response) => {
      res.json(await units.list(actorOf(req), req.params.propertyId as string, req.query as unknown as UnitQuery));
    },
    create: async (req: Request, res: Response) => {
      const body: UnitInput = req.body;
      res.status(201).json(await units.create(actorOf(req), req.params.propertyId as string, body));
    },
    get: async (req: Request, res: Response) => {
      res.json(await units.get(actorOf(req), id(req)));
    },
    change: async (req: Request, res: Response) => {
      const body: UnitChange = req.body;
      res.json(await units.change(actorOf(req), id(req), body));
    },
    archive: async (req: Request, res: Response) => {
      res.json(await units.archive(actorOf(req), id(req)));
    },
    restore: async (req: Request, res: Response) => {
      res.json(await units.restore(actorOf(req), id(req)));
    },
  };
}
