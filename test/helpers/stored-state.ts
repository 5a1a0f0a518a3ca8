import { sql } from 'kysely';
import type { Db } from '../../server/db/database';

/** Every row of every table of the app, as text, by table: what a refused call must leave as it found. */
export type StoredState = Map<string, Set<string>>;

/** Reads every row of every public table (and the derivative job queue) as its row text. */
export async function readStoredState(db: Db): Promise<StoredState> {
  const { rows: tables } = await sql<{ name: string }>`
    select table_schema || '.' || table_name as name from information_schema.tables
    where table_type = 'BASE TABLE' and (table_schema = 'public' or (table_schema = 'pgboss' and table_name = 'job'))
      and table_name not like 'kysely_migration%'
    order by 1`.execute(db);
  const state: StoredState = new Map();
  for (const { name } of tables) {
    const { rows } = await sql<{ row: string }>`select t::text as row from ${sql.table(name)} t`.execute(db);
    state.set(name, new Set(rows.map((entry) => entry.row)));
  }
  return state;
}

/**
 * What changed between two reads: rows that were changed or removed in any table, and rows added to tables
 * other than `mayGrow` (those a test's own arrangement adds to just before its call). Empty when nothing did.
 */
export function storedChanges(before: StoredState, after: StoredState, mayGrow: readonly string[] = []): string[] {
  const changes: string[] = [];
  for (const [table, rows] of before) {
    const now = after.get(table) ?? new Set<string>();
    for (const row of rows) if (!now.has(row)) changes.push(`${table}: changed or removed ${row}`);
    if (mayGrow.includes(table.replace(/^public\./, ''))) continue;
    for (const row of now) if (!rows.has(row)) changes.push(`${table}: added ${row}`);
  }
  return changes;
}
