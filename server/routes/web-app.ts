/**
 * The routes behind the web app's fleet overview, appliance page and live feed, wired to
 * their services: createApp mounts the groups this returns through its route table.
 */
import type { Request } from 'express';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { HEARTBEAT_MS, RETRY_MS } from '../../shared/api/live';
import { actorOf, type Actor } from '../auth/actor';
import type { Clock } from '../auth/clock';
import type { RouteGroup } from '../auth/route-table';
import type { Scope } from '../auth/scope';
import { appliancesController } from '../controllers/appliances';
import { eventsController } from '../controllers/events';
import { reportsController } from '../controllers/reports';
import { fleetController } from '../controllers/fleet';
import type { EventBus } from '../events/bus';
import { AppliancesService, type RepairRuleSource, type ServiceHistorySource } from '../services/appliances';
import { AuditService } from '../services/audit';
import { FleetService } from '../services/fleet';
import { LiveEventsService } from '../services/live-events';
import { ReportsService } from '../services/reports';
import { OrgSettingsRepairRule, WorkOrderServiceHistory } from '../services/service-history';
import { HistoryService } from '../telemetry/history-service';
import { RejectsService } from '../telemetry/rejects-service';
import { appliancesRoutes, historyRoutes } from './appliances';
import { eventsRoutes } from './events';
import { fleetRoutes } from './fleet';
import { reportsRoutes } from './reports';
import { sensorRejectsRoutes, telemetryRouter } from './history';

export interface WebAppRouteDeps {
  dataSource: DataSource;
  bus: EventBus;
  scope: Scope;
  clock: Clock;
  logger: Logger;
  actorById(id: string): Promise<Actor | null>;
  serviceHistory?: ServiceHistorySource;
  repairRule?: RepairRuleSource;
  heartbeatMs?: number;
}

export interface WebAppRoutes {
  groups: RouteGroup[];
  live: LiveEventsService;
}

export function webAppRoutes(deps: WebAppRouteDeps): WebAppRoutes {
  const { dataSource, scope, clock } = deps;
  const access = { assertCanReadAppliance: async (actor: Actor, applianceId: string) => void (await scope.requireAppliance(actor, applianceId)) };
  const passThrough = (_req: Request, _res: unknown, next: () => void) => next(); // the route group checked the role
  const history = telemetryRouter<Actor>({
    history: new HistoryService<Actor>(dataSource, access, () => clock.now().getTime()),
    rejects: new RejectsService<Actor>(dataSource, access),
    mayReadHistory: passThrough,
    mayReadRejects: passThrough,
    actorOf,
  });
  const live = new LiveEventsService({ bus: deps.bus, scope, logger: deps.logger, nowMs: () => clock.now().getTime() });
  const appliances = new AppliancesService({
    dataSource,
    scope,
    clock,
    serviceHistory: deps.serviceHistory ?? new WorkOrderServiceHistory(dataSource),
    repairRule: deps.repairRule ?? new OrgSettingsRepairRule(dataSource),
  });
  const groups = [
    fleetRoutes(fleetController(new FleetService(dataSource, clock))),
    appliancesRoutes(appliancesController(appliances)),
    historyRoutes(history),
    sensorRejectsRoutes(history),
    eventsRoutes(eventsController({ live, actorById: deps.actorById, heartbeatMs: deps.heartbeatMs ?? HEARTBEAT_MS, retryMs: RETRY_MS })),
    reportsRoutes(reportsController(new ReportsService(dataSource, clock), new AuditService(dataSource, clock))),
  ];
  return { groups, live };
}
