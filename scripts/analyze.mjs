// `npm run --silent analyze -- FILE.csv [--style STYLE]`: the logger-file analysis from the
// compiled server (tsx's start-up cost a second of a year-long file's budget). Rebuilds the
// server first when a source is newer than the build; build output goes to stderr so that
// stdout carries only the JSON document.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { ROOT } from './lib/paths.mjs';

const COMPILED = path.join(ROOT, 'dist', 'server', 'server', 'cli', 'analyze.js');
const SOURCES = ['server', 'shared', 'broker', 'simulator', 'seeds'].map((folder) => path.join(ROOT, folder));

function newestMtimeMs(target) {
  const stat = fs.statSync(target, { throwIfNoEntry: false });
  if (!stat) return 0;
  if (!stat.isDirectory()) return target.endsWith('.ts') ? stat.mtimeMs : 0;
  let newest = 0;
  for (const entry of fs.readdirSync(target)) newest = Math.max(newest, newestMtimeMs(path.join(target, entry)));
  return newest;
}

function ensureBuilt() {
  const builtMs = fs.statSync(COMPILED, { throwIfNoEntry: false })?.mtimeMs ?? 0;
  if (builtMs && SOURCES.every((source) => newestMtimeMs(source) <= builtMs)) return;
  process.stderr.write('[chillwarden] building the server (tsc) first\n');
  const tsc = path.join(ROOT, 'node_modules', '.bin', 'tsc');
  const built = spawnSync(tsc, ['-p', 'server/tsconfig.json', '--incremental', '--tsBuildInfoFile', 'dist/server/.tsbuildinfo'], { cwd: ROOT, stdio: ['ignore', process.stderr, process.stderr] });
  if (built.status !== 0) {
    process.stderr.write('analyze: the server does not build; see the errors above\n');
    process.exit(2);
  }
  // tsc leaves an unchanged output file alone: mark the build as current.
  const now = new Date();
  fs.utimesSync(COMPILED, now, now);
}

ensureBuilt();
const result = spawnSync(process.execPath, [COMPILED, ...process.argv.slice(2)], { stdio: 'inherit' });
process.exit(result.status ?? 1);
