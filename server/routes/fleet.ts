import { FleetQuery } from '../../shared/api/fleet';
import { RouteGroup } from '../auth/route-table';
import type { fleetController } from '../controllers/fleet';
import { validate } from '../middleware/validate';

/** The manager's fleet overview. */
export function fleetRoutes(controller: ReturnType<typeof fleetController>): RouteGroup {
  return new RouteGroup('/api/fleet').get(
    '/',
    { access: ['manager'], scope: 'organization', summary: "every property's units and appliances with their current health, counts per health word; filters and search" },
    validate({ query: FleetQuery }),
    controller.overview,
  );
}
