import { RouteGroup } from '../auth/route-table';
import type { eventsController } from '../controllers/events';

/** The live feed: server-sent events, filtered per person by the live-events service. */
export function eventsRoutes(controller: ReturnType<typeof eventsController>): RouteGroup {
  return new RouteGroup('/api/events').get(
    '/',
    {
      access: 'signed-in',
      scope: 'assignment',
      summary: "live events the caller may see (a manager's organization, a tenant's unit, a contractor's jobs) as text/event-stream; 406 for other Accept headers",
    },
    controller.stream,
  );
}
