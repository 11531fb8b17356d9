import type { Request, Response } from 'express';
import type { TenantReport } from '../../shared/api/tenant';
import { actorOf } from '../auth/actor';
import type { TenantHomeService } from '../services/tenant-home';

export function tenantHomeController(tenantHome: TenantHomeService) {
  return {
    home: async (req: Request, res: Response) => {
      res.json(await tenantHome.home(actorOf(req)));
    },
    report: async (req: Request, res: Response) => {
      const files = (req.files as Express.Multer.File[] | undefined) ?? [];
      const result = await tenantHome.report(actorOf(req), req.body as TenantReport, files);
      res.status(result.attached ? 200 : 201).json(result);
    },
  };
}
