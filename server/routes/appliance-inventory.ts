import { ApplianceChange, ApplianceIdParams, ApplianceInput, ApplianceQuery, PairSensorRequest } from '../../shared/api/inventory';
import { RouteGroup } from '../auth/route-table';
import type { applianceInventoryController } from '../controllers/appliance-inventory';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

export function applianceInventoryRoutes(controller: ReturnType<typeof applianceInventoryController>): RouteGroup {
  const params = { params: ApplianceIdParams };
  return new RouteGroup('/api/inventory/appliances')
    .get('/', inventoryRule("the organization's appliances with their sensors, paged"), validate({ query: ApplianceQuery }), controller.list)
    .post('/', inventoryRule('add an appliance to a unit'), validate({ body: ApplianceInput }), controller.create)
    .get('/:applianceId', inventoryRule('one appliance with its place and sensor'), validate(params), controller.get)
    .patch('/:applianceId', inventoryRule("change an appliance's details or move it to another unit"), validate({ ...params, body: ApplianceChange }), controller.change)
    .post('/:applianceId/archive', inventoryRule('archive an appliance and its sensor'), validate(params), controller.archive)
    .post('/:applianceId/restore', inventoryRule('restore an archived appliance and its sensor'), validate(params), controller.restore)
    .post('/:applianceId/sensor', inventoryRule('pair a sensor: answers its device id and a one-time secret'), validate({ ...params, body: PairSensorRequest }), controller.pairSensor);
}
