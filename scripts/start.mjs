// `npm start`: installs what is missing, starts PostgreSQL, builds, migrates, seeds the
// demo, starts every service and prints where to go. Ctrl-C stops all of it.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { ensureNodeModules } from './lib/deps.mjs';
import { stackEnv } from './lib/env.mjs';
import { ROOT } from './lib/paths.mjs';
import { log, run } from './lib/shell.mjs';

function parseArgs(argv) {
  const speedIndex = argv.indexOf('--speed');
  const speed = speedIndex >= 0 ? Number(argv[speedIndex + 1]) : undefined;
  if (speed !== undefined && !(speed > 0)) throw new Error('--speed takes a positive number, e.g. --speed 60');
  return { calm: argv.includes('--calm'), speed };
}

async function banner(env) {
  const lines = [``, `  Chillwarden is running at ${env.PUBLIC_URL}`, ``];
  try {
    const accounts = await import(pathToFileURL(path.join(ROOT, 'dist', 'server', 'seeds', 'demo-accounts.js')).href);
    const list = accounts.DEMO_ACCOUNTS ?? accounts.default?.DEMO_ACCOUNTS ?? [];
    const emailWidth = Math.max(...list.map((account) => account.email.length));
    const passwordWidth = Math.max(...list.map((account) => account.password.length));
    lines.push('  Demo sign-ins (e-mail, password):');
    for (const account of list) {
      lines.push(`    ${account.role.padEnd(10)} ${account.email.padEnd(emailWidth)}  ${account.password.padEnd(passwordWidth)}  ${account.note ?? ''}`.trimEnd());
    }
    lines.push('');
  } catch {
    // no demo accounts in this build
  }
  lines.push(`  Fake e-mail inbox (invitations, resets, job e-mails): ${env.PUBLIC_URL}/dev/inbox`, `  System status: ${env.PUBLIC_URL}/status`, `  Stop with Ctrl-C.`, ``);
  process.stdout.write(lines.join('\n') + '\n');
}

async function main() {
  const options = parseArgs(process.argv.slice(2));
  ensureNodeModules();
  const { ensurePostgres } = await import('./lib/postgres.mjs');
  const { buildClient, buildServer } = await import('./lib/build.mjs');
  const { startServices } = await import('./lib/supervise.mjs');
  const postgres = ensurePostgres();
  let stack;
  let stopping = false;
  const shutdown = async (code) => {
    if (stopping) return;
    stopping = true;
    log('stopping');
    await stack?.stop();
    postgres.stop();
    process.exit(code);
  };
  process.on('SIGINT', () => void shutdown(0));
  process.on('SIGTERM', () => void shutdown(0));
  process.on('SIGHUP', () => void shutdown(0));
  try {
    buildServer();
    buildClient();
    const env = stackEnv();
    log('migrating and seeding the demo');
    run(process.execPath, [path.join(ROOT, 'dist', 'server', 'seeds', 'run.js')], { cwd: ROOT, env });
    stack = await startServices(env, options);
    await banner(env);
    const name = await stack.exited;
    log(`${name} stopped unexpectedly`);
    await shutdown(1);
  } catch (error) {
    console.error(`[chillwarden] ${error.message}`);
    await shutdown(1);
  }
}

main();
