// Installs npm packages when node_modules is missing or older than the lock file.
import fs from 'node:fs';
import path from 'node:path';
import { ROOT } from './paths.mjs';
import { log, run } from './shell.mjs';

export function ensureNodeModules() {
  const marker = path.join(ROOT, 'node_modules', '.package-lock.json');
  const lock = path.join(ROOT, 'package-lock.json');
  const fresh = fs.existsSync(marker) && fs.statSync(marker).mtimeMs >= fs.statSync(lock).mtimeMs;
  if (fresh) return;
  log('installing npm packages (npm ci)');
  run('npm', ['ci', '--no-audit', '--no-fund'], { cwd: ROOT });
}
