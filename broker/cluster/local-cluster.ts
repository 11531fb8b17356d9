import { SHARD_COUNT } from '../../shared/telemetry';
import { freePort, nodeArgsFor, startProcess, tcpOpen, waitFor, type ManagedProcess } from './processes';
import { startRedis } from './redis-server';

/**
 * The clustered variant on one machine: Redis, two aedes broker processes sharing state
 * through it, and two ingest workers that each own half of the shards. Worker i connects
 * to broker i, but any sensor may sign in to either broker (as behind a TCP load
 * balancer): a reading published on one broker reaches the worker on the other through
 * Redis, and a worker's persistent session (and what queued in it) lives in Redis, so a
 * restarted worker may come back through the other broker.
 */
export interface LocalClusterOptions {
  databaseUrl: string;
  ingestPassword: string;
  /** How many ingest workers (each gets an equal share of the shards); default 2. */
  workers?: number;
  brokers?: number;
  logLevel?: string;
  echo?: boolean;
}

export interface WorkerSpec {
  name: string;
  shards: string;
  clientId: string;
}

export interface LocalCluster {
  redisUrl: string;
  brokerPorts: number[];
  brokerUrls: string[];
  workers: WorkerSpec[];
  /** Starts (or restarts) worker `index`, connected to broker `brokerIndex`. */
  startWorker(index: number, brokerIndex?: number): Promise<void>;
  /** Kills a worker without letting it finish (SIGKILL), as a crash would. */
  killWorker(index: number): Promise<void>;
  stop(): Promise<void>;
}

export function shardRanges(workers: number): string[] {
  const per = Math.ceil(SHARD_COUNT / workers);
  return Array.from({ length: workers }, (_, i) => `${i * per}-${Math.min(SHARD_COUNT, (i + 1) * per) - 1}`);
}

export async function startLocalCluster(options: LocalClusterOptions): Promise<LocalCluster> {
  const brokerCount = options.brokers ?? 2;
  const logLevel = options.logLevel ?? 'warn';
  const common = { DATABASE_URL: options.databaseUrl, MQTT_INGEST_PASSWORD: options.ingestPassword };
  const redis = await startRedis(await freePort());
  const brokers: ManagedProcess[] = [];
  const brokerPorts: number[] = [];
  const running = new Map<number, ManagedProcess>();
  const workers: WorkerSpec[] = shardRanges(options.workers ?? 2).map((shards, i) => ({ name: `ingest-${i + 1}`, shards, clientId: `cw-ingest-${shards}` }));

  const stop = async () => {
    await Promise.all([...running.values()].map((worker) => worker.stop()));
    await Promise.all(brokers.map((broker) => broker.stop()));
    await redis.stop();
  };

  try {
    for (let i = 0; i < brokerCount; i++) {
      const port = await freePort();
      const { args, env } = nodeArgsFor('broker/main');
      const broker = startProcess(`broker-${i + 1}`, process.execPath, args, { ...env, ...common, REDIS_URL: redis.url, MQTT_PORT: String(port), BROKER_ID: `broker-${i + 1}`, LOG_LEVEL: logLevel }, options.echo);
      brokers.push(broker);
      brokerPorts.push(port);
      await waitFor('starting', broker, () => tcpOpen(port));
    }
  } catch (error) {
    await stop();
    throw error;
  }

  const startWorker = async (index: number, brokerIndex = index % brokerCount) => {
    await running.get(index)?.stop();
    const spec = workers[index];
    const { args, env } = nodeArgsFor('server/ingest/main');
    const worker = startProcess(spec.name, process.execPath, args, {
      ...env,
      ...common,
      MQTT_URL: `mqtt://127.0.0.1:${brokerPorts[brokerIndex]}`,
      INGEST_SHARDS: spec.shards,
      INGEST_CLIENT_ID: spec.clientId,
      // The readiness check reads the "subscribed" line, so info level at least.
      LOG_LEVEL: logLevel === 'debug' ? 'debug' : 'info',
    }, options.echo);
    running.set(index, worker);
    await waitFor('subscribing', worker, () => worker.output().includes('ingest: subscribed'));
  };

  try {
    for (let i = 0; i < workers.length; i++) await startWorker(i);
  } catch (error) {
    await stop();
    throw error;
  }

  return {
    redisUrl: redis.url,
    brokerPorts,
    brokerUrls: brokerPorts.map((port) => `mqtt://127.0.0.1:${port}`),
    workers,
    startWorker,
    async killWorker(index) {
      await running.get(index)?.stop('SIGKILL');
      running.delete(index);
    },
    stop,
  };
}
