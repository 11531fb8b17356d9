import type { Request, Response } from 'express';
import type { CompleteRequest, RecordLabourRequest, RecordPartRequest, ScheduleRequest, WorkOrderQuery } from '../../shared/api/work-orders';
import { actorOf } from '../auth/actor';
import type { AttachmentsService } from '../services/attachments';
import type { WorkOrdersService } from '../services/work-orders';

const idOf = (req: Request) => req.params.workOrderId as string;

export function workOrdersController(workOrders: WorkOrdersService, attachments: AttachmentsService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await workOrders.list(actorOf(req), req.query as unknown as WorkOrderQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await workOrders.get(actorOf(req), idOf(req)));
    },
    accept: async (req: Request, res: Response) => {
      res.json(await workOrders.accept(actorOf(req), idOf(req)));
    },
    decline: async (req: Request, res: Response) => {
      res.json(await workOrders.decline(actorOf(req), idOf(req), req.body.reason));
    },
    schedule: async (req: Request, res: Response) => {
      res.json(await workOrders.schedule(actorOf(req), idOf(req), req.body as ScheduleRequest));
    },
    arrive: async (req: Request, res: Response) => {
      res.json(await workOrders.arrive(actorOf(req), idOf(req), req.body.notes));
    },
    complete: async (req: Request, res: Response) => {
      res.json(await workOrders.complete(actorOf(req), idOf(req), req.body as CompleteRequest));
    },
    update: async (req: Request, res: Response) => {
      res.json(await workOrders.update(actorOf(req), idOf(req), req.body));
    },
    recordPart: async (req: Request, res: Response) => {
      res.status(201).json(await workOrders.recordPart(actorOf(req), idOf(req), req.body as RecordPartRequest));
    },
    recordLabour: async (req: Request, res: Response) => {
      res.status(201).json(await workOrders.recordLabour(actorOf(req), idOf(req), req.body as RecordLabourRequest));
    },
    approveCost: async (req: Request, res: Response) => {
      res.json(await workOrders.approveCost(actorOf(req), idOf(req), req.body.note));
    },
    disputeCost: async (req: Request, res: Response) => {
      res.json(await workOrders.disputeCost(actorOf(req), idOf(req), req.body.note));
    },
    verify: async (req: Request, res: Response) => {
      res.json(await workOrders.verifyByHand(actorOf(req), idOf(req), req.body.note));
    },
    upload: async (req: Request, res: Response) => {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      res.status(201).json(await attachments.addToWorkOrder(actorOf(req), idOf(req), files[0], req.body.kind));
    },
  };
}
