import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import { migrateToLatest } from '../../server/db/migrate';

/** Migrates the API test database (env DATABASE_URL) once before any API spec runs. */
export default async function apiGlobalSetup(): Promise<void> {
  const databaseUrl = process.env['DATABASE_URL'];
  if (!databaseUrl) {
    throw new Error('API tests need DATABASE_URL (a throwaway PostgreSQL database); run them with `npx tsx scripts/test.ts api`.');
  }
  const db = new Kysely<unknown>({ dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl, max: 1 }) }) });
  try {
    await migrateToLatest(db);
  } finally {
    await db.destroy();
  }
}
