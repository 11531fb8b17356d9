import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from '../server/config';
import { dataSourceOptions } from '../server/db/options';
import type { SeedContext } from './context';
import { DEFAULT_SCENARIO_SEED } from './scenario/plan';
import { SEED_STEPS } from './steps';

/**
 * `npm run seed -- [--reset] [--seed N] [--now ISO] [--history-days N]`: migrates, then writes the demo scenario
 * into an empty database. With --reset it first drops everything. Also called by `npm start`.
 * The same seed and "now" write the same rows (device secrets aside, which are random).
 */
export interface SeedArgs {
  reset: boolean;
  seed: number;
  /** The scenario's "now" (default: the clock); the history ends shortly before it. */
  nowMs?: number;
  /** At most this many days of history per appliance (a quick seed); default the scenario's months. */
  historyDays?: number;
}

function valueAfter(argv: string[], flag: string): string | undefined {
  const index = argv.indexOf(flag);
  return index >= 0 ? argv[index + 1] : undefined;
}

export function parseArgs(argv: string[]): SeedArgs {
  const seedText = valueAfter(argv, '--seed');
  const seed = seedText === undefined ? DEFAULT_SCENARIO_SEED : Number(seedText);
  if (!Number.isInteger(seed)) throw new Error('--seed takes a whole number');
  const nowText = valueAfter(argv, '--now');
  const nowMs = nowText === undefined ? undefined : Date.parse(nowText);
  if (nowMs !== undefined && !Number.isFinite(nowMs)) throw new Error('--now takes an ISO 8601 time');
  const daysText = valueAfter(argv, '--history-days');
  const historyDays = daysText === undefined ? undefined : Number(daysText);
  if (historyDays !== undefined && !(historyDays >= 1)) throw new Error('--history-days takes a number of days, at least 1');
  return { reset: argv.includes('--reset'), seed, nowMs, historyDays };
}

async function isEmpty(dataSource: DataSource): Promise<boolean> {
  const [row] = await dataSource.query('SELECT count(*)::int AS n FROM organization');
  return row.n === 0;
}

export async function seedDatabase(dataSource: DataSource, args: SeedArgs, dataDir: string): Promise<boolean> {
  if (args.reset) {
    await dataSource.query('DROP SCHEMA public CASCADE; CREATE SCHEMA public');
  }
  await dataSource.runMigrations({ transaction: 'each' });
  if (!(await isEmpty(dataSource))) return false;
  const context: SeedContext = {
    dataSource,
    seed: args.seed,
    dataDir,
    nowMs: args.nowMs ?? Date.now(),
    historyDays: args.historyDays,
    facts: {},
    log: (message) => console.log(`[seed] ${message}`),
  };
  const startedMs = Date.now();
  for (const step of SEED_STEPS) {
    const stepStartedMs = Date.now();
    await step.run(context);
    context.log(`${step.name} (${((Date.now() - stepStartedMs) / 1000).toFixed(1)} s)`);
  }
  context.log(`seeded in ${((Date.now() - startedMs) / 1000).toFixed(1)} s`);
  return true;
}

async function main(): Promise<void> {
  const config = loadConfig();
  const dataSource = new DataSource(dataSourceOptions(config.databaseUrl));
  await dataSource.initialize();
  try {
    const seeded = await seedDatabase(dataSource, parseArgs(process.argv.slice(2)), config.dataDir);
    console.log(seeded ? '[seed] demo scenario written' : '[seed] database already has data; left as it is (use --reset to rebuild)');
  } finally {
    await dataSource.destroy();
  }
}

if (require.main === module) {
  main().catch((error) => {
    console.error(`[seed] failed: ${(error as Error).message}`);
    process.exit(1);
  });
}
