// `npm run migrate`: makes sure PostgreSQL runs and the server is built (as `npm start`
// does), then applies the migrations the database lacks.
import path from 'node:path';
import { ensureNodeModules } from './lib/deps.mjs';
import { stackEnv } from './lib/env.mjs';
import { ROOT } from './lib/paths.mjs';
import { run } from './lib/shell.mjs';

async function main() {
  ensureNodeModules();
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildServer } = await import('./lib/build.mjs');
  const postgres = ensurePostgres();
  try {
    buildServer();
    run(process.execPath, [path.join(ROOT, 'dist', 'server', 'server', 'cli', 'migrate.js')], { cwd: ROOT, env: stackEnv() });
  } finally {
    postgres.stop();
  }
}

main().catch((error) => {
  console.error(`[chillwarden] ${error.message}`);
  process.exit(1);
});
