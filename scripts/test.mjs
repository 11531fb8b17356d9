// `npm test`: the same set-up as `npm start`, then every suite in order — type-check,
// server and integration specs, Angular specs, browser end-to-end — and one closing line
// `N passed, N failed` summed over all of them. Exits non-zero when anything failed.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { spawnSync } from 'node:child_process';
import { ensureNodeModules } from './lib/deps.mjs';
import { ROOT } from './lib/paths.mjs';
import { QUIET_SDK_ENV } from './lib/env.mjs';
import { aptInstall, log } from './lib/shell.mjs';

const CHROMIUM = '/usr/bin/chromium';
const results = [];
const summaryDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-test-'));

function ensureChromium() {
  if (!fs.existsSync(CHROMIUM)) aptInstall(['chromium']);
}

/** Runs one suite; its runner writes {passed, failed, skipped} to a summary file. */
function suite(name, command, args, env = {}) {
  log(`── ${name}`);
  const summaryFile = path.join(summaryDir, `${name.replace(/\W+/g, '-')}.json`);
  const startedMs = Date.now();
  const child = spawnSync(command, args, {
    cwd: ROOT,
    stdio: 'inherit',
    env: { ...process.env, JASMINE_SUMMARY_FILE: summaryFile, KARMA_SUMMARY_FILE: summaryFile, ...env },
  });
  const counts = fs.existsSync(summaryFile) ? JSON.parse(fs.readFileSync(summaryFile, 'utf8')) : { passed: 0, failed: 0, skipped: 0 };
  // A runner that crashed before reporting, or exited non-zero with all specs green, still fails.
  if (child.status !== 0 && counts.failed === 0) counts.failed = 1;
  results.push({ name, ...counts, seconds: Math.round((Date.now() - startedMs) / 1000) });
}

/** A check that passes or fails as a whole (a type-check, a build). */
function check(name, command, args, env = {}) {
  log(`── ${name}`);
  const startedMs = Date.now();
  const child = spawnSync(command, args, { cwd: ROOT, stdio: 'inherit', env: { ...process.env, ...env } });
  const ok = child.status === 0;
  results.push({ name, passed: ok ? 1 : 0, failed: ok ? 0 : 1, skipped: 0, seconds: Math.round((Date.now() - startedMs) / 1000) });
  return ok;
}

const bin = (name) => path.join(ROOT, 'node_modules', '.bin', name);
const jasmine = (config) => [
  '--import',
  'tsx',
  path.join(ROOT, 'node_modules', 'jasmine', 'bin', 'jasmine.js'),
  `--config=${config}`,
];

function printSummary() {
  const passed = results.reduce((sum, r) => sum + r.passed, 0);
  const failed = results.reduce((sum, r) => sum + r.failed, 0);
  const skipped = results.reduce((sum, r) => sum + r.skipped, 0);
  process.stdout.write('\n');
  for (const r of results) {
    process.stdout.write(`  ${r.failed ? '✗' : '✓'} ${r.name.padEnd(34)} ${String(r.passed).padStart(4)} passed ${String(r.failed).padStart(3)} failed ${String(r.skipped).padStart(3)} skipped  ${r.seconds} s\n`);
  }
  process.stdout.write(`\n${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}\n`);
  return failed;
}

async function main() {
  ensureNodeModules();
  ensureChromium();
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildClient, buildServer } = await import('./lib/build.mjs');
  const { runE2e } = await import('./lib/e2e.mjs');
  const postgres = ensurePostgres();
  const tsxEnv = { ...QUIET_SDK_ENV, TSX_TSCONFIG_PATH: 'server/tsconfig.json', NODE_ENV: 'test', TEST_PG_ADMIN_URL: `postgres://postgres@127.0.0.1:${process.env.PGPORT_CHILLWARDEN ?? 55432}/postgres` };
  try {
    check('type-check: client', bin('tsc'), ['-p', 'tsconfig.app.json', '--noEmit']);
    check('type-check: client specs', bin('tsc'), ['-p', 'tsconfig.spec.json', '--noEmit']);
    check('type-check: server', bin('tsc'), ['-p', 'server/tsconfig.json', '--noEmit']);
    check('type-check: server specs', bin('tsc'), ['-p', 'spec/tsconfig.json', '--noEmit']);
    suite('server and integration specs', process.execPath, jasmine('spec/support/jasmine.json'), tsxEnv);
    suite('Angular specs (karma)', bin('ng'), ['test', '--watch=false'], { CHROME_BIN: CHROMIUM });
    let built = false;
    try {
      buildServer();
      buildClient();
      built = true;
    } catch (error) {
      log(`build failed: ${error.message}`);
    }
    results.push({ name: 'build', passed: built ? 1 : 0, failed: built ? 0 : 1, skipped: 0, seconds: 0 });
    if (built) await runE2e((env) => suite('browser end-to-end (playwright)', process.execPath, jasmine('spec/e2e/jasmine.json'), { ...tsxEnv, ...env }));
  } finally {
    postgres.stop();
  }
  process.exit(printSummary() ? 1 : 0);
}

main().catch((error) => {
  console.error(`[chillwarden] ${error.stack ?? error.message}`);
  process.exit(1);
});
