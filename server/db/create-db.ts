import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './database';

const INT8_OID = 20;
const NUMERIC_OID = 1700;

// pg returns bigint and numeric as strings to avoid precision loss. Our bigints are byte counts and
// row counts (far below 2^53) and numerics are measurements, so numbers are what the code wants.
pg.types.setTypeParser(INT8_OID, (value) => Number(value));
pg.types.setTypeParser(NUMERIC_OID, (value) => Number.parseFloat(value));

/** Opens a pooled, typed Kysely handle; call `db.destroy()` to close the pool. */
export function createDb(databaseUrl: string, maxConnections = 10): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: databaseUrl, max: maxConnections }) }),
  });
}
