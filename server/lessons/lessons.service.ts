import { randomBytes, randomUUID } from 'node:crypto';
import {
  type ChartRegion,
  type FrontNote,
  LESSON_CAUTION,
  lessonSourceLine,
  regionOfMark,
  type LessonCreate,
  type LessonDetail,
  type LessonPassage,
  type LessonPatch,
  type LessonScope,
  type LessonSortKey,
  type LessonSummary,
  type SharedLesson,
  type ShareLink,
  type ShareLinkCreate,
  type ShareLinkPatch,
} from '@shared/api/lessons';
import type { Page, PageQuery } from '@shared/api/paging';
import type { ChartForm } from '@shared/domain/chart-form';
import * as chartFormsRepository from '../chart-forms/chart-forms.repository';
import type { Db, DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
import * as seriesService from '../series/series.service';
import * as stationsService from '../stations/stations.service';
import type { StoredFrontNote, StoredQuestion } from './lesson.table';
import { chartRegionsOf, derivedValuesOf, frontCandidatesOf, toPressureSamples } from './lesson-passage';
import * as lessonsRepository from './lessons.repository';
import type { LessonRecord } from './lessons.repository';

/** Who is asking: their id and whether they are an admin (who may change any lesson). */
export interface LessonCaller {
  id: string;
  isAdmin: boolean;
}

function lessonNotFound(): AppError {
  return new AppError(HTTP.notFound, 'lesson_not_found', 'There is no lesson with this id that you may see.');
}

function shareLinkNotFound(): AppError {
  return new AppError(HTTP.notFound, 'share_link_not_found', 'This share link does not exist, has expired or was revoked.');
}

function mayEdit(caller: LessonCaller, lesson: LessonRecord): boolean {
  return caller.isAdmin || lesson.ownerId === caller.id;
}

/**
 * A lesson the caller may see: their own (any lesson for an admin), or another teacher's while it has a live
 * share link (to read and copy). Anything else is 404, so the id of a private lesson says nothing.
 */
async function findVisibleLesson(db: DbOrTrx, caller: LessonCaller, lessonId: string): Promise<LessonRecord> {
  const lesson = await lessonsRepository.findLessonById(db, lessonId);
  if (!lesson) throw lessonNotFound();
  if (mayEdit(caller, lesson)) return lesson;
  const live = await lessonsRepository.findLiveShares(db, [lesson.id], new Date());
  if ((live.get(lesson.id) ?? []).length === 0) throw lessonNotFound();
  return lesson;
}

async function findEditableLesson(db: DbOrTrx, caller: LessonCaller, lessonId: string): Promise<LessonRecord> {
  const lesson = await findVisibleLesson(db, caller, lessonId);
  if (!mayEdit(caller, lesson)) throw new AppError(HTTP.forbidden, 'forbidden', 'Only the teacher who made this lesson may change it; copy it to make your own.');
  return lesson;
}

function withDerived(notes: StoredFrontNote[], passage: LessonPassage | null): FrontNote[] {
  const samples = passage ? toPressureSamples(passage.points) : [];
  return notes
    .slice()
    .sort((a, b) => Date.parse(a.time) - Date.parse(b.time))
    .map((note) => ({ ...note, derived: note.showDerived && passage ? derivedValuesOf(samples, note) : null }));
}

function toDetail(lesson: LessonRecord, caller: LessonCaller, passage: LessonPassage | null): LessonDetail {
  return {
    id: lesson.id,
    title: lesson.title,
    audience: lesson.audience,
    description: lesson.description,
    stationId: lesson.stationId,
    stationName: lesson.stationName,
    stationCode: lesson.stationCode,
    from: new Date(lesson.fromMs).toISOString(),
    to: new Date(lesson.toMs).toISOString(),
    ownerId: lesson.ownerId,
    ownerName: lesson.ownerName,
    copiedFromId: lesson.copiedFromId,
    notes: withDerived(lesson.notes, passage),
    questions: lesson.questions,
    candidateDecisions: lesson.candidateDecisions,
    isEditable: mayEdit(caller, lesson),
    createdAt: lesson.createdAt.toISOString(),
    updatedAt: lesson.updatedAt.toISOString(),
    version: lesson.version,
  };
}

function toSummary(lesson: LessonRecord, liveShares: ShareLink[], isSharedList: boolean): LessonSummary {
  return {
    id: lesson.id,
    title: lesson.title,
    audience: lesson.audience,
    stationId: lesson.stationId,
    stationName: lesson.stationName,
    from: new Date(lesson.fromMs).toISOString(),
    to: new Date(lesson.toMs).toISOString(),
    ownerId: lesson.ownerId,
    ownerName: lesson.ownerName,
    noteCount: lesson.notes.length,
    questionCount: lesson.questions.length,
    liveShares: isSharedList ? liveShares : [],
    liveShareCount: liveShares.length,
    updatedAt: lesson.updatedAt.toISOString(),
    version: lesson.version,
  };
}

/**
 * The passage of a lesson: the station series through the series service (so only the ink lines it admits
 * reach a lesson), the front candidates in it and the regions of the scans its points came from.
 */
async function buildPassage(db: Db, lesson: LessonRecord, imagePath: (index: number) => string): Promise<LessonPassage> {
  const series = await seriesService.getSeries(db, { stationId: lesson.stationId, fromMs: lesson.fromMs, toMs: lesson.toMs });
  const inkLineIds = [...new Set(series.points.map((point) => point.inkLineId))];
  const sources = await lessonsRepository.findChartSources(db, inkLineIds);
  const forms = new Map<string, ChartForm>();
  for (const formId of new Set(sources.map((source) => source.chartFormId))) {
    const form = await chartFormsRepository.findChartFormById(db, formId);
    if (form) forms.set(formId, form);
  }
  return {
    points: series.points,
    truncated: series.truncated,
    regions: chartRegionsOf(sources, forms, lesson.fromMs, lesson.toMs, imagePath),
    candidates: frontCandidatesOf(series.points),
  };
}

export const teacherRegionPath = (lessonId: string, index: number) => `/api/lessons/${encodeURIComponent(lessonId)}/regions/${index}/image.jpg`;
export const sharedRegionPath = (token: string, index: number) => `/api/shared/${encodeURIComponent(token)}/regions/${index}/image.jpg`;

export async function listLessons(
  db: Db,
  caller: LessonCaller,
  scope: LessonScope,
  query: PageQuery<LessonSortKey>,
): Promise<Page<LessonSummary>> {
  const now = new Date();
  const { items, total } = await lessonsRepository.listLessons(db, caller.id, scope, query, now);
  const shares = await lessonsRepository.findLiveShares(
    db,
    items.map((lesson) => lesson.id),
    now,
  );
  return {
    items: items.map((lesson) => toSummary(lesson, shares.get(lesson.id) ?? [], scope === 'shared')),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

export async function createLesson(db: Db, caller: LessonCaller, input: LessonCreate): Promise<LessonDetail> {
  await stationsService.getStation(db, input.stationId);
  const id = await lessonsRepository.insertLesson(db, {
    ownerId: caller.id,
    stationId: input.stationId,
    title: input.title,
    audience: input.audience,
    description: input.description,
    fromMs: Date.parse(input.from),
    toMs: Date.parse(input.to),
    notes: [],
    questions: [],
    candidateDecisions: {},
    copiedFromId: null,
  });
  return getLesson(db, caller, id);
}

export async function getLesson(db: Db, caller: LessonCaller, lessonId: string): Promise<LessonDetail> {
  const lesson = await findVisibleLesson(db, caller, lessonId);
  const passage = lesson.notes.some((note) => note.showDerived) ? await buildPassage(db, lesson, (index) => teacherRegionPath(lesson.id, index)) : null;
  return toDetail(lesson, caller, passage);
}

export async function getPassage(db: Db, caller: LessonCaller, lessonId: string): Promise<LessonPassage> {
  const lesson = await findVisibleLesson(db, caller, lessonId);
  return buildPassage(db, lesson, (index) => teacherRegionPath(lesson.id, index));
}

/** Keeps each note's and question's id, or gives a new one (the client may send none for a new item). */
function withIds<T extends { id?: string }>(items: T[]): (T & { id: string })[] {
  const seen = new Set<string>();
  return items.map((item) => {
    const id = item.id && !seen.has(item.id) ? item.id : randomUUID();
    seen.add(id);
    return { ...item, id };
  });
}

export async function updateLesson(db: Db, caller: LessonCaller, lessonId: string, patch: LessonPatch): Promise<LessonDetail> {
  await db.transaction().execute(async (trx) => {
    const lesson = await findEditableLesson(trx, caller, lessonId);
    if (lesson.version !== patch.version) throw versionConflict('lesson', lesson.version);
    const notes: StoredFrontNote[] | undefined = patch.notes && withIds(patch.notes);
    const questions: StoredQuestion[] | undefined = patch.questions && withIds(patch.questions);
    const isUpdated = await lessonsRepository.updateLesson(trx, lessonId, patch.version, {
      title: patch.title,
      audience: patch.audience,
      description: patch.description,
      fromMs: patch.from === undefined ? undefined : Date.parse(patch.from),
      toMs: patch.to === undefined ? undefined : Date.parse(patch.to),
      notes,
      questions,
      candidateDecisions: patch.candidateDecisions,
    });
    if (!isUpdated) {
      const current = await lessonsRepository.findLessonById(trx, lessonId);
      throw versionConflict('lesson', current?.version ?? patch.version);
    }
  });
  return getLesson(db, caller, lessonId);
}

export async function deleteLesson(db: Db, caller: LessonCaller, lessonId: string, version: number): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const lesson = await findEditableLesson(trx, caller, lessonId);
    if (lesson.version !== version || !(await lessonsRepository.deleteLesson(trx, lessonId, version))) throw versionConflict('lesson', lesson.version);
  });
}

/** A copy owned by the caller: the same passage, notes and questions (new ids), with no share links. */
export async function copyLesson(db: Db, caller: LessonCaller, lessonId: string): Promise<LessonDetail> {
  const source = await findVisibleLesson(db, caller, lessonId);
  const id = await lessonsRepository.insertLesson(db, {
    ownerId: caller.id,
    stationId: source.stationId,
    title: `${source.title} (copy)`.slice(0, 200),
    audience: source.audience,
    description: source.description,
    fromMs: source.fromMs,
    toMs: source.toMs,
    notes: source.notes.map((note) => ({ ...note, id: randomUUID() })),
    questions: source.questions.map((question) => ({ ...question, id: randomUUID() })),
    candidateDecisions: source.candidateDecisions,
    copiedFromId: source.id,
  });
  return getLesson(db, caller, id);
}

export async function listShares(db: Db, caller: LessonCaller, lessonId: string, query: PageQuery): Promise<Page<ShareLink>> {
  await findEditableLesson(db, caller, lessonId);
  const { items, total } = await lessonsRepository.listShares(db, lessonId, query, new Date());
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** 32 random bytes, base64url: 256 bits, far beyond guessing. */
function newShareToken(): string {
  return randomBytes(32).toString('base64url');
}

export async function createShare(db: Db, caller: LessonCaller, lessonId: string, input: ShareLinkCreate): Promise<ShareLink> {
  await findEditableLesson(db, caller, lessonId);
  const now = new Date();
  const expiresAt = input.expiresAt === null ? null : new Date(input.expiresAt);
  if (expiresAt && expiresAt.getTime() <= now.getTime()) {
    throw new AppError(HTTP.badRequest, 'validation_failed', 'The expiry must be in the future.', { expiresAt: 'expiresAt must be in the future' });
  }
  return lessonsRepository.insertShare(db, { lessonId, token: newShareToken(), createdBy: caller.id, expiresAt }, now);
}

export async function updateShare(db: Db, caller: LessonCaller, lessonId: string, shareId: string, patch: ShareLinkPatch): Promise<ShareLink> {
  await findEditableLesson(db, caller, lessonId);
  const now = new Date();
  const share = await lessonsRepository.updateShare(
    db,
    lessonId,
    shareId,
    {
      expiresAt: patch.expiresAt === undefined ? undefined : patch.expiresAt === null ? null : new Date(patch.expiresAt),
      revokedAt: patch.revoked ? now : undefined,
    },
    now,
  );
  if (!share) throw shareLinkNotFound();
  return share;
}

/** The lesson behind a live share link, or 404 share_link_not_found (unknown, expired and revoked alike). */
async function findSharedLesson(db: Db, token: string, isOpening: boolean): Promise<LessonRecord> {
  const lessonId = await lessonsRepository.findLiveShareLesson(db, token, new Date(), isOpening);
  const lesson = lessonId ? await lessonsRepository.findLessonById(db, lessonId) : undefined;
  if (!lesson) throw shareLinkNotFound();
  return lesson;
}

/** What the share page shows; counts one opening of the link. Names no scan, person or other record. */
export async function openSharedLesson(db: Db, token: string): Promise<SharedLesson> {
  const lesson = await findSharedLesson(db, token, true);
  const passage = await buildPassage(db, lesson, (index) => sharedRegionPath(token, index));
  const notes = withDerived(lesson.notes, passage).map((note) => {
    if (!note.mark) return { ...note, mark: null };
    const region = regionOfMark(passage.regions, note.mark);
    const { scanId: _scanId, ...mark } = note.mark;
    return { ...note, mark: region ? { ...mark, regionIndex: region.index } : null };
  });
  return {
    title: lesson.title,
    audience: lesson.audience,
    description: lesson.description,
    stationName: lesson.stationName,
    from: new Date(lesson.fromMs).toISOString(),
    to: new Date(lesson.toMs).toISOString(),
    notes,
    questions: lesson.questions,
    passage: { ...passage, regions: passage.regions.map(({ scanId: _scanId, ...region }) => region) },
    caution: LESSON_CAUTION,
    source: lessonSourceLine(lesson.stationName, lesson.stationCode, lesson.ownerName),
  };
}

/** The scan and IIIF region of one chart region of a lesson, as the image routes need it. */
export interface RegionImage {
  scanId: string;
  region: ChartRegion['region'];
}

function regionAt(passage: LessonPassage, index: number): RegionImage {
  const region = passage.regions[index];
  if (!region || !region.scanId) throw new AppError(HTTP.notFound, 'not_found', 'This lesson has no chart region with this number.');
  return { scanId: region.scanId, region: region.region };
}

export async function findTeacherRegion(db: Db, caller: LessonCaller, lessonId: string, index: number): Promise<RegionImage> {
  return regionAt(await getPassage(db, caller, lessonId), index);
}

/** A region of the shared lesson only: the link reaches no other scan. */
export async function findSharedRegion(db: Db, token: string, index: number): Promise<RegionImage> {
  const lesson = await findSharedLesson(db, token, false);
  return regionAt(await buildPassage(db, lesson, (i) => sharedRegionPath(token, i)), index);
}
