import { TENANT_PHOTO_LIMIT, TenantReportSchema } from '../../shared/api/tenant';
import { RouteGroup } from '../auth/route-table';
import type { tenantHomeController } from '../controllers/tenant-home';
import { jsonField } from '../storage/multipart-json';
import { receiveFiles } from '../storage/uploads';

/** The tenant's own unit: status and guidance, and the problem report with photos. */
export function tenantHomeRoutes(controller: ReturnType<typeof tenantHomeController>): RouteGroup {
  return new RouteGroup('/api/tenant')
    .get('/home', { access: ['tenant'], scope: 'unit', summary: "the unit's appliances: health, temperatures, food-safety guidance, open requests" }, controller.home)
    .post(
      '/reports',
      { access: ['tenant'], scope: 'unit', summary: 'report a problem (multipart: JSON field "report", files "photos")' },
      receiveFiles('photos', TENANT_PHOTO_LIMIT),
      jsonField('report', TenantReportSchema),
      controller.report,
    );
}
