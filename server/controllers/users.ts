import type { Request, Response } from 'express';
import type { ChangeUserRequest, UserQuery } from '../../shared/api/users';
import { actorOf } from '../auth/actor';
import type { UsersService } from '../services/users';

export function usersController(users: UsersService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await users.list(actorOf(req), req.query as unknown as UserQuery));
    },
    get: async (req: Request, res: Response) => {
      res.json(await users.get(actorOf(req), req.params.userId as string));
    },
    change: async (req: Request, res: Response) => {
      const body: ChangeUserRequest = req.body;
      res.json(await users.change(actorOf(req), req.params.userId as string, body, req.ip ?? null));
    },
    deactivate: async (req: Request, res: Response) => {
      res.json(await users.deactivate(actorOf(req), req.params.userId as string, req.ip ?? null));
    },
    reactivate: async (req: Request, res: Response) => {
      res.json(await users.reactivate(actorOf(req), req.params.userId as string, req.ip ?? null));
    },
  };
}
