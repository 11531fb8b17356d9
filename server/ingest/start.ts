import type { Logger } from 'pino';
import type { AppConfig } from '../config';
import { ingestAccount } from '../telemetry/ingest-account';
import { loadIngestConfig } from './config';
import type { CommittedBatchHook } from './pipeline';
import { IngestWorker } from './worker';

/**
 * The ingest as the server process runs it: one worker for every shard, unless
 * INGEST_IN_SERVER=false because separate workers (server/ingest/main.ts) do the job.
 * `onCommitted` is where the live detection is fed, per appliance in reading order.
 */
export async function startIngestInServer(config: AppConfig, logger: Logger, onCommitted?: CommittedBatchHook, env: NodeJS.ProcessEnv = process.env): Promise<IngestWorker | null> {
  if (env.INGEST_IN_SERVER === 'false') return null;
  const worker = new IngestWorker({
    mqttUrl: config.mqttUrl,
    databaseUrl: config.databaseUrl,
    account: ingestAccount(env, config.dataDir),
    config: loadIngestConfig(env),
    logger: logger.child({ component: 'ingest' }),
    onCommitted,
  });
  // Does not wait for the broker: MQTT.js keeps reconnecting, and the server serves meanwhile.
  worker.start().catch((error) => logger.error({ err: error }, 'ingest: could not start'));
  return worker;
}
