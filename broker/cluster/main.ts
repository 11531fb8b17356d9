import { loadConfig } from '../../server/config';
import { ingestAccount } from '../../server/telemetry/ingest-account';
import { startLocalCluster } from './local-cluster';

/**
 * The clustered variant on this machine (see broker/README.md, "Past one machine"):
 *   npx tsx --tsconfig server/tsconfig.json broker/cluster/main.ts [--workers N] [--brokers N]
 * Start the web server next to it with INGEST_IN_SERVER=false, and point sensors (or the
 * simulator's --broker) at either broker URL it prints.
 */
function flag(name: string, fallback: number): number {
  const index = process.argv.indexOf(name);
  const value = index >= 0 ? Number(process.argv[index + 1]) : fallback;
  if (!Number.isInteger(value) || value < 1) throw new Error(`${name} takes a whole number`);
  return value;
}

async function main(): Promise<void> {
  const config = loadConfig();
  const cluster = await startLocalCluster({
    databaseUrl: config.databaseUrl,
    ingestPassword: ingestAccount(process.env, config.dataDir).password,
    workers: flag('--workers', 2),
    brokers: flag('--brokers', 2),
    logLevel: process.env.LOG_LEVEL ?? 'info',
    echo: true,
  });
  console.log(`[cluster] Redis ${cluster.redisUrl}; brokers ${cluster.brokerUrls.join(', ')}`);
  for (const worker of cluster.workers) console.log(`[cluster] ${worker.name}: shards ${worker.shards} (session ${worker.clientId})`);
  const stop = async () => {
    await cluster.stop();
    process.exit(0);
  };
  process.once('SIGINT', () => void stop());
  process.once('SIGTERM', () => void stop());
}

main().catch((error) => {
  console.error(`[cluster] ${(error as Error).message}`);
  process.exit(1);
});
