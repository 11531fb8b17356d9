import type { Request, Response } from 'express';
import type { AcceptInvitationRequest, InspectInvitationRequest } from '../../shared/api/auth';
import type { InviteRequest } from '../../shared/api/users';
import { actorOf } from '../auth/actor';
import type { InvitationsService } from '../services/invitations';

export function invitationsController(invitations: InvitationsService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await invitations.list(actorOf(req)));
    },
    unitOptions: async (req: Request, res: Response) => {
      res.json(await invitations.unitOptions(actorOf(req)));
    },
    create: async (req: Request, res: Response) => {
      const body: InviteRequest = req.body;
      res.status(201).json(await invitations.invite(actorOf(req), body, req.ip ?? null));
    },
    revoke: async (req: Request, res: Response) => {
      await invitations.revoke(actorOf(req), req.params.invitationId as string, req.ip ?? null);
      res.status(204).end();
    },
    preview: async (req: Request, res: Response) => {
      const body: InspectInvitationRequest = req.body;
      res.json(await invitations.preview(body.token));
    },
    accept: async (req: Request, res: Response) => {
      const body: AcceptInvitationRequest = req.body;
      res.status(201).json(await invitations.accept(body.token, body.password, body.displayName, req.ip ?? null));
    },
  };
}
