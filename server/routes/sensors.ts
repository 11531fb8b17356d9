import { SensorChange, SensorIdParams, SensorQuery } from '../../shared/api/inventory';
import { RouteGroup } from '../auth/route-table';
import type { sensorsController } from '../controllers/sensors';
import { validate } from '../middleware/validate';
import { inventoryRule } from './properties';

export function sensorsRoutes(controller: ReturnType<typeof sensorsController>): RouteGroup {
  const params = { params: SensorIdParams };
  return new RouteGroup('/api/inventory/sensors')
    .get('/', inventoryRule("the organization's sensors with their appliances, paged"), validate({ query: SensorQuery }), controller.list)
    .get('/:sensorId', inventoryRule('one sensor'), validate(params), controller.get)
    .patch('/:sensorId', inventoryRule('move a sensor to another appliance or change its interval'), validate({ ...params, body: SensorChange }), controller.change)
    .post('/:sensorId/secret', inventoryRule('issue a new one-time device secret'), validate(params), controller.newSecret)
    .post('/:sensorId/archive', inventoryRule('retire a sensor: the broker refuses it from then on'), validate(params), controller.archive)
    .post('/:sensorId/restore', inventoryRule('bring a retired sensor back (its appliance must have no other sensor)'), validate(params), controller.restore);
}
