// `npm start`: installs what is missing, starts PostgreSQL, builds, migrates, seeds the
// demo, starts every service and prints where to go. Ctrl-C stops all of it.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { ensureNodeModules } from './lib/deps.mjs';
import { stackEnv } from './lib/env.mjs';
import { ROOT } from './lib/paths.mjs';
import { DEFAULT_STORYLINE_SPEED, STORYLINE_REPLAY_HOURS } from './lib/services.mjs';
import { log, run } from './lib/shell.mjs';

function parseArgs(argv) {
  const speedIndex = argv.indexOf('--speed');
  const speed = speedIndex >= 0 ? Number(argv[speedIndex + 1]) : undefined;
  if (speed !== undefined && !(speed >= 1)) throw new Error('--speed takes a number of at least 1, e.g. --speed 60 (1: real time)');
  return { calm: argv.includes('--calm'), speed };
}

async function importDist(file) {
  return import(pathToFileURL(path.join(ROOT, 'dist', 'server', 'seeds', file)).href);
}

function accountLines(list) {
  const emailWidth = Math.max(...list.map((account) => account.email.length));
  const passwordWidth = Math.max(...list.map((account) => account.password.length));
  const lines = ['  Demo sign-ins (e-mail, password), and what to look at first:'];
  for (const account of list) {
    const who = `${account.role}${account.isAdmin ? ' (admin)' : ''}`;
    lines.push(`    ${who.padEnd(16)} ${account.email.padEnd(emailWidth)}  ${account.password.padEnd(passwordWidth)}`.trimEnd());
    if (account.lookFirst) lines.push(`    ${''.padEnd(16)} → ${account.lookFirst}`);
  }
  return [...lines, ''];
}

/** The storyline in wall-clock minutes after start at this speed (what the visitor can watch). */
function storylineLines(storyline, options) {
  if (options.calm) return ['  Calm run: no scripted faults.', ''];
  const speed = options.speed ?? DEFAULT_STORYLINE_SPEED;
  const lines = [`  The storyline (simulated time at ${speed}×; it catches up with the clock after about ${Math.ceil((STORYLINE_REPLAY_HOURS * 60) / Math.max(1, speed - 1))} min):`];
  const bySeen = [...storyline.STORYLINE].sort((a, b) => a.seenH - b.seenH);
  for (const step of bySeen) lines.push(`    ${`about minute ${Math.max(1, Math.round((step.seenH * 60) / speed))}`.padEnd(17)} ${step.shows}`);
  lines.push('    While the replay catches up, the charts end hours before now; the tiles already count the sensors as heard.', '');
  return lines;
}

async function banner(env, options) {
  const lines = [``, `  Chillwarden is running at ${env.PUBLIC_URL}`, ``];
  try {
    const accounts = await importDist('demo-accounts.js');
    lines.push(...accountLines(accounts.DEMO_ACCOUNTS ?? accounts.default?.DEMO_ACCOUNTS ?? []));
    const storyline = await importDist(path.join('scenario', 'storyline.js'));
    lines.push(...storylineLines(storyline.STORYLINE ? storyline : storyline.default, options));
  } catch {
    // no demo scenario in this build
  }
  lines.push(
    `  Fake e-mail inbox (invitations, resets, job e-mails): ${env.PUBLIC_URL}/dev/inbox`,
    `  System status: ${env.PUBLIC_URL}/status`,
    `  Rebuild the demo from scratch: npm run seed -- --reset   Stop with Ctrl-C.`,
    ``,
  );
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
    await banner(env, options);
    const name = await stack.exited;
    log(`${name} stopped unexpectedly`);
    await shutdown(1);
  } catch (error) {
    console.error(`[chillwarden] ${error.message}`);
    await shutdown(1);
  }
}

main();
