import type { RequestHandler } from 'express';
import { ApplianceIdParams } from '../../shared/api/appliances';
import { RouteGroup } from '../auth/route-table';
import type { appliancesController } from '../controllers/appliances';
import { validate } from '../middleware/validate';

/** The manager's appliance page. */
export function appliancesRoutes(controller: ReturnType<typeof appliancesController>): RouteGroup {
  return new RouteGroup('/api/appliances').get(
    '/:id',
    { access: ['manager'], scope: 'organization', summary: 'one appliance: details, age against expected life, health, learned normal, diagnosis, incidents, service history' },
    validate({ params: ApplianceIdParams }),
    controller.detail,
  );
}

/**
 * The telemetry history API (server/routes/history.ts) declared in the route table: its
 * router answers `/appliances/:id/history` under `/api`, and HistoryService checks scope.
 */
export function historyRoutes(historyRouter: RequestHandler): RouteGroup {
  return new RouteGroup('/api').get(
    '/appliances/:id/history',
    { access: ['manager', 'tenant', 'contractor'], scope: 'unit', summary: "one appliance's readings for a range, at a resolution that fits maxPoints" },
    historyRouter,
  );
}
