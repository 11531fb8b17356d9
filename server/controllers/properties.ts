import type { Request, Response } from 'express';
import type { PropertyChange, PropertyInput, PropertyQuery } from '../../shared/api/inventory';
import { actorOf } from '../auth/actor';
import type { PropertiesService } from '../services/properties';

export function propertiesController(properties: PropertiesService) {
  const id = (req: Request) => req.params.propertyId as string;
  return {
    list: async (req: Request, res: Response) => {
      res.json(await properties.list(actorOf(req), req.query as unknown as PropertyQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await properties.get(actorOf(req), id(req)));
    },
    create: async (req: Request, res: Response) => {
      const body: PropertyInput = req.body;
      res.status(201).json(await properties.create(actorOf(req), body));
    },
    change: async (req: Request, res: Response) => {
      const body: PropertyChange = req.body;
      res.json(await properties.change(actorOf(req), id(req), body));
    },
    archive: async (req: Request, res: Response) => {
      res.json(await properties.archive(actorOf(req), id(req)));
    },
    restore: async (req: Request, res: Response) => {
      res.json(await properties.restore(actorOf(req), id(req)));
    },
  };
}
