import pino from 'pino';
import { loadBrokerConfig } from './config';
import { startBroker } from './create-broker';

/** The broker process `npm start` runs (and the cluster runs twice, with REDIS_URL). */
async function main(): Promise<void> {
  const config = loadBrokerConfig();
  const logger = pino({ level: config.logLevel, base: { service: 'broker' } });
  const broker = await startBroker(config, logger);
  const stop = async (signal: string) => {
    logger.info({ signal }, 'broker: stopping');
    const force = setTimeout(() => process.exit(0), 5000);
    force.unref();
    // aedes.close ends every client connection, so the close itself is quick.
    await broker.close().catch((error) => logger.error({ err: error }, 'broker: unclean stop'));
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  console.error(`[broker] ${(error as Error).message}`);
  process.exit(1);
});
