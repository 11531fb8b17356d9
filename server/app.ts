import fs from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { Logger } from 'pino';
import type { DataSource } from 'typeorm';
import { createAccounts, type AccountsOptions } from './auth/accounts';
import { RouteGroup, RouteTable } from './auth/route-table';
import { systemClock } from './auth/clock';
import type { AppConfig } from './config';
import { EventBus } from './events/bus';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { healthHandlers } from './routes/health';
import { createInventory } from './routes/inventory';
import { webAppRoutes, type WebAppRouteDeps } from './routes/web-app';
import { HealthService, databaseProbe, type ComponentProbe } from './services/health';
import type { WorkOrders } from './work-orders/create';

/** What the app is built from; specs pass their own (a throwaway database, a fake broker probe). */
export interface AppDeps {
  config: AppConfig;
  dataSource: DataSource;
  logger: Logger;
  brokerProbe: ComponentProbe;
  /** The ingest running in this process, when it does (server/services/ingest-probe.ts). */
  ingestProbe?: ComponentProbe;
  version: string;
  /** Sign-in, sessions and mail; specs that never sign in may leave it out. */
  accounts?: AccountsOptions;
  /** The in-process event bus the live feed forwards; without one the feed stays quiet. */
  bus?: EventBus;
  /** Service requests, work orders, contractors and the tenant's side (server/work-orders/create.ts). */
  workOrders?: Pick<WorkOrders, 'routes' | 'services'>;
  /** Service history, repair rule and heartbeat of the web app's pages; defaults otherwise. */
  webApp?: Pick<WebAppRouteDeps, 'serviceHistory' | 'repairRule' | 'heartbeatMs'>;
}

function securityHeaders(config: AppConfig) {
  const https = config.publicUrl.startsWith('https:');
  return helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // Angular Material and echarts set style attributes at run time.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'", 'data:'],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        frameAncestors: ["'none'"],
        upgradeInsecureRequests: https ? [] : null,
      },
    },
    strictTransportSecurity: https,
  });
}

/** One short line per API request; static files and health polls are not logged. */
function requestLogger(logger: Logger) {
  return pinoHttp({
    logger,
    autoLogging: { ignore: (req) => !req.url?.startsWith('/api/') || req.url.startsWith('/api/health') },
    serializers: {
      req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
      res: (res: { statusCode: number }) => ({ statusCode: res.statusCode }),
    },
    customLogLevel: (_req, res, error) => (error || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info'),
  });
}

/** Serves the built Angular app and answers client routes with index.html. */
function clientApp(clientDir: string): express.Router {
  const router = express.Router();
  const indexFile = path.join(clientDir, 'index.html');
  router.use(express.static(clientDir, { index: false, maxAge: '1y', immutable: true }));
  router.get('/{*splat}', (req, res) => {
    if (!fs.existsSync(indexFile)) {
      res.status(503).type('text/plain').send('The web client is not built yet: run `npm run build:client`.');
      return;
    }
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexFile);
  });
  return router;
}

export function createApp(deps: AppDeps): Express {
  const { config, logger } = deps;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', 'loopback');
  app.use(securityHeaders(config));
  app.use(compression());
  app.use(requestLogger(logger));
  app.use(express.json({ limit: '256kb' }));

  // Every route is mounted through the route table, which records its access rule.
  const routes = new RouteTable();
  const health = new HealthService(deps.version, { database: databaseProbe(deps.dataSource), broker: deps.brokerProbe, ingest: deps.ingestProbe });
  // Before the session middleware, so load balancers' polls never touch the session store.
  const healthApi = healthHandlers(health);
  routes.mount(
    app,
    new RouteGroup('/api/health')
      .get('/', { access: 'public', scope: 'none', summary: 'component states' }, healthApi.report)
      .get('/ready', { access: 'public', scope: 'none', summary: 'readiness: 503 while a component is down' }, healthApi.ready),
  );

  const accounts = createAccounts({ config, dataSource: deps.dataSource, logger, options: deps.accounts });
  app.use('/api', ...accounts.middleware);
  routes.mount(app, ...accounts.routes);
  routes.mount(app, new RouteGroup('/api/health').get('/details', { access: ['manager'], scope: 'none', summary: 'component health with versions and error details' }, healthApi.details));
  routes.mount(app, ...createInventory({ dataSource: deps.dataSource, logger }).routes);
  if (deps.workOrders) routes.mount(app, ...deps.workOrders.routes);

  const web = webAppRoutes({
    dataSource: deps.dataSource,
    bus: deps.bus ?? new EventBus(logger),
    // With work orders, contractors reach the units of their jobs (WorkOrderScope).
    scope: deps.workOrders?.services.scope ?? accounts.services.scope,
    clock: deps.accounts?.clock ?? systemClock,
    logger,
    actorById: (id) => accounts.services.users.actorById(id),
    ...deps.webApp,
  });
  routes.mount(app, ...web.groups);
  app.locals.liveEvents = web.live;

  app.use('/api', apiNotFound);
  app.use(clientApp(config.clientDir));
  app.use(errorHandler(config.nodeEnv === 'development'));
  return app;
}
