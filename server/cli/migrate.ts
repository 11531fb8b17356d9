/**
 * `npm run migrate`: applies the migrations the database lacks (server/migrations) and says
 * which. The server also migrates at start; this is for a deployment step or a developer
 * who wants the schema without starting anything.
 */
import { AppDataSource } from '../data-source';

async function main(): Promise<void> {
  await AppDataSource.initialize();
  try {
    const applied = await AppDataSource.runMigrations({ transaction: 'each' });
    if (applied.length === 0) console.log('[migrate] the database is up to date');
    for (const migration of applied) console.log(`[migrate] applied ${migration.name}`);
  } finally {
    await AppDataSource.destroy();
  }
}

main().catch((error: Error) => {
  console.error(`[migrate] failed: ${error.message}`);
  process.exit(1);
});
