import {
  CancelServiceRequest,
  CreateServiceRequest,
  DispatchServiceRequest,
  MergeServiceRequest,
  ReprioritiseServiceRequest,
  ServiceRequestIdParams,
  ServiceRequestQuery,
} from '../../shared/api/service-requests';
import { RouteGroup, type RouteRule } from '../auth/route-table';
import type { serviceRequestsController } from '../controllers/service-requests';
import { validate } from '../middleware/validate';

/** Service requests: managers work them; tenants see their unit's; contractors the ones behind their jobs. */
export function serviceRequestsRoutes(controller: ReturnType<typeof serviceRequestsController>): RouteGroup {
  const reader = (summary: string): RouteRule => ({ access: ['manager', 'tenant', 'contractor'], scope: 'unit', summary });
  const manager = (summary: string): RouteRule => ({ access: ['manager'], scope: 'organization', summary });
  const withId = (body?: Parameters<typeof validate>[0]['body']) => validate({ params: ServiceRequestIdParams, body });
  return new RouteGroup('/api/service-requests')
    .get('/', reader('requests in reach, newest first'), validate({ query: ServiceRequestQuery }), controller.list)
    .get('/:requestId', reader('one request with its progress, incident and tenant reports'), withId(), controller.get)
    .post('/', manager('open a request by hand'), validate({ body: CreateServiceRequest }), controller.create)
    .post('/:requestId/dispatch', manager('dispatch to a contractor, or to the covering one'), withId(DispatchServiceRequest), controller.dispatch)
    .post('/:requestId/cancel', manager('cancel, with a reason'), withId(CancelServiceRequest), controller.cancel)
    .post('/:requestId/merge', manager('merge into another request of the property'), withId(MergeServiceRequest), controller.merge)
    .patch('/:requestId', manager('change the priority'), withId(ReprioritiseServiceRequest), controller.reprioritise);
}
