import fs from 'node:fs';
import path from 'node:path';

/**
 * Configuration from environment variables, each with a working default so that no
 * `.env` file is needed. The defaults match what `npm start` sets up.
 */
export interface AppConfig {
  nodeEnv: string;
  host: string;
  port: number;
  databaseUrl: string;
  mqttUrl: string;
  dataDir: string;
  clientDir: string;
  publicUrl: string;
  logLevel: string;
}

/** The repository root, whether running from TypeScript sources or from dist/server/server. */
function findProjectRoot(start: string): string {
  for (let dir = start; dir !== path.dirname(dir); dir = path.dirname(dir)) {
    if (fs.existsSync(path.join(dir, 'package.json'))) return dir;
  }
  return process.cwd();
}

export const ROOT = findProjectRoot(__dirname);

export function packageVersion(): string {
  return JSON.parse(fs.readFileSync(path.join(ROOT, 'package.json'), 'utf8')).version;
}

function numberFrom(value: string | undefined, fallback: number): number {
  const parsed = Number(value);
  return value !== undefined && Number.isFinite(parsed) ? parsed : fallback;
}

export function loadConfig(env: NodeJS.ProcessEnv = process.env): AppConfig {
  const port = numberFrom(env.PORT, 4280);
  const host = env.HOST ?? '127.0.0.1';
  return {
    nodeEnv: env.NODE_ENV ?? 'development',
    host,
    port,
    databaseUrl: env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:55432/chillwarden',
    mqttUrl: env.MQTT_URL ?? 'mqtt://127.0.0.1:1884',
    dataDir: path.resolve(env.CHILLWARDEN_DATA_DIR ?? path.join(ROOT, '.data')),
    clientDir: path.resolve(env.CLIENT_DIR ?? path.join(ROOT, 'dist', 'client', 'browser')),
    publicUrl: env.PUBLIC_URL ?? `http://${host}:${port}`,
    logLevel: env.LOG_LEVEL ?? (env.NODE_ENV === 'test' ? 'silent' : 'info'),
  };
}
