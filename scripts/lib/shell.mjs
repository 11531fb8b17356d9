// Small helpers for the set-up scripts. Plain Node (no npm packages): these run before
// `node_modules` exists.
import { spawn, spawnSync } from 'node:child_process';

export function log(message) {
  process.stdout.write(`[chillwarden] ${message}\n`);
}

/** Runs a command to completion, inheriting stdio; throws on a non-zero exit. */
export function run(command, args, options = {}) {
  const result = spawnSync(command, args, { stdio: 'inherit', ...options });
  if (result.error) throw result.error;
  if (result.status !== 0) {
    throw new Error(`${command} ${args.join(' ')} exited with ${result.status ?? result.signal}`);
  }
  return result;
}

/** Runs a command and returns its trimmed standard output, or null when it fails. */
export function capture(command, args, options = {}) {
  const result = spawnSync(command, args, { encoding: 'utf8', ...options });
  if (result.error || result.status !== 0) return null;
  return result.stdout.trim();
}

export function commandExists(command) {
  return capture('sh', ['-c', `command -v ${command}`]) !== null;
}

/** Starts a long-running child in its own process group so it can be stopped with its children. */
export function startChild(name, command, args, options = {}) {
  const child = spawn(command, args, { stdio: 'inherit', detached: true, ...options });
  child.displayName = name;
  return child;
}

/** Stops a child's whole process group: SIGTERM, then SIGKILL after a grace period. */
export async function stopChild(child, graceMs = 5000) {
  if (child.exitCode !== null || child.signalCode !== null) return;
  const exited = new Promise((resolve) => child.once('exit', resolve));
  signalGroup(child, 'SIGTERM');
  const timer = setTimeout(() => signalGroup(child, 'SIGKILL'), graceMs);
  await exited;
  clearTimeout(timer);
}

function signalGroup(child, signal) {
  try {
    process.kill(-child.pid, signal);
  } catch {
    // the group is already gone
  }
}

let aptUpdated = false;

/** Installs Debian packages (as root) when a needed program is missing. */
export function aptInstall(packages) {
  if (process.getuid?.() !== 0) {
    throw new Error(`missing ${packages.join(', ')}: install them with apt-get (needs root)`);
  }
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  if (!aptUpdated) {
    log('apt-get update');
    run('apt-get', ['update', '-qq'], { env });
    aptUpdated = true;
  }
  log(`apt-get install ${packages.join(' ')}`);
  run('apt-get', ['install', '-y', '-qq', '--no-install-recommends', ...packages], { env });
}
