import { PropertyChange, PropertyIdParams, PropertyInput, PropertyQuery } from '../../shared/api/inventory';
import { RouteGroup, type RouteRule } from '../auth/route-table';
import type { propertiesController } from '../controllers/properties';
import { validate } from '../middleware/validate';

/** The manager's own organization only; another organization's property reads as missing (404). */
export const inventoryRule = (summary: string): RouteRule => ({ access: ['manager'], scope: 'organization', summary });

export function propertiesRoutes(controller: ReturnType<typeof propertiesController>): RouteGroup {
  const params = { params: PropertyIdParams };
  return new RouteGroup('/api/inventory/properties')
    .get('/', inventoryRule("the organization's properties, paged"), validate({ query: PropertyQuery }), controller.list)
    .post('/', inventoryRule('add a property'), validate({ body: PropertyInput }), controller.create)
    .get('/:propertyId', inventoryRule('one property with its counts'), validate(params), controller.get)
    .patch('/:propertyId', inventoryRule("change a property's name, address or time zone"), validate({ ...params, body: PropertyChange }), controller.change)
    .post('/:propertyId/archive', inventoryRule('archive a property with its units, appliances and sensors'), validate(params), controller.archive)
    .post('/:propertyId/restore', inventoryRule('restore an archived property and what was archived with it'), validate(params), controller.restore);
}
