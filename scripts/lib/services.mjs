// The long-running processes `npm start` runs (and `npm test` runs for the end-to-end
// suite), in start order. Each entry: a name, the command, and a readiness check.
// Add a process here rather than editing start.mjs.
import path from 'node:path';
import { ROOT } from './paths.mjs';

const node = process.execPath;
/**
 * The broker and the server (which runs the ingest) allocate a little per message; a larger
 * young generation makes V8 collect less often. Worth about 7 % in `npm run bench`'s ingest
 * figure on this machine (same flag in broker/cluster/processes.ts, which TypeScript builds
 * and these scripts cannot import; scripts/bench.mjs takes it from here).
 */
export const THROUGHPUT_FLAGS = ['--max-semi-space-size=64'];
const dist = (file) => path.join(ROOT, 'dist', 'server', file);

/** The seeded history ends this long before the seed ran (seeds/scenario/storyline.ts STORYLINE_REPLAY_HOURS). */
export const STORYLINE_REPLAY_HOURS = 10;
/** Simulated seconds per real second while the storyline replays (seeds/scenario/storyline.ts). */
export const DEFAULT_STORYLINE_SPEED = 90;

/**
 * The simulator continues each sensor where the seeded history stopped. By default it plays
 * the storyline: the last STORYLINE_REPLAY_HOURS before start at 90× (under seven minutes),
 * then live in real time. --speed S plays them at S× (1: real time, the gap written at full
 * speed); --calm plays no scripted faults and, without --speed, no replay. A work order
 * completed in the app repairs its appliance in the simulation.
 * @param {{ calm?: boolean, speed?: number }} options
 */
export function simulatorArgs(env, options) {
  const args = ['--backfill-days', '1', '--idle-without-fleet', '--repair-on-completion'];
  const speed = options.speed ?? (options.calm ? 1 : DEFAULT_STORYLINE_SPEED);
  if (speed !== 1) args.push('--replay-hours', String(STORYLINE_REPLAY_HOURS), '--speed', String(speed));
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
      args: [...THROUGHPUT_FLAGS, dist('broker/main.js')],
      env,
      ready: { tcp: `${mqtt.hostname}:${mqtt.port}` },
    },
    {
      name: 'server',
      command: node,
      args: [...THROUGHPUT_FLAGS, dist('server/main.js')],
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
