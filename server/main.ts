import 'reflect-metadata';
import pino from 'pino';
import { createApp } from './app';
import { systemClock } from './auth/clock';
import { loadSessionSecret } from './auth/secrets';
import { loadConfig, packageVersion } from './config';
import { AppDataSource } from './data-source';
import { startIngestInServer } from './ingest/start';
import { EventBus } from './events/bus';
import { startMail } from './mail/setup';
import { startMonitor } from './monitor/start';
import { startObjectStorage } from './storage/setup';
import { createWorkOrders } from './work-orders/create';
import { brokerProbe } from './services/broker-probe';
import { ingestProbe } from './services/ingest-probe';

/** Starts the server: connects, migrates, listens; stops cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = pino({ level: config.logLevel });
  await AppDataSource.initialize();
  const applied = await AppDataSource.runMigrations({ transaction: 'each' });
  if (applied.length) logger.info({ migrations: applied.map((m) => m.name) }, 'migrations applied');

  const mail = await startMail(process.env, { dataDir: config.dataDir, host: config.host });
  logger.info(mail.description);
  const devInbox = mail.inboxOverHttp ? mail.inbox : null;
  const accounts = { mailer: mail.mailer, devInbox, sessionSecret: loadSessionSecret(process.env, config.dataDir) };
  // The monitor publishes on the bus; the web app's live feed forwards it.
  const bus = new EventBus(logger);
  const storage = await startObjectStorage(process.env, { dataDir: config.dataDir });
  logger.info(storage.description);
  // Requests and work orders: opened from the monitor's incidents on the bus, timers on a sweeper.
  const workOrders = createWorkOrders({ dataSource: AppDataSource, publicUrl: config.publicUrl, logger, bus, clock: systemClock, mailer: mail.mailer, store: storage.store });
  await workOrders.start();
  // Live detection: every committed batch goes through the monitor, which publishes on the bus.
  const monitor = startMonitor({ dataSource: AppDataSource, bus, logger, clock: systemClock });
  const ingest = await startIngestInServer(config, logger, monitor.service.hook);
  const app = createApp({
    config,
    dataSource: AppDataSource,
    logger,
    brokerProbe: brokerProbe(config.mqttUrl),
    ingestProbe: ingest ? ingestProbe(ingest) : undefined,
    version: packageVersion(),
    accounts,
    bus,
    workOrders,
  });
  const server = app.listen(config.port, config.host, () => {
    logger.info(`listening on ${config.publicUrl}`);
    if (devInbox) logger.info(`dev inbox (e-mail sent by the server) at ${config.publicUrl}/dev/inbox`);
  });

  const stop = async (signal: string) => {
    logger.info({ signal }, 'stopping');
    server.close();
    server.closeAllConnections();
    await ingest?.stop();
    await monitor.stop();
    await workOrders.stop();
    await storage.close();
    await mail.close();
    await AppDataSource.destroy();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  console.error(error);
  process.exit(1);
});
