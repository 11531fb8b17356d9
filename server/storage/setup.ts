import fs from 'node:fs';
import path from 'node:path';
import S3rver from 's3rver';
import { S3ObjectStore, type ObjectStore } from './object-store';

export const LOCAL_BUCKET = 'chillwarden-files';
/** The fake's fixed credentials (it checks signatures against these). */
const LOCAL_KEY = 'S3RVER';

export interface ObjectStorage {
  store: ObjectStore;
  description: string;
  close(): Promise<void>;
}

/** The fake S3 server on loopback, its data under `directory`; port 0 picks a free one. */
export async function startLocalS3(directory: string, port = 0): Promise<ObjectStorage> {
  fs.mkdirSync(directory, { recursive: true });
  const server = new S3rver({ address: '127.0.0.1', port, silent: true, directory, configureBuckets: [{ name: LOCAL_BUCKET, configs: [] }] });
  const address = await server.run();
  const endpoint = `http://127.0.0.1:${address.port}`;
  const store = new S3ObjectStore({ endpoint, bucket: LOCAL_BUCKET, region: 'us-east-1', accessKeyId: LOCAL_KEY, secretAccessKey: LOCAL_KEY });
  return {
    store,
    description: `files kept by the local S3 fake at ${endpoint}, data in ${directory}`,
    async close() {
      store.destroy();
      await server.close();
    },
  };
}

/**
 * S3_URL set: that bucket (S3_BUCKET, S3_REGION, S3_ACCESS_KEY_ID, S3_SECRET_ACCESS_KEY).
 * Unset: the fake starts inside this process with its data in DATA_DIR/s3 — one process
 * fewer to run in development and tests.
 */
export async function startObjectStorage(env: NodeJS.ProcessEnv, options: { dataDir: string }): Promise<ObjectStorage> {
  if (!env.S3_URL) return startLocalS3(path.join(options.dataDir, 's3'), Number(env.FAKE_S3_PORT ?? 0));
  const store = new S3ObjectStore({
    endpoint: env.S3_URL,
    bucket: env.S3_BUCKET ?? LOCAL_BUCKET,
    region: env.S3_REGION ?? 'us-east-1',
    accessKeyId: env.S3_ACCESS_KEY_ID ?? '',
    secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? '',
  });
  return { store, description: `files in bucket ${env.S3_BUCKET ?? LOCAL_BUCKET} at ${new URL(env.S3_URL).host}`, close: async () => store.destroy() };
}
