import { sql } from 'kysely';
import type { BenchWork, WorkKnot } from '@shared/api/bench-work';
import type { InkLineStatus, PinInput } from '@shared/api/ink-lines';
import type { RegistrationFit } from '@shared/domain/registration';
import type { DbOrTrx } from '../db/database';
import { PG_FOREIGN_KEY_VIOLATION, PG_UNIQUE_VIOLATION, pgConstraint, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP } from '../errors/app-error';
import type { StoredInkLineResult } from './ink-line.table';

function accountGone(): AppError {
  return new AppError(HTTP.unauthorized, 'unauthenticated', 'Your account no longer exists.');
}

export async function insertPinSet(
  db: DbOrTrx,
  pinSet: { scanId: string; createdBy: string; pins: PinInput[]; fit: RegistrationFit },
): Promise<string> {
  try {
    const { id } = await db
      .insertInto('pin_set')
      .values({
        scan_id: pinSet.scanId,
        created_by: pinSet.createdBy,
        pins: JSON.stringify(pinSet.pins),
        model: pinSet.fit.model,
        rms_hpa: pinSet.fit.rmsHpa,
        rms_minutes: pinSet.fit.rmsMinutes,
        fit: JSON.stringify(pinSet.fit),
      })
      .returning('id')
      .executeTakeFirstOrThrow();
    return id;
  } catch (error) {
    // The scan row is locked by the caller, so the only reference that can vanish is the person.
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw accountGone();
    throw error;
  }
}

/** What a hand-in stores on the ink line besides its status. */
export interface HandedInLine {
  pinSetId: string;
  knots: WorkKnot[];
  work: BenchWork;
  result: StoredInkLineResult;
}

/** Inserts a line handed in with no draft before it (version 1). */
export async function insertHandedInLine(
  db: DbOrTrx,
  line: HandedInLine & { scanId: string; authorId: string },
): Promise<{ id: string; version: number; status: InkLineStatus }> {
  return db
    .insertInto('ink_line')
    .values({
      scan_id: line.scanId,
      pin_set_id: line.pinSetId,
      author_id: line.authorId,
      status: 'handed_in',
      knots: JSON.stringify(line.knots),
      work: JSON.stringify(line.work),
      result: JSON.stringify(line.result),
      handed_in_at: new Date(),
    })
    .returning(['id', 'version', 'status'])
    .executeTakeFirstOrThrow();
}

/** Turns the caller's draft into a handed-in line (same row, version + 1). */
export async function handInDraft(db: DbOrTrx, draftId: string, line: HandedInLine): Promise<{ id: string; version: number; status: InkLineStatus }> {
  const now = new Date();
  // A reworked (returned) line keeps its id: its old points go, the caller stores the new ones.
  await db.deleteFrom('series_point').where('ink_line_id', '=', draftId).execute();
  return db
    .updateTable('ink_line')
    .set((eb) => ({
      status: 'handed_in',
      pin_set_id: line.pinSetId,
      knots: JSON.stringify(line.knots),
      work: JSON.stringify(line.work),
      result: JSON.stringify(line.result),
      handed_in_at: now,
      updated_at: now,
      version: eb('version', '+', 1),
    }))
    .where('id', '=', draftId)
    .returning(['id', 'version', 'status'])
    .executeTakeFirstOrThrow();
}

/** The caller's draft on a scan, locked for the rest of the transaction; a reworked line still holds its earlier hand-in. */
export async function findOwnDraftForUpdate(
  db: DbOrTrx,
  scanId: string,
  authorId: string,
): Promise<{ id: string; version: number; pin_set_id: string | null; handed_in_at: Date | null; knots: WorkKnot[]; result: StoredInkLineResult | null } | undefined> {
  return db
    .selectFrom('ink_line')
    .select(['id', 'version', 'pin_set_id', 'handed_in_at', 'knots', 'result'])
    .where('scan_id', '=', scanId)
    .where('author_id', '=', authorId)
    .where('status', '=', 'draft')
    .forUpdate()
    .executeTakeFirst();
}

/** Whether the person has a line on the scan that is handed in or approved (a returned line may be reworked). */
export async function hasHandedIn(db: DbOrTrx, scanId: string, authorId: string): Promise<boolean> {
  const row = await db
    .selectFrom('ink_line')
    .select('id')
    .where('scan_id', '=', scanId)
    .where('author_id', '=', authorId)
    .where('status', 'in', ['handed_in', 'approved'])
    .executeTakeFirst();
  return row !== undefined;
}

/** Inserts a new draft (version 1); undefined when another request created the caller's draft first. */
export async function insertDraft(
  db: DbOrTrx,
  draft: { scanId: string; authorId: string; work: BenchWork },
): Promise<{ id: string; version: number; updatedAt: Date } | undefined> {
  try {
    const row = await db
      .insertInto('ink_line')
      .values({ scan_id: draft.scanId, author_id: draft.authorId, status: 'draft', knots: JSON.stringify([]), work: JSON.stringify(draft.work) })
      .returning(['id', 'version', 'updated_at'])
      .executeTakeFirstOrThrow();
    return { id: row.id, version: row.version, updatedAt: row.updated_at };
  } catch (error) {
    if (pgErrorCode(error) === PG_UNIQUE_VIOLATION && pgConstraint(error) === 'ink_line_one_draft_idx') return undefined;
    if (pgErrorCode(error) === PG_FOREIGN_KEY_VIOLATION) throw accountGone();
    throw error;
  }
}

/** Saves the work over the draft if it is still at `version`; undefined when it is not. */
export async function updateDraftWork(db: DbOrTrx, id: string, version: number, work: BenchWork): Promise<{ version: number; updatedAt: Date } | undefined> {
  const row = await db
    .updateTable('ink_line')
    .set((eb) => ({ work: JSON.stringify(work), updated_at: new Date(), version: eb('version', '+', 1) }))
    .where('id', '=', id)
    .where('version', '=', version)
    .where('status', '=', 'draft')
    .returning(['version', 'updated_at'])
    .executeTakeFirst();
  return row ? { version: row.version, updatedAt: row.updated_at } : undefined;
}

function selectMine(db: DbOrTrx) {
  return db
    .selectFrom('ink_line')
    .leftJoin('pin_set', 'pin_set.id', 'ink_line.pin_set_id')
    .select([
      'ink_line.id',
      'ink_line.scan_id',
      'ink_line.status',
      'ink_line.version',
      'ink_line.work',
      'ink_line.knots',
      'ink_line.result',
      'ink_line.updated_at',
      'ink_line.handed_in_at',
      'pin_set.pins',
    ]);
}

export type MyInkLineRow = Awaited<ReturnType<ReturnType<typeof selectMine>['executeTakeFirstOrThrow']>>;

/** The person's line on a scan: the draft when there is one, else the latest they handed in. */
export async function findMyInkLine(db: DbOrTrx, scanId: string, authorId: string): Promise<MyInkLineRow | undefined> {
  return selectMine(db)
    .where('ink_line.scan_id', '=', scanId)
    .where('ink_line.author_id', '=', authorId)
    .orderBy(sql`ink_line.status = 'draft'`, 'desc')
    .orderBy('ink_line.updated_at', 'desc')
    .executeTakeFirst();
}

/** A page of the person's lines in the given statuses, last touched first. */
export async function listMyInkLines(
  db: DbOrTrx,
  authorId: string,
  query: { statuses: readonly InkLineStatus[]; page: number; pageSize: number },
) {
  const base = db
    .selectFrom('ink_line')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .leftJoin('station', 'station.id', 'scan.station_id')
    .where('ink_line.author_id', '=', authorId)
    .where('ink_line.status', 'in', query.statuses);
  const [rows, { total }] = await Promise.all([
    base
      .select([
        'ink_line.id',
        'ink_line.scan_id',
        'ink_line.status',
        'ink_line.version',
        'ink_line.updated_at',
        'station.name as station_name',
        'scan.chart_start',
        sql<number>`coalesce(jsonb_array_length(ink_line.work -> 'pins'), 0)`.as('pin_count'),
        sql<number>`coalesce(jsonb_array_length(ink_line.work -> 'knots'), jsonb_array_length(ink_line.knots))`.as('knot_count'),
      ])
      .orderBy('ink_line.updated_at', 'desc')
      .orderBy('ink_line.id')
      .limit(query.pageSize)
      .offset(query.page * query.pageSize)
      .execute(),
    base.select((eb) => eb.fn.countAll<number>().as('total')).executeTakeFirstOrThrow(),
  ]);
  return { rows, total: Number(total) };
}
