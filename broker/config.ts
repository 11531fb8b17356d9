import { loadConfig } from '../server/config';
import { ingestAccount, type IngestAccount } from '../server/telemetry/ingest-account';

/** What the broker process runs with; see broker/README.md. */
export interface BrokerConfig {
  host: string;
  port: number;
  databaseUrl: string;
  /** When set, broker processes share subscriptions, sessions and queued messages through Redis. */
  redisUrl: string | null;
  /** Names this process among clustered brokers (aedes uses it to tell its own messages apart). */
  brokerId: string | undefined;
  /** The broker refuses bigger publishes outright (the ingest's own limit for a reading is 4 KB). */
  maxPayloadBytes: number;
  /** Offline messages a reconnecting persistent session gets in one go with Redis persistence. */
  maxSessionDelivery: number;
  ingest: IngestAccount;
  logLevel: string;
}

export function loadBrokerConfig(env: NodeJS.ProcessEnv = process.env): BrokerConfig {
  const app = loadConfig(env);
  const mqttUrl = new URL(app.mqttUrl);
  return {
    host: env.BROKER_HOST ?? '127.0.0.1',
    port: Number(env.MQTT_PORT ?? (mqttUrl.port || 1883)),
    databaseUrl: app.databaseUrl,
    redisUrl: env.REDIS_URL || null,
    brokerId: env.BROKER_ID || undefined,
    maxPayloadBytes: Number(env.BROKER_MAX_PAYLOAD_BYTES ?? 65_536),
    maxSessionDelivery: Number(env.BROKER_MAX_SESSION_DELIVERY ?? 200_000),
    ingest: ingestAccount(env, app.dataDir),
    logLevel: app.logLevel,
  };
}
