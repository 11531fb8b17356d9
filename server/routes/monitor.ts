import { IncidentIdParams, IncidentQuery } from '../../shared/api/monitor';
import { AttachmentIdParams, NotificationPreferenceRequest, UpdateOrgSettingsRequest } from '../../shared/api/work-orders';
import { RouteGroup } from '../auth/route-table';
import type { attachmentsController, incidentsController, notificationPreferencesController, orgSettingsController } from '../controllers/monitor';
import { validate } from '../middleware/validate';

export function incidentsRoutes(controller: ReturnType<typeof incidentsController>): RouteGroup {
  return new RouteGroup('/api/incidents')
    .get('/', { access: ['manager', 'tenant'], scope: 'unit', summary: 'incidents of the organization (managers) or the unit (tenants)' }, validate({ query: IncidentQuery }), controller.list)
    .get('/:incidentId', { access: ['manager', 'tenant'], scope: 'unit', summary: 'one incident' }, validate({ params: IncidentIdParams }), controller.get);
}

/** Files are streamed through the server; the service checks the work order or request behind each. */
export function attachmentsRoutes(controller: ReturnType<typeof attachmentsController>): RouteGroup {
  const params = validate({ params: AttachmentIdParams });
  return new RouteGroup('/api/attachments')
    .get('/:attachmentId', { access: 'signed-in', scope: 'assignment', summary: 'a photo or PDF, to those who may see its work order or request' }, params, controller.original)
    .get('/:attachmentId/thumbnail', { access: 'signed-in', scope: 'assignment', summary: "a photo's thumbnail" }, params, controller.thumbnail);
}

export function orgSettingsRoutes(controller: ReturnType<typeof orgSettingsController>): RouteGroup {
  return new RouteGroup('/api/org-settings')
    .get('/', { access: ['manager'], scope: 'organization', summary: "the organization's work-order settings with defaults and reasons" }, controller.get)
    .patch('/', { access: ['manager'], scope: 'organization', summary: 'change work-order settings' }, validate({ body: UpdateOrgSettingsRequest }), controller.update);
}

export function notificationPreferencesRoutes(controller: ReturnType<typeof notificationPreferencesController>): RouteGroup {
  return new RouteGroup('/api/notification-preferences')
    .get('/', { access: 'signed-in', scope: 'self', summary: 'my e-mail choices' }, controller.get)
    .put('/', { access: 'signed-in', scope: 'self', summary: 'mute or unmute non-urgent e-mail' }, validate({ body: NotificationPreferenceRequest }), controller.set);
}
