import 'reflect-metadata';
import pino from 'pino';
import { createApp } from './app';
import { loadConfig, packageVersion } from './config';
import { AppDataSource } from './data-source';
import { startIngestInServer } from './ingest/start';
import { brokerProbe } from './services/broker-probe';

/** Starts the server: connects, migrates, listens; stops cleanly on SIGINT/SIGTERM. */
async function main(): Promise<void> {
  const config = loadConfig();
  const logger = pino({ level: config.logLevel });
  await AppDataSource.initialize();
  const applied = await AppDataSource.runMigrations({ transaction: 'each' });
  if (applied.length) logger.info({ migrations: applied.map((m) => m.name) }, 'migrations applied');

  const app = createApp({ config, dataSource: AppDataSource, logger, brokerProbe: brokerProbe(config.mqttUrl), version: packageVersion() });
  const server = app.listen(config.port, config.host, () => logger.info(`listening on ${config.publicUrl}`));
  // Live detection will be passed here as the committed-batch hook (see server/ingest/pipeline.ts).
  const ingest = await startIngestInServer(config, logger);

  const stop = async (signal: string) => {
    logger.info({ signal }, 'stopping');
    server.close();
    server.closeAllConnections();
    await ingest?.stop();
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
