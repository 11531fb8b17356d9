import net from 'node:net';
import { Aedes } from 'aedes';
import { Pool } from 'pg';
import type { Logger } from 'pino';
import { authHooks } from './auth';
import type { BrokerConfig } from './config';
import { DeviceAuthenticator } from './device-auth';
import { IndexedMemoryPersistence } from './memory-persistence';
import { redisSharedState, type SharedState } from './persistence';
import { RejectSink } from './reject-sink';
import { coalesceWrites } from '../server/telemetry/coalesce-writes';

export interface RunningBroker {
  aedes: Aedes;
  port: number;
  close(): Promise<void>;
}

/** Client ids up to this long (device ids are at most 48; aedes' own default is 23). */
const MAX_CLIENT_ID_LENGTH = 64;

/** Starts aedes with per-device authentication on a TCP port; port 0 picks a free one. */
export async function startBroker(config: BrokerConfig, logger: Logger): Promise<RunningBroker> {
  const pool = new Pool({ connectionString: config.databaseUrl, max: 4, connectionTimeoutMillis: 5000 });
  pool.on('error', (error) => logger.warn({ err: error }, 'broker: idle database connection failed'));
  const rejects = new RejectSink(pool, logger);
  const shared: SharedState | null = config.redisUrl ? redisSharedState(config.redisUrl, config.maxSessionDelivery) : null;
  const aedes = await Aedes.createBroker({
    id: config.brokerId,
    mq: shared?.mq,
    persistence: shared?.persistence ?? new IndexedMemoryPersistence(),
    maxClientsIdLength: MAX_CLIENT_ID_LENGTH,
    drainTimeout: 30_000,
    ...authHooks({
      devices: new DeviceAuthenticator(pool),
      ingest: config.ingest,
      rejects,
      maxPayloadBytes: config.maxPayloadBytes,
      onInternalError: (error) => logger.error({ err: error }, 'broker: sign-in check failed'),
    }),
  });
  aedes.on('clientError', (client, error) => logger.debug({ client: client.id, err: error.message }, 'broker: client error'));
  aedes.on('connectionError', (client, error) => logger.debug({ client: client?.id, err: error.message }, 'broker: connection error'));

  const server = net.createServer((socket) => {
    coalesceWrites(socket);
    aedes.handle(socket);
  });
  const sockets = new Set<net.Socket>();
  server.on('connection', (socket) => {
    sockets.add(socket);
    socket.once('close', () => sockets.delete(socket));
  });
  await new Promise<void>((resolve, reject) => {
    server.once('error', reject);
    server.listen(config.port, config.host, () => resolve());
  });
  const port = (server.address() as net.AddressInfo).port;
  logger.info({ host: config.host, port, clustered: Boolean(shared) }, 'broker: listening');

  return {
    aedes,
    port,
    async close() {
      // aedes.close ends the client connections, which lets server.close finish.
      const serverClosed = new Promise<void>((resolve) => server.close(() => resolve()));
      await new Promise<void>((resolve) => aedes.close(() => resolve()));
      // A connection still in its CONNECT handshake is not an aedes client yet.
      sockets.forEach((socket) => socket.destroy());
      await serverClosed;
      await rejects.close();
      await pool.end();
    },
  };
}
