// `npm run seed -- [--reset] [--seed N] [--now ISO] [--history-days N]`: makes sure PostgreSQL
// runs and the server is built (as `npm start` does), then migrates and writes the demo
// scenario (seeds/run.ts). --reset rebuilds the demo database from scratch.
import path from 'node:path';
import { ensureNodeModules } from './lib/deps.mjs';
import { stackEnv } from './lib/env.mjs';
import { ROOT } from './lib/paths.mjs';
import { log, run } from './lib/shell.mjs';

async function main() {
  ensureNodeModules();
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildServer } = await import('./lib/build.mjs');
  const postgres = ensurePostgres();
  try {
    buildServer();
    log('migrating and seeding the demo');
    run(process.execPath, [path.join(ROOT, 'dist', 'server', 'seeds', 'run.js'), ...process.argv.slice(2)], { cwd: ROOT, env: stackEnv() });
  } finally {
    postgres.stop();
  }
}

main().catch((error) => {
  console.error(`[chillwarden] ${error.message}`);
  process.exit(1);
});
