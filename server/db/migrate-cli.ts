import { loadConfig } from '../config';
import { createDb } from './create-db';
import { migrateToLatest } from './migrate';

// `npm run migrate`: applies every pending migration to DATABASE_URL and exits non-zero on failure.
async function main(): Promise<void> {
  const config = loadConfig(process.env);
  const db = createDb(config.databaseUrl, 1);
  try {
    const { results } = await migrateToLatest(db);
    for (const result of results ?? []) console.log(`${result.status}: ${result.migrationName}`);
    if (!results || results.length === 0) console.log('The database is already up to date.');
  } finally {
    await db.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(error instanceof Error ? error.message : error);
  process.exit(1);
});
