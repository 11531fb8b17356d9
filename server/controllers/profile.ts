import type { Request, Response } from 'express';
import type { ChangeEmailRequest, ChangePasswordRequest, UpdateProfileRequest } from '../../shared/api/auth';
import { actorOf } from '../auth/actor';
import type { PasswordService } from '../services/passwords';
import type { UsersService } from '../services/users';

export function profileController(deps: { users: UsersService; passwords: PasswordService }) {
  return {
    get: async (req: Request, res: Response) => {
      res.json(await deps.users.profile(actorOf(req)));
    },
    update: async (req: Request, res: Response) => {
      const body: UpdateProfileRequest = req.body;
      res.json(await deps.users.updateProfile(actorOf(req), body));
    },
    changePassword: async (req: Request, res: Response) => {
      const body: ChangePasswordRequest = req.body;
      await deps.passwords.changePassword(actorOf(req), body.currentPassword, body.newPassword, req.sessionID, req.ip ?? null);
      res.status(204).end();
    },
    changeEmail: async (req: Request, res: Response) => {
      const body: ChangeEmailRequest = req.body;
      res.json(await deps.users.changeEmail(actorOf(req), body.email, body.currentPassword, req.ip ?? null));
    },
  };
}
