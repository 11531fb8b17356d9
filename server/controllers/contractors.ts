import type { Request, Response } from 'express';
import type { CreateContractorRequest, SetCoverageRequest, UpdateContractorRequest } from '../../shared/api/work-orders';
import { actorOf } from '../auth/actor';
import type { ContractorsService } from '../services/contractors';
import type { CoverageService } from '../services/coverage';

const idOf = (req: Request) => req.params.contractorId as string;

export function contractorsController(contractors: ContractorsService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await contractors.list(actorOf(req)));
    },
    people: async (req: Request, res: Response) => {
      res.json(await contractors.people(actorOf(req)));
    },
    get: async (req: Request, res: Response) => {
      res.json(await contractors.get(actorOf(req), idOf(req)));
    },
    create: async (req: Request, res: Response) => {
      res.status(201).json(await contractors.create(actorOf(req), req.body as CreateContractorRequest));
    },
    update: async (req: Request, res: Response) => {
      res.json(await contractors.update(actorOf(req), idOf(req), req.body as UpdateContractorRequest));
    },
    addMember: async (req: Request, res: Response) => {
      res.json(await contractors.addMember(actorOf(req), idOf(req), req.body.userId));
    },
    removeMember: async (req: Request, res: Response) => {
      res.json(await contractors.removeMember(actorOf(req), idOf(req), req.params.userId as string));
    },
  };
}

export function coverageController(coverage: CoverageService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await coverage.list(actorOf(req), (req.query as { propertyId?: string }).propertyId));
    },
    set: async (req: Request, res: Response) => {
      res.json(await coverage.set(actorOf(req), req.body as SetCoverageRequest));
    },
  };
}
