// The long-running processes `npm start` runs (and `npm test` runs for the end-to-end
// suite), in start order. Each entry: a name, the command, and a readiness check.
// Add a process here rather than editing start.mjs.
import path from 'node:path';
import { ROOT } from './paths.mjs';

const node = process.execPath;
const dist = (file) => path.join(ROOT, 'dist', 'server', file);

/**
 * @param {NodeJS.ProcessEnv} env the environment every service gets (ports, URLs)
 * @param {{ calm?: boolean, speed?: number }} options from the command line
 */
export function services(env, options = {}) {
  void options;
  return [
    {
      name: 'server',
      command: node,
      args: [dist('server/main.js')],
      env,
      ready: { http: `${env.PUBLIC_URL}/api/health` },
    },
  ];
}
