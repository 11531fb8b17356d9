import 'reflect-metadata';
import { DataSource } from 'typeorm';
import { loadConfig } from '../server/config';
import { dataSourceOptions } from '../server/db/options';
import type { SeedContext } from './context';
import { SEED_STEPS } from './steps';

/**
 * `npm run seed -- [--reset] [--seed N]`: migrates, then writes the demo scenario into an
 * empty database. With --reset it first drops everything. Also called by `npm start`.
 */
interface SeedArgs {
  reset: boolean;
  seed: number;
}

function parseArgs(argv: string[]): SeedArgs {
  const seedIndex = argv.indexOf('--seed');
  const seed = seedIndex >= 0 ? Number(argv[seedIndex + 1]) : 20261201;
  if (!Number.isInteger(seed)) throw new Error('--seed takes a whole number');
  return { reset: argv.includes('--reset'), seed };
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
    nowMs: Date.now(),
    facts: {},
    log: (message) => console.log(`[seed] ${message}`),
  };
  for (const step of SEED_STEPS) {
    context.log(step.name);
    await step.run(context);
  }
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
