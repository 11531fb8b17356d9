import fs from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';

/**
 * The MQTT account the server's ingest signs in with. The broker and the server read the
 * same secret: MQTT_INGEST_PASSWORD when set (a deployment's secret store), otherwise a
 * random one created once in the git-ignored data folder (mode 600). A deployment that
 * points MQTT_URL at another broker gives that broker the same user name and password.
 */
export interface IngestAccount {
  username: string;
  password: string;
}

export const DEFAULT_INGEST_USERNAME = 'cw-ingest';

function readOrCreateSecret(file: string): string {
  try {
    return fs.readFileSync(file, 'utf8').trim();
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'ENOENT') throw error;
  }
  fs.mkdirSync(path.dirname(file), { recursive: true });
  try {
    // 'wx' fails when another process (broker or server) created it first: read theirs.
    fs.writeFileSync(file, randomBytes(32).toString('base64url'), { flag: 'wx', mode: 0o600 });
  } catch (error) {
    if ((error as NodeJS.ErrnoException).code !== 'EEXIST') throw error;
  }
  return fs.readFileSync(file, 'utf8').trim();
}

export function ingestAccount(env: NodeJS.ProcessEnv, dataDir: string): IngestAccount {
  const username = env.MQTT_INGEST_USERNAME ?? DEFAULT_INGEST_USERNAME;
  const password = env.MQTT_INGEST_PASSWORD ?? readOrCreateSecret(path.join(dataDir, 'mqtt-ingest.secret'));
  return { username, password };
}
