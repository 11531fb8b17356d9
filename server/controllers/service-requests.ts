import type { Request, Response } from 'express';
import type { CreateServiceRequest, ServiceRequestQuery } from '../../shared/api/service-requests';
import { actorOf } from '../auth/actor';
import type { ServiceRequestsService } from '../services/service-requests';

const idOf = (req: Request) => req.params.requestId as string;

export function serviceRequestsController(requests: ServiceRequestsService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await requests.list(actorOf(req), req.query as unknown as ServiceRequestQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await requests.get(actorOf(req), idOf(req)));
    },
    create: async (req: Request, res: Response) => {
      res.status(201).json(await requests.create(actorOf(req), req.body as CreateServiceRequest));
    },
    dispatch: async (req: Request, res: Response) => {
      res.json(await requests.dispatch(actorOf(req), idOf(req), req.body.contractorId));
    },
    cancel: async (req: Request, res: Response) => {
      res.json(await requests.cancel(actorOf(req), idOf(req), req.body.reason));
    },
    merge: async (req: Request, res: Response) => {
      res.json(await requests.merge(actorOf(req), idOf(req), req.body.intoRequestId));
    },
    reprioritise: async (req: Request, res: Response) => {
      res.json(await requests.reprioritise(actorOf(req), idOf(req), req.body.priority));
    },
  };
}
