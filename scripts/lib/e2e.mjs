// The end-to-end stack: a second copy of every service on its own ports, with its own
// freshly seeded database and data folder, so it never touches the `npm start` demo.
import fs from 'node:fs';
import path from 'node:path';
import { stackEnv } from './env.mjs';
import { DATA_DIR, ROOT } from './paths.mjs';
import { ensureDatabase, ensurePostgres, psql } from './postgres.mjs';
import { log, run } from './shell.mjs';
import { startServices } from './supervise.mjs';

export const E2E_PORTS = { http: 4380, mqtt: 1984 };
const E2E_DB = 'chillwarden_e2e';

function freshDatabase() {
  const { binDir } = ensurePostgres();
  psql(binDir, `DROP DATABASE IF EXISTS ${E2E_DB} WITH (FORCE)`);
  ensureDatabase(binDir, E2E_DB);
}

/** Starts the stack, runs `suite(env)`, and stops the stack whatever happens. */
export async function runE2e(suite) {
  const dataDir = path.join(DATA_DIR, 'e2e');
  fs.rmSync(dataDir, { recursive: true, force: true });
  fs.mkdirSync(dataDir, { recursive: true });
  freshDatabase();
  const env = stackEnv({ ports: E2E_PORTS, database: E2E_DB, dataDir, extra: { LOG_LEVEL: 'warn' } });
  log('seeding the end-to-end database');
  run(process.execPath, [path.join(ROOT, 'dist', 'server', 'seeds', 'run.js')], { cwd: ROOT, env });
  const stack = await startServices(env, {});
  try {
    suite({ E2E_BASE_URL: env.PUBLIC_URL, E2E_DATA_DIR: dataDir, E2E_ARTIFACTS: path.join(ROOT, 'spec', 'artifacts') });
  } finally {
    await stack.stop();
  }
}
