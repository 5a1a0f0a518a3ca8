/**
 * What the database benchmarks (`bench:catalogue`, `bench:series`) share: a throwaway migrated cluster,
 * repeated warm timings, PostgreSQL's own execution time of a query, and the printed table.
 */
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { CompiledQuery, type Compilable } from 'kysely';
import { createDb } from '../../server/db/create-db';
import type { Db } from '../../server/db/database';
import { migrateToLatest } from '../../server/db/migrate';
import { findFreePort } from './free-port';
import { LocalPostgres } from './local-postgres';

/** Runs `body` against a freshly migrated database in a cluster of its own, removed afterwards. */
export async function withBenchDatabase(name: string, body: (db: Db) => Promise<void>): Promise<void> {
  const workDir = mkdtempSync(join(tmpdir(), `isallo-bench-${name}-`));
  // The postgres account runs the cluster and must be able to enter the folder.
  chmodSync(workDir, 0o755);
  const postgres = new LocalPostgres(join(workDir, 'pg'), await findFreePort());
  let db: Db | undefined;
  try {
    await postgres.start();
    await postgres.ensureDatabase('bench');
    db = createDb(postgres.url('bench'), 4);
    await migrateToLatest(db);
    await body(db);
  } finally {
    await db?.destroy();
    await postgres.remove();
    rmSync(workDir, { recursive: true, force: true });
  }
}

/** The value below which `share` of the values lie (nearest rank). */
export function percentile(values: number[], share: number): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(share * sorted.length) - 1))];
}

/** Milliseconds of each of `runs` calls of `run`, after `warmUps` calls that are not counted. */
export async function timeRuns(run: () => Promise<unknown>, warmUps: number, runs: number): Promise<number[]> {
  for (let i = 0; i < warmUps; i++) await run();
  const times: number[] = [];
  for (let i = 0; i < runs; i++) {
    const started = process.hrtime.bigint();
    await run();
    times.push(Number(process.hrtime.bigint() - started) / 1e6);
  }
  return times;
}

function compiledOf(query: Compilable | CompiledQuery): CompiledQuery {
  return 'compile' in query ? query.compile() : query;
}

/** PostgreSQL's execution time of the query, from EXPLAIN ANALYZE. */
export async function explainMs(db: Db, query: Compilable | CompiledQuery): Promise<number> {
  const compiled = compiledOf(query);
  const result = await db.executeQuery<{ 'QUERY PLAN': { 'Execution Time': number }[] }>(
    CompiledQuery.raw(`explain (analyze, format json) ${compiled.sql}`, [...compiled.parameters]),
  );
  return result.rows[0]['QUERY PLAN'][0]['Execution Time'];
}

/** PostgreSQL's plan of the query as text, for rows over their bar. */
export async function explainText(db: Db, query: Compilable | CompiledQuery): Promise<string> {
  const compiled = compiledOf(query);
  const result = await db.executeQuery<{ 'QUERY PLAN': string }>(CompiledQuery.raw(`explain (analyze) ${compiled.sql}`, [...compiled.parameters]));
  return result.rows.map((row) => row['QUERY PLAN']).join('\n');
}

/** Prints a table with the first column left-aligned and the others right-aligned, as the README shows them. */
export function printTable(header: string[], rows: string[][]): void {
  const widths = header.map((title, i) => Math.max(title.length, ...rows.map((row) => row[i].length)));
  const line = (cells: string[]) => cells.map((cell, i) => (i === 0 ? cell.padEnd(widths[i]) : cell.padStart(widths[i]))).join('  ');
  console.log(line(header));
  console.log(widths.map((width) => '-'.repeat(width)).join('  '));
  for (const row of rows) console.log(line(row));
}

/** Runs a benchmark's main and exits non-zero with the stack when it throws. */
export function runBenchmark(main: () => Promise<void>): void {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.stack : error);
    process.exit(1);
  });
}
