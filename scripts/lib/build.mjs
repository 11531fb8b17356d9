// Builds what is stale: the server with tsc (incremental), the client when any of its
// sources is newer than the last build.
import fs from 'node:fs';
import path from 'node:path';
import { ROOT } from './paths.mjs';
import { log, run } from './shell.mjs';

const CLIENT_INDEX = path.join(ROOT, 'dist', 'client', 'browser', 'index.html');
const CLIENT_INPUTS = ['src', 'shared', 'angular.json', 'tsconfig.json', 'tsconfig.app.json', 'package-lock.json'];

function newestMtimeMs(target) {
  const stat = fs.statSync(target, { throwIfNoEntry: false });
  if (!stat) return 0;
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of fs.readdirSync(target)) newest = Math.max(newest, newestMtimeMs(path.join(target, entry)));
  return newest;
}

export function buildServer() {
  log('building the server (tsc)');
  run(path.join(ROOT, 'node_modules', '.bin', 'tsc'), ['-p', 'server/tsconfig.json', '--incremental', '--tsBuildInfoFile', 'dist/server/.tsbuildinfo'], { cwd: ROOT });
}

export function clientIsStale() {
  const builtMs = newestMtimeMs(CLIENT_INDEX);
  if (!builtMs) return true;
  return CLIENT_INPUTS.some((input) => newestMtimeMs(path.join(ROOT, input)) > builtMs);
}

export function buildClient({ force = false } = {}) {
  if (!force && !clientIsStale()) return;
  log('building the web client (ng build)');
  run(path.join(ROOT, 'node_modules', '.bin', 'ng'), ['build', '--configuration', 'production'], {
    cwd: ROOT,
    env: { ...process.env, NG_CLI_ANALYTICS: 'false' },
  });
}
