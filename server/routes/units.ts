import { PropertyIdParams, UnitChange, UnitIdParams, UnitInput, UnitQuery } from '../../shared/api/inventory';
import { RouteGroup } from '../auth/route-table';
import type { unitsController } from '../controllers/units';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

export function unitsRoutes(controller: ReturnType<typeof unitsController>): RouteGroup {
  const params = { params: UnitIdParams };
  return new RouteGroup('/api/inventory')
    .get('/properties/:propertyId/units', inventoryRule("a property's units with their appliances, paged"), validate({ params: PropertyIdParams, query: UnitQuery }), controller.list)
    .post('/properties/:propertyId/units', inventoryRule('add a unit to a property'), validate({ params: PropertyIdParams, body: UnitInput }), controller.create)
    .get('/units/:unitId', inventoryRule('one unit with its appliances'), validate(params), controller.get)
    .patch('/units/:unitId', inventoryRule("change a unit's label or floor"), validate({ ...params, body: UnitChange }), controller.change)
    .post('/units/:unitId/archive', inventoryRule('archive a unit with its appliances and sensors'), validate(params), controller.archive)
    .post('/units/:unitId/restore', inventoryRule('restore an archived unit and what was archived with it'), validate(params), controller.restore);
}
