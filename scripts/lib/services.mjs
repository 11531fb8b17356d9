// The long-running processes `npm start` runs (and `npm test` runs for the end-to-end
// suite), in start order. Each entry: a name, the command, and a readiness check.
// Add a process here rather than editing start.mjs.
import path from 'node:path';
import { ROOT } from './paths.mjs';

const node = process.execPath;
const dist = (file) => path.join(ROOT, 'dist', 'server', file);

/**
 * Two weeks of history at full speed, then live. --speed S replays the last day at S×
 * before going live (the fleet file's faults develop in it); --calm plays no faults.
 * @param {{ calm?: boolean, speed?: number }} options
 */
function simulatorArgs(env, options) {
  const args = ['--backfill-days', '14', '--idle-without-fleet'];
  if (options.speed && options.speed !== 1) args.push('--replay-hours', '24', '--speed', String(options.speed));
  if (options.calm) args.push('--no-faults');
  if (env.SIMULATOR_CONTROL_PORT) args.push('--control-port', env.SIMULATOR_CONTROL_PORT);
  return args;
}

/**
 * @param {NodeJS.ProcessEnv} env the environment every service gets (ports, URLs)
 * @param {{ calm?: boolean, speed?: number }} options from the command line
 */
export function services(env, options = {}) {
  const mqtt = new URL(env.MQTT_URL);
  return [
    {
      name: 'broker',
      command: node,
      args: [dist('broker/main.js')],
      env,
      ready: { tcp: `${mqtt.hostname}:${mqtt.port}` },
    },
    {
      name: 'server',
      command: node,
      args: [dist('server/main.js')],
      env,
      ready: { http: `${env.PUBLIC_URL}/api/health` },
    },
    {
      name: 'simulator',
      command: node,
      args: [dist('simulator/cli/main.js'), ...simulatorArgs(env, options)],
      env,
    },
  ];
}
