// `npm run test:e2e [-- --filter=TEXT]`: only the browser suite, on its own stack (ports
// 4380/1984, database chillwarden_e2e, freshly seeded), after building what is stale.
// `npm test` runs the same suite after all the others.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { ensureNodeModules } from './lib/deps.mjs';
import { ROOT } from './lib/paths.mjs';
import { aptInstall } from './lib/shell.mjs';

async function main() {
  ensureNodeModules();
  if (!fs.existsSync('/usr/bin/chromium')) aptInstall(['chromium']);
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildClient, buildServer } = await import('./lib/build.mjs');
  const { runE2e } = await import('./lib/e2e.mjs');
  const postgres = ensurePostgres();
  let status = 1;
  try {
    buildServer();
    buildClient();
    await runE2e((env) => {
      const jasmine = path.join(ROOT, 'node_modules', 'jasmine', 'bin', 'jasmine.js');
      const args = ['--import', 'tsx', jasmine, '--config=spec/e2e/jasmine.json', ...process.argv.slice(2)];
      const run = spawnSync(process.execPath, args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', ...env } });
      status = run.status ?? 1;
    });
  } finally {
    postgres.stop();
  }
  process.exit(status);
}

main().catch((error) => {
  console.error(`[chillwarden] ${error.message}`);
  process.exit(1);
});
