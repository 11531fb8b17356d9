import { AuditQuery } from '../../shared/api/users';
import { ADMIN_ONLY } from '../auth/access';
import { RouteGroup } from '../auth/route-table';
import type { auditController } from '../controllers/audit';
import { validate } from '../middleware/validate';

export function auditRoutes(controller: ReturnType<typeof auditController>): RouteGroup {
  return new RouteGroup('/api/audit-log').get('/', { access: ADMIN_ONLY, scope: 'organization', summary: "the organization's audit log" }, validate({ query: AuditQuery }), controller.list);
}
