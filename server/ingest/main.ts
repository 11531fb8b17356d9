import pino from 'pino';
import { loadConfig } from '../config';
import { ingestAccount } from '../telemetry/ingest-account';
import { loadIngestConfig } from './config';
import { IngestWorker } from './worker';

/**
 * A stand-alone ingest worker for a clustered deployment: INGEST_SHARDS says which shards
 * it owns (e.g. 0-31 and 32-63 for two workers), INGEST_CLIENT_ID keeps its session.
 * Run the server with INGEST_IN_SERVER=false then. See broker/README.md.
 */
async function main(): Promise<void> {
  const config = loadConfig();
  const ingestConfig = loadIngestConfig();
  const logger = pino({ level: config.logLevel, base: { service: 'ingest', clientId: ingestConfig.clientId } });
  const worker = new IngestWorker({
    mqttUrl: config.mqttUrl,
    databaseUrl: config.databaseUrl,
    account: ingestAccount(process.env, config.dataDir),
    config: ingestConfig,
    logger,
    // The detection engine will be fed here, as in the server process (startIngestInServer).
  });
  await worker.start();
  const stop = async (signal: string) => {
    logger.info({ signal, ...worker.stats() }, 'ingest: stopping');
    await worker.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop('SIGINT'));
  process.once('SIGTERM', () => void stop('SIGTERM'));
}

main().catch((error) => {
  console.error(`[ingest] ${(error as Error).message}`);
  process.exit(1);
});
