import type { Request, Response } from 'express';
import type { AuditQuery } from '../../shared/api/users';
import { actorOf } from '../auth/actor';
import type { AuditService } from '../services/audit';

export function auditController(audit: AuditService) {
  return {
    list: async (req: Request, res: Response) => {
      res.json(await audit.list(actorOf(req), req.query as unknown as AuditQuery));
    },
  };
}
