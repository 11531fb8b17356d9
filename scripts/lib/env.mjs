// The environment every service of one running stack shares. `npm start` uses the
// defaults; the end-to-end suite runs a second stack on other ports and its own data.
import { DATA_DIR, databaseUrl } from './paths.mjs';

export const DEFAULT_PORTS = { http: 4280, mqtt: 1884 };

/**
 * The stack is decided on Node 20 and package-lock pins an AWS SDK that supports it; the
 * SDK's notice that later releases will need Node 22 would only clutter the output.
 */
export const QUIET_SDK_ENV = { AWS_SDK_JS_NODE_VERSION_SUPPORT_WARNING_DISABLED: 'true' };

export function stackEnv({ ports = DEFAULT_PORTS, database, dataDir = DATA_DIR, extra = {} } = {}) {
  const publicUrl = `http://127.0.0.1:${ports.http}`;
  return {
    ...QUIET_SDK_ENV,
    ...process.env,
    NODE_ENV: process.env.NODE_ENV ?? 'production',
    HOST: '127.0.0.1',
    PORT: String(ports.http),
    PUBLIC_URL: publicUrl,
    DATABASE_URL: databaseUrl(database),
    MQTT_URL: `mqtt://127.0.0.1:${ports.mqtt}`,
    MQTT_PORT: String(ports.mqtt),
    CHILLWARDEN_DATA_DIR: dataDir,
    ...extra,
  };
}
