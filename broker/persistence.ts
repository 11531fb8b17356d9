import { createRequire } from 'node:module';

/**
 * Shared broker state for several broker processes: messages between brokers go through
 * Redis pub/sub (mqemitter-redis 7.2.1), sessions, subscriptions and queued QoS 1
 * messages live in Redis (aedes-persistence-redis 11.2.2; 12.x wants a newer aedes).
 * Without a Redis URL aedes keeps all of it in this process's memory.
 */
export interface SharedState {
  mq: { close(callback: () => void): void };
  persistence: unknown;
}

const requireCjs = createRequire(__filename);

export function redisSharedState(redisUrl: string, maxSessionDelivery: number): SharedState {
  const mqemitterRedis = requireCjs('mqemitter-redis') as (options: { connectionString: string }) => SharedState['mq'];
  const redisPersistence = requireCjs('aedes-persistence-redis') as (options: Record<string, unknown>) => unknown;
  const url = new URL(redisUrl);
  return {
    mq: mqemitterRedis({ connectionString: redisUrl }),
    persistence: redisPersistence({
      host: url.hostname,
      port: Number(url.port || 6379),
      db: Number(url.pathname.slice(1) || 0),
      password: url.password || undefined,
      // Offline messages handed to a reconnecting session at once (default 1000 would
      // leave the rest of an ingest worker's backlog waiting for its next reconnect).
      maxSessionDelivery,
    }),
  };
}
