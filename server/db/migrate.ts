import { type Kysely, type MigrationResultSet, Migrator } from 'kysely';
import { MIGRATIONS } from '../../migrations';

/** Brings the schema up to the newest migration; throws (naming the migration) if one fails. */
export async function migrateToLatest<DB>(db: Kysely<DB>): Promise<MigrationResultSet> {
  const migrator = new Migrator({ db, provider: { getMigrations: async () => MIGRATIONS } });
  const resultSet = await migrator.migrateToLatest();
  if (resultSet.error) {
    const failed = resultSet.results?.find((result) => result.status === 'Error');
    const reason = resultSet.error instanceof Error ? resultSet.error.message : String(resultSet.error);
    throw new Error(`Migration ${failed?.migrationName ?? '(unknown)'} failed: ${reason}`, { cause: resultSet.error });
  }
  return resultSet;
}
