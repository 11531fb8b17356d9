// A private PostgreSQL cluster for the project: installed from Debian when missing,
// created under .data/postgres on first run, listening on 127.0.0.1 and a project port
// with its unix socket inside the data folder. Idempotent: a running cluster is reused.
import fs from 'node:fs';
import path from 'node:path';
import { APP_DB, PG_DIR, PG_LOG, PG_PORT, PG_SOCKET_DIR, DATA_DIR } from './paths.mjs';
import { aptInstall, capture, log, run } from './shell.mjs';

const PG_ROOT = '/usr/lib/postgresql';

function findBinDir() {
  if (!fs.existsSync(PG_ROOT)) return null;
  const versions = fs
    .readdirSync(PG_ROOT)
    .filter((name) => fs.existsSync(path.join(PG_ROOT, name, 'bin', 'initdb')))
    .sort((a, b) => Number(b) - Number(a));
  return versions.length ? path.join(PG_ROOT, versions[0], 'bin') : null;
}

function ensureInstalled() {
  let binDir = findBinDir();
  if (!binDir) {
    aptInstall(['postgresql']);
    binDir = findBinDir();
  }
  if (!binDir) throw new Error(`PostgreSQL binaries not found under ${PG_ROOT}`);
  return binDir;
}

const isRoot = () => process.getuid?.() === 0;

/** initdb and postgres refuse to run as root: run them as the `postgres` system user. */
function asServerUser(command, args, options = {}) {
  return isRoot() ? ['runuser', ['-u', 'postgres', '--', command, ...args], options] : [command, args, options];
}

function runAsServerUser(command, args, options) {
  return run(...asServerUser(command, args, options));
}

/** The server user must be able to reach the data folder; a private clone folder (mode 700) blocks it. */
function grantTraversal(dir) {
  if (!isRoot()) return;
  for (let current = path.dirname(dir); current !== path.dirname(current); current = path.dirname(current)) {
    const mode = fs.statSync(current).mode;
    if ((mode & 0o001) === 0) {
      log(`allowing the postgres user to traverse ${current} (o+x)`);
      fs.chmodSync(current, mode | 0o001);
    }
  }
}

function ownedDir(dir, mode) {
  fs.mkdirSync(dir, { recursive: true, mode });
  fs.chmodSync(dir, mode);
  if (isRoot()) run('chown', ['postgres:postgres', dir]);
}

function ensureCluster(binDir) {
  fs.mkdirSync(DATA_DIR, { recursive: true });
  grantTraversal(PG_DIR);
  ownedDir(PG_SOCKET_DIR, 0o700);
  if (fs.existsSync(path.join(PG_DIR, 'PG_VERSION'))) return;
  ownedDir(PG_DIR, 0o700);
  log(`creating a PostgreSQL cluster in ${PG_DIR}`);
  runAsServerUser(path.join(binDir, 'initdb'), ['-D', PG_DIR, '-U', 'postgres', '--auth=trust', '-E', 'UTF8', '--locale=C.UTF-8'], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

function isRunning(binDir) {
  const [command, args] = asServerUser(path.join(binDir, 'pg_ctl'), ['-D', PG_DIR, 'status']);
  return capture(command, args) !== null;
}

function startServer(binDir) {
  if (isRoot()) {
    fs.writeFileSync(PG_LOG, '', { flag: 'a' });
    run('chown', ['postgres:postgres', PG_LOG]);
  }
  const options = `-p ${PG_PORT} -k ${PG_SOCKET_DIR} -c listen_addresses=127.0.0.1 -c max_connections=200 -c fsync=${process.env.CI ? 'off' : 'on'}`;
  log(`starting PostgreSQL on 127.0.0.1:${PG_PORT}`);
  runAsServerUser(path.join(binDir, 'pg_ctl'), ['-D', PG_DIR, '-l', PG_LOG, '-w', '-t', '60', '-o', options, 'start'], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
}

export function psql(binDir, sql, database = 'postgres') {
  const args = ['-h', PG_SOCKET_DIR, '-p', String(PG_PORT), '-U', 'postgres', '-d', database, '-v', 'ON_ERROR_STOP=1', '-tAc', sql];
  return capture(path.join(binDir, 'psql'), args);
}

export function ensureDatabase(binDir, name) {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`bad database name ${name}`);
  if (psql(binDir, `SELECT 1 FROM pg_database WHERE datname = '${name}'`) === '1') return;
  log(`creating database ${name}`);
  if (psql(binDir, `CREATE DATABASE ${name}`) === null) throw new Error(`could not create database ${name}`);
}

/**
 * Ensures the cluster runs and the app database exists. Returns a handle whose stop()
 * stops the server only when this call started it.
 */
export function ensurePostgres() {
  const binDir = ensureInstalled();
  ensureCluster(binDir);
  const startedHere = !isRunning(binDir);
  if (startedHere) startServer(binDir);
  ensureDatabase(binDir, APP_DB);
  return {
    binDir,
    startedHere,
    stop() {
      if (!startedHere) return;
      log('stopping PostgreSQL');
      runAsServerUser(path.join(binDir, 'pg_ctl'), ['-D', PG_DIR, '-m', 'fast', '-w', 'stop'], { stdio: ['ignore', 'ignore', 'inherit'] });
    },
  };
}
