/**
 * The work-order loop assembled: services, routes, the bus subscriptions that turn
 * incidents into requests and monitor status into verification, and the sweeper. main.ts
 * builds one and hands its routes to createApp; specs build their own with a spec clock.
 */
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import type { Clock } from '../auth/clock';
import type { RouteGroup } from '../auth/route-table';
import { contractorsController, coverageController } from '../controllers/contractors';
import { exportsController } from '../controllers/exports';
import { attachmentsController, incidentsController, notificationPreferencesController, orgSettingsController } from '../controllers/monitor';
import { serviceRequestsController } from '../controllers/service-requests';
import { tenantHomeController } from '../controllers/tenant-home';
import { workOrdersController } from '../controllers/work-orders';
import type { EventBus } from '../events/bus';
import type { Mailer } from '../mail/mailer';
import { CsvExporter } from '../exports/csv-export';
import { contractorsRoutes, coverageRoutes } from '../routes/contractors';
import { exportRoutes } from '../routes/exports';
import { attachmentsRoutes, incidentsRoutes, notificationPreferencesRoutes, orgSettingsRoutes } from '../routes/monitor';
import { serviceRequestsRoutes } from '../routes/service-requests';
import { tenantHomeRoutes } from '../routes/tenant-home';
import { workOrdersRoutes } from '../routes/work-orders';
import { AttachmentsService } from '../services/attachments';
import { AuditService } from '../services/audit';
import { ContractorsService } from '../services/contractors';
import { CoverageService } from '../services/coverage';
import { IncidentsService } from '../services/incidents';
import { NotificationPreferencesService } from '../services/notification-preferences';
import { ServiceRequestsService } from '../services/service-requests';
import { TenantHomeService } from '../services/tenant-home';
import { WorkOrdersService } from '../services/work-orders';
import type { ObjectStore } from '../storage/object-store';
import { WorkOrderCore } from './core';
import { LiveNotices } from './log';
import { WorkOrderNotifier } from './notifier';
import { OrgSettingsService } from './org-settings';
import { RequestOpener } from './request-opening';
import { WorkOrderSweeper } from './sweeper';
import { Verification } from './verification';
import { WorkOrderScope } from './work-order-scope';

export interface WorkOrdersOptions {
  dataSource: DataSource;
  publicUrl: string;
  logger: Logger;
  bus: EventBus;
  clock: Clock;
  mailer: Mailer;
  store: ObjectStore;
}

/** The sweeper's period: escalation after 30 minutes is judged within a minute (common practice). */
export const DEFAULT_SWEEP_INTERVAL_MS = 60_000;

export function createWorkOrders(options: WorkOrdersOptions) {
  const { dataSource, clock, bus } = options;
  const logger = options.logger.child({ component: 'work-orders' });
  const scope = new WorkOrderScope(dataSource);
  const settings = new OrgSettingsService(dataSource, clock);
  const coverage = new CoverageService(dataSource, scope);
  const notifier = new WorkOrderNotifier({ dataSource, mailer: options.mailer, publicUrl: options.publicUrl, logger });
  const core = new WorkOrderCore({ settings, coverage, notifier, live: new LiveNotices(dataSource, bus) });
  const opener = new RequestOpener({ dataSource, clock, core, settings, logger });
  const verification = new Verification({ dataSource, clock, core, settings, logger });
  const sweeper = new WorkOrderSweeper({ dataSource, clock, core, settings, opener, verification, logger });
  const attachments = new AttachmentsService({ dataSource, clock, scope, store: options.store, core, logger });
  const services = {
    scope,
    settings,
    coverage,
    notifier,
    opener,
    verification,
    sweeper,
    attachments,
    contractors: new ContractorsService(dataSource, clock),
    serviceRequests: new ServiceRequestsService({ dataSource, clock, scope, core, logger }),
    workOrders: new WorkOrdersService({ dataSource, clock, scope, core, settings, verification, logger }),
    tenantHome: new TenantHomeService({ dataSource, clock, core, attachments, logger }),
    incidents: new IncidentsService(dataSource),
    preferences: new NotificationPreferencesService(dataSource, clock),
  };
  const exporter = new CsvExporter(new AuditService(dataSource, clock), () => clock.now());
  const routes: RouteGroup[] = [
    // First: the exports' `/export` paths come before the groups' `/:id` ones.
    ...exportRoutes(exportsController({ exporter, incidents: services.incidents, serviceRequests: services.serviceRequests, workOrders: services.workOrders })),
    serviceRequestsRoutes(serviceRequestsController(services.serviceRequests)),
    workOrdersRoutes(workOrdersController(services.workOrders, attachments)),
    contractorsRoutes(contractorsController(services.contractors)),
    coverageRoutes(coverageController(coverage)),
    orgSettingsRoutes(orgSettingsController(settings)),
    tenantHomeRoutes(tenantHomeController(services.tenantHome)),
    incidentsRoutes(incidentsController(services.incidents)),
    attachmentsRoutes(attachmentsController(attachments)),
    notificationPreferencesRoutes(notificationPreferencesController(services.preferences)),
  ];
  const unsubscribe: (() => void)[] = [];

  return {
    services,
    routes,
    /** Listens to the monitor; with an interval, sweeps on a timer (specs pass 0 and sweep by hand). */
    async start(sweepIntervalMs = DEFAULT_SWEEP_INTERVAL_MS): Promise<void> {
      const consider = (event: { incident: { id: string } }) => opener.considerIncident(event.incident.id);
      unsubscribe.push(bus.on('incident.opened', consider), bus.on('incident.updated', consider), bus.on('incident.closed', consider));
      unsubscribe.push(bus.on('appliance.status', (event) => verification.onStatus(event)));
      await verification.refresh();
      if (sweepIntervalMs > 0) sweeper.start(sweepIntervalMs);
    },
    async stop(): Promise<void> {
      unsubscribe.splice(0).forEach((stop) => stop());
      await sweeper.stop();
    },
  };
}

export type WorkOrders = ReturnType<typeof createWorkOrders>;
