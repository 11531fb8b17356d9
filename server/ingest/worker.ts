import { Pool } from 'pg';
import type { Logger } from 'pino';
import { shardFilter } from '../../shared/telemetry';
import type { IngestAccount } from '../telemetry/ingest-account';
import { AckingSubscriber } from './acking-subscriber';
import type { IngestConfig } from './config';
import { PartitionManager } from './partitions';
import { IngestPipeline, type CommittedBatchHook, type PipelineStats } from './pipeline';
import { trimRejects } from './rejects';
import { SensorDirectory } from './sensor-directory';

export interface IngestWorkerOptions {
  mqttUrl: string;
  databaseUrl: string;
  account: IngestAccount;
  config: IngestConfig;
  logger: Logger;
  /** Where live ingest feeds each appliance's new readings in order (detection plugs in here). */
  onCommitted?: CommittedBatchHook;
}

const DAY_MS = 24 * 60 * 60_000;

/**
 * One ingest worker: subscribes to its shards over MQTT (QoS 1, persistent session),
 * validates, stores in batches and acknowledges after the commit. Also keeps the
 * partitions ahead and applies the retention setting.
 */
export class IngestWorker {
  private readonly pool: Pool;
  private readonly partitions: PartitionManager;
  private readonly pipeline: IngestPipeline;
  private readonly subscriber: AckingSubscriber;
  private maintenanceTimer: NodeJS.Timeout | null = null;
  private stopped: Promise<void> | null = null;

  constructor(private readonly options: IngestWorkerOptions) {
    const { config, logger } = options;
    // Two connections: one writing batches, one for maintenance and partition DDL.
    this.pool = new Pool({ connectionString: options.databaseUrl, max: 2, connectionTimeoutMillis: 5000 });
    this.pool.on('error', (error) => logger.warn({ err: error }, 'ingest: idle database connection failed'));
    this.partitions = new PartitionManager(this.pool);
    this.pipeline = new IngestPipeline(
      {
        pool: this.pool,
        directory: new SensorDirectory(),
        partitions: this.partitions,
        limits: () => {
          const nowMs = Date.now();
          return { nowMs, oldestAcceptedMs: nowMs - config.retentionDays * DAY_MS, maxFutureSkewMs: config.maxFutureSkewMs };
        },
        logger,
        onCommitted: options.onCommitted,
      },
      config.pipeline,
    );
    this.subscriber = new AckingSubscriber({
      url: options.mqttUrl,
      clientId: config.clientId,
      username: options.account.username,
      password: options.account.password,
      filters: config.shards.map(shardFilter),
      maxUnacked: config.maxUnacked,
      onMessage: (message) => this.pipeline.push(message),
      onConnectionLost: () => this.pipeline.connectionLost(),
      onError: (error) => logger.warn({ err: error }, 'ingest: MQTT connection problem'),
    });
  }

  async start(): Promise<void> {
    await this.maintain();
    this.maintenanceTimer = setInterval(() => void this.maintain(), this.options.config.maintenanceIntervalMs);
    this.maintenanceTimer.unref();
    await this.subscriber.start();
    this.options.logger.info({ shards: this.options.config.shards.length, clientId: this.options.config.clientId }, 'ingest: subscribed');
  }

  /** Idempotent: the first call stops, later calls wait for it. */
  stop(): Promise<void> {
    this.stopped ??= (async () => {
      if (this.maintenanceTimer) clearInterval(this.maintenanceTimer);
      await this.subscriber.stop();
      await this.pipeline.stop();
      await this.pool.end();
    })();
    return this.stopped;
  }

  stats(): PipelineStats & { connected: boolean } {
    return { ...this.pipeline.stats(), connected: this.subscriber.connected };
  }

  /** Resolves once every message received so far is stored (specs and the benchmark use it). */
  idle(): Promise<void> {
    return this.pipeline.idle();
  }

  /** Never throws: a database outage only delays it to the next round. */
  private async maintain(): Promise<void> {
    const nowMs = Date.now();
    try {
      await this.partitions.ensureAhead(nowMs);
      const dropped = await this.partitions.dropOlderThan(nowMs - this.options.config.retentionDays * DAY_MS);
      if (dropped.length) this.options.logger.info({ dropped }, 'ingest: dropped partitions past the retention');
      await trimRejects(this.pool);
    } catch (error) {
      this.options.logger.warn({ err: error }, 'ingest: maintenance failed; will retry');
    }
  }
}
