import type { Selectable, Updateable } from 'kysely';
import type { CandidateDecision, LessonScope, LessonSortKey, ShareLink } from '@shared/api/lessons';
import type { KnotInput } from '@shared/api/ink-lines';
import type { PageQuery } from '@shared/api/paging';
import type { RegistrationFit } from '@shared/domain/registration';
import type { DbOrTrx } from '../db/database';
import type { LessonShareTable, LessonTable, StoredFrontNote, StoredQuestion } from './lesson.table';

/** A lesson row with its station and teacher, as the service reads it. */
export interface LessonRecord {
  id: string;
  ownerId: string;
  ownerName: string;
  stationId: string;
  stationName: string;
  stationCode: string;
  title: string;
  audience: string;
  description: string;
  fromMs: number;
  toMs: number;
  notes: StoredFrontNote[];
  questions: StoredQuestion[];
  candidateDecisions: Record<string, CandidateDecision>;
  copiedFromId: string | null;
  version: number;
  createdAt: Date;
  updatedAt: Date;
}

function selectLessons(db: DbOrTrx) {
  return db
    .selectFrom('lesson')
    .innerJoin('station', 'station.id', 'lesson.station_id')
    .innerJoin('person', 'person.id', 'lesson.owner_id')
    .selectAll('lesson')
    .select(['station.name as station_name', 'station.code as station_code', 'person.display_name as owner_name']);
}

type LessonRow = Selectable<LessonTable> & { station_name: string; station_code: string; owner_name: string };

function toLessonRecord(row: LessonRow): LessonRecord {
  return {
    id: row.id,
    ownerId: row.owner_id,
    ownerName: row.owner_name,
    stationId: row.station_id,
    stationName: row.station_name,
    stationCode: row.station_code,
    title: row.title,
    audience: row.audience,
    description: row.description,
    fromMs: row.passage_from.getTime(),
    toMs: row.passage_to.getTime(),
    notes: row.notes,
    questions: row.questions,
    candidateDecisions: row.candidate_decisions,
    copiedFromId: row.copied_from_id,
    version: row.version,
    createdAt: row.created_at,
    updatedAt: row.updated_at,
  };
}

export interface NewLesson {
  ownerId: string;
  stationId: string;
  title: string;
  audience: string;
  description: string;
  fromMs: number;
  toMs: number;
  notes: StoredFrontNote[];
  questions: StoredQuestion[];
  candidateDecisions: Record<string, CandidateDecision>;
  copiedFromId: string | null;
}

export async function insertLesson(db: DbOrTrx, lesson: NewLesson): Promise<string> {
  const { id } = await db
    .insertInto('lesson')
    .values({
      owner_id: lesson.ownerId,
      station_id: lesson.stationId,
      title: lesson.title,
      audience: lesson.audience,
      description: lesson.description,
      passage_from: new Date(lesson.fromMs),
      passage_to: new Date(lesson.toMs),
      notes: JSON.stringify(lesson.notes),
      questions: JSON.stringify(lesson.questions),
      candidate_decisions: JSON.stringify(lesson.candidateDecisions),
      copied_from_id: lesson.copiedFromId,
    })
    .returning('id')
    .executeTakeFirstOrThrow();
  return id;
}

export async function findLessonById(db: DbOrTrx, lessonId: string): Promise<LessonRecord | undefined> {
  const row = await selectLessons(db).where('lesson.id', '=', lessonId).executeTakeFirst();
  return row ? toLessonRecord(row) : undefined;
}

/** A page of lessons: the person's own, their own with a live share link, or other people's with one. */
export async function listLessons(
  db: DbOrTrx,
  personId: string,
  scope: LessonScope,
  query: PageQuery<LessonSortKey>,
  now: Date,
): Promise<{ items: LessonRecord[]; total: number }> {
  let filtered = selectLessons(db).where('lesson.owner_id', scope === 'others' ? '<>' : '=', personId);
  if (scope !== 'mine') {
    filtered = filtered.where((eb) =>
      eb.exists(
        eb
          .selectFrom('lesson_share')
          .select('lesson_share.id')
          .whereRef('lesson_share.lesson_id', '=', 'lesson.id')
          .where('lesson_share.revoked_at', 'is', null)
          .where((inner) => inner.or([inner('lesson_share.expires_at', 'is', null), inner('lesson_share.expires_at', '>', now)])),
      ),
    );
  }
  const sortColumn = query.sort === 'title' ? 'lesson.title' : 'lesson.updated_at';
  const direction = query.sort === undefined ? 'desc' : query.direction;
  const rows = await filtered
    .orderBy(sortColumn, direction)
    .orderBy('lesson.id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await filtered
    .clearSelect()
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .executeTakeFirstOrThrow();
  return { items: rows.map(toLessonRecord), total: Number(total) };
}

/** Changes the lesson while it is at `version` (and bumps it); false when someone saved it since. */
export async function updateLesson(
  db: DbOrTrx,
  lessonId: string,
  version: number,
  change: Partial<Pick<NewLesson, 'title' | 'audience' | 'description' | 'fromMs' | 'toMs' | 'notes' | 'questions' | 'candidateDecisions'>>,
): Promise<boolean> {
  const columns: Updateable<LessonTable> = { updated_at: new Date() };
  if (change.title !== undefined) columns.title = change.title;
  if (change.audience !== undefined) columns.audience = change.audience;
  if (change.description !== undefined) columns.description = change.description;
  if (change.fromMs !== undefined) columns.passage_from = new Date(change.fromMs);
  if (change.toMs !== undefined) columns.passage_to = new Date(change.toMs);
  if (change.notes !== undefined) columns.notes = JSON.stringify(change.notes);
  if (change.questions !== undefined) columns.questions = JSON.stringify(change.questions);
  if (change.candidateDecisions !== undefined) columns.candidate_decisions = JSON.stringify(change.candidateDecisions);
  const result = await db
    .updateTable('lesson')
    .set((eb) => ({ ...columns, version: eb('version', '+', 1) }))
    .where('id', '=', lessonId)
    .where('version', '=', version)
    .executeTakeFirst();
  return result.numUpdatedRows > 0n;
}

export async function deleteLesson(db: DbOrTrx, lessonId: string, version: number): Promise<boolean> {
  const result = await db.deleteFrom('lesson').where('id', '=', lessonId).where('version', '=', version).executeTakeFirst();
  return result.numDeletedRows > 0n;
}

function toShareLink(row: Selectable<LessonShareTable>, now: Date): ShareLink {
  return {
    id: row.id,
    token: row.token,
    createdAt: row.created_at.toISOString(),
    expiresAt: row.expires_at?.toISOString() ?? null,
    revokedAt: row.revoked_at?.toISOString() ?? null,
    openCount: row.open_count,
    lastOpenedAt: row.last_opened_at?.toISOString() ?? null,
    isLive: row.revoked_at === null && (row.expires_at === null || row.expires_at.getTime() > now.getTime()),
  };
}

export async function insertShare(db: DbOrTrx, share: { lessonId: string; token: string; createdBy: string; expiresAt: Date | null }, now: Date): Promise<ShareLink> {
  const row = await db
    .insertInto('lesson_share')
    .values({ lesson_id: share.lessonId, token: share.token, created_by: share.createdBy, expires_at: share.expiresAt })
    .returningAll()
    .executeTakeFirstOrThrow();
  return toShareLink(row, now);
}

export async function listShares(db: DbOrTrx, lessonId: string, query: PageQuery, now: Date): Promise<{ items: ShareLink[]; total: number }> {
  const rows = await db
    .selectFrom('lesson_share')
    .selectAll()
    .where('lesson_id', '=', lessonId)
    .orderBy('created_at', 'desc')
    .orderBy('id')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('lesson_share')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('lesson_id', '=', lessonId)
    .executeTakeFirstOrThrow();
  return { items: rows.map((row) => toShareLink(row, now)), total: Number(total) };
}

/** The live share links of the given lessons, newest first (at most `perLesson` each), by lesson id. */
export async function findLiveShares(db: DbOrTrx, lessonIds: readonly string[], now: Date): Promise<Map<string, ShareLink[]>> {
  const byLesson = new Map<string, ShareLink[]>();
  if (lessonIds.length === 0) return byLesson;
  const rows = await db
    .selectFrom('lesson_share')
    .selectAll()
    .where('lesson_id', 'in', lessonIds)
    .where('revoked_at', 'is', null)
    .where((eb) => eb.or([eb('expires_at', 'is', null), eb('expires_at', '>', now)]))
    .orderBy('created_at', 'desc')
    .execute();
  for (const row of rows) {
    const list = byLesson.get(row.lesson_id) ?? [];
    list.push(toShareLink(row, now));
    byLesson.set(row.lesson_id, list);
  }
  return byLesson;
}

export async function updateShare(
  db: DbOrTrx,
  lessonId: string,
  shareId: string,
  change: { expiresAt?: Date | null; revokedAt?: Date },
  now: Date,
): Promise<ShareLink | undefined> {
  const columns: Updateable<LessonShareTable> = {};
  if (change.expiresAt !== undefined) columns.expires_at = change.expiresAt;
  if (change.revokedAt !== undefined) columns.revoked_at = change.revokedAt;
  const row = await db
    .updateTable('lesson_share')
    .set(columns)
    .where('id', '=', shareId)
    .where('lesson_id', '=', lessonId)
    .returningAll()
    .executeTakeFirst();
  return row ? toShareLink(row, now) : undefined;
}

/** The lesson id of a live share link with this token, or undefined; `isOpening` counts the opening as well. */
export async function findLiveShareLesson(db: DbOrTrx, token: string, now: Date, isOpening: boolean): Promise<string | undefined> {
  if (isOpening) {
    const row = await db
      .updateTable('lesson_share')
      .set((eb) => ({ open_count: eb('open_count', '+', 1), last_opened_at: now }))
      .where('token', '=', token)
      .where('revoked_at', 'is', null)
      .where((eb) => eb.or([eb('expires_at', 'is', null), eb('expires_at', '>', now)]))
      .returning('lesson_id')
      .executeTakeFirst();
    return row?.lesson_id;
  }
  const row = await db
    .selectFrom('lesson_share')
    .select('lesson_id')
    .where('token', '=', token)
    .where('revoked_at', 'is', null)
    .where((eb) => eb.or([eb('expires_at', 'is', null), eb('expires_at', '>', now)]))
    .executeTakeFirst();
  return row?.lesson_id;
}

/** What a chart region of a lesson is drawn from: one ink line's knots and fit, and its scan. */
export interface ChartSource {
  inkLineId: string;
  scanId: string;
  chartFormId: string;
  /** The instant the fit's hours count from (the scan's chart start). */
  chartStartMs: number;
  widthPx: number;
  heightPx: number;
  knots: KnotInput[];
  fit: RegistrationFit;
}

/** The ink lines' knots, fits and scans, for the ink lines a station series names (its provenance). */
export async function findChartSources(db: DbOrTrx, inkLineIds: readonly string[]): Promise<ChartSource[]> {
  if (inkLineIds.length === 0) return [];
  const rows = await db
    .selectFrom('ink_line')
    .innerJoin('pin_set', 'pin_set.id', 'ink_line.pin_set_id')
    .innerJoin('scan', 'scan.id', 'ink_line.scan_id')
    .select(['ink_line.id', 'ink_line.knots', 'pin_set.fit', 'scan.id as scan_id', 'scan.chart_form_id', 'scan.chart_start', 'scan.width_px', 'scan.height_px'])
    .where('ink_line.id', 'in', inkLineIds)
    .execute();
  return rows.flatMap((row) =>
    row.chart_form_id === null || row.chart_start === null
      ? []
      : [
          {
            inkLineId: row.id,
            scanId: row.scan_id,
            chartFormId: row.chart_form_id,
            chartStartMs: row.chart_start.getTime(),
            widthPx: row.width_px,
            heightPx: row.height_px,
            knots: row.knots,
            fit: row.fit,
          },
        ],
  );
}
