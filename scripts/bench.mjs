// `npm run bench`: every benchmark in spec/bench/*-bench.ts, one after another, against
// the project's PostgreSQL, after building the client (the bundle benchmark reads it).
// Each prints its own figures; the README records them.
import fs from 'node:fs';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { ensureNodeModules } from './lib/deps.mjs';
import { ROOT, PG_PORT } from './lib/paths.mjs';
import { THROUGHPUT_FLAGS } from './lib/services.mjs';
import { log } from './lib/shell.mjs';

async function main() {
  ensureNodeModules();
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildClient } = await import('./lib/build.mjs');
  const postgres = ensurePostgres();
  let failed = 0;
  try {
    buildClient();
    const only = process.argv.slice(2);
    const benches = fs
      .readdirSync(path.join(ROOT, 'spec', 'bench'))
      .filter((name) => name.endsWith('-bench.ts'))
      .filter((name) => !only.length || only.some((word) => name.includes(word)))
      .sort();
    for (const name of benches) {
      log(`── ${name}`);
      // The same V8 flag the broker and server run with (the ingest benchmark's worker runs in-process).
      const result = spawnSync(process.execPath, [...THROUGHPUT_FLAGS, '--import', 'tsx', path.join('spec', 'bench', name)], {
        cwd: ROOT,
        stdio: 'inherit',
        env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json', NODE_ENV: 'test', LOG_LEVEL: 'silent', TEST_PG_ADMIN_URL: `postgres://postgres@127.0.0.1:${PG_PORT}/postgres` },
      });
      if (result.status !== 0) failed += 1;
    }
  } finally {
    postgres.stop();
  }
  process.exit(failed ? 1 : 0);
}

main();
