import { Kysely, PostgresDialect } from 'kysely';
import pg from 'pg';
import type { Database } from './database';

const INT8_OID = 20;
const NUMERIC_OID = 1700;
const DATE_OID = 1082;

// pg returns bigint and numeric as strings to avoid precision loss. Our bigints are byte counts and
// row counts (far below 2^53) and numerics are measurements, so numbers are what the code wants.
pg.types.setTypeParser(INT8_OID, (value) => Number(value));
pg.types.setTypeParser(NUMERIC_OID, (value) => Number.parseFloat(value));
// A calendar date (an instrument's installed_on) is a day, not an instant: keep it as YYYY-MM-DD, never a local-midnight Date.
pg.types.setTypeParser(DATE_OID, (value) => value);

/**
 * Sort memory per connection. A century of daily buckets with their JSON text (about 6 MB) must sort in memory:
 * at PostgreSQL's 4 MB default it spilled to disk and doubled the query time. Ten connections at 32 MB each
 * stay far below the server's memory.
 */
const WORK_MEM = '32MB';

/** Opens a pooled, typed Kysely handle; call `db.destroy()` to close the pool. */
export function createDb(databaseUrl: string, maxConnections = 10): Kysely<Database> {
  return new Kysely<Database>({
    dialect: new PostgresDialect({
      pool: new pg.Pool({ connectionString: databaseUrl, max: maxConnections, options: `-c work_mem=${WORK_MEM}` }),
    }),
  });
}
