import { type Request, type RequestHandler, type Response, Router } from 'express';
import {
  LESSON_SCOPES,
  LESSON_SORT_KEYS,
  type LessonDetail,
  type LessonPassage,
  type LessonScope,
  type LessonSummary,
  parseLessonCreate,
  parseLessonPatch,
  parseShareLinkCreate,
  parseShareLinkPatch,
  type SharedLesson,
  type ShareLink,
} from '@shared/api/lessons';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { valueOrThrow } from '../http/parse-body';
import { isUuid, readPageQuery, refuseUnknownQuery } from '../http/parse-query';
import * as iiifService from '../iiif/iiif.service';
import type { ImageRendering } from '../iiif/iiif.service';
import { sendImage } from '../iiif/image-rendering';
import type { Db } from '../db/database';
import type { Storage } from '../storage/storage';
import { sharedLinkLimit } from '../http/rate-limits';
import { MAX_CHART_REGIONS, regionImageSize } from './lesson-passage';
import * as lessonsService from './lessons.service';
import type { LessonCaller, RegionImage } from './lessons.service';
import { ANNOTATION_MEDIA_TYPE, buildAnnotationCollection } from './web-annotation';

const NO_CONTENT = 204;

function caller(req: Request): LessonCaller {
  const person = signedInPerson(req.user);
  return { id: person.id, isAdmin: person.roles.includes('admin') };
}

function lessonId(value: unknown): string {
  if (!isUuid(value)) throw new AppError(HTTP.notFound, 'lesson_not_found', 'There is no lesson with this id that you may see.');
  return value;
}

function shareToken(value: unknown): string {
  if (typeof value !== 'string' || !/^[A-Za-z0-9_-]{20,100}$/.test(value)) {
    throw new AppError(HTTP.notFound, 'share_link_not_found', 'This share link does not exist, has expired or was revoked.');
  }
  return value;
}

function regionIndex(value: unknown): number {
  const index = typeof value === 'string' && /^\d{1,3}$/.test(value) ? Number(value) : -1;
  if (index < 0 || index >= MAX_CHART_REGIONS) throw new AppError(HTTP.notFound, 'not_found', 'This lesson has no chart region with this number.');
  return index;
}

function readScope(query: Record<string, unknown>): LessonScope {
  const scope = query['scope'] ?? 'mine';
  if (typeof scope !== 'string' || !(LESSON_SCOPES as readonly string[]).includes(scope)) {
    throw validationFailed({ scope: `scope must be one of: ${LESSON_SCOPES.join(', ')}` }, 'The lesson list parameters are invalid.');
  }
  return scope as LessonScope;
}

function readVersion(query: Record<string, unknown>): number {
  refuseUnknownQuery(query, ['version']);
  const version = Number(query['version']);
  if (typeof query['version'] !== 'string' || !Number.isInteger(version) || version < 1) {
    throw validationFailed({ version: 'version must be the whole number read with the lesson' });
  }
  return version;
}


/** Sends a region's JPEG through the server's IIIF image code (cached and tiled as any IIIF answer). */
async function sendRegionImage(db: Db, storage: Storage, rendering: ImageRendering, res: Response, image: RegionImage, cacheControl: string): Promise<void> {
  const { xPx, yPx, widthPx, heightPx } = image.region;
  const answer = await iiifService.getImage(db, storage, rendering, image.scanId, {
    region: `${xPx},${yPx},${widthPx},${heightPx}`,
    size: regionImageSize(image.region),
    rotation: '0',
    qualityAndFormat: 'default.jpg',
  });
  sendImage(res, answer, cacheControl);
}

/** Mounted at /api/lessons behind authenticate: teachers build lessons, admins may change any. */
export function lessonsRoutes({ db, storage, config }: AppDeps, rendering: ImageRendering): Router {
  const router = Router();
  router.use(requireRoles('teacher', 'admin'));

  router.get('/', async (req, res: Response<Page<LessonSummary>>) => {
    res.json(await lessonsService.listLessons(db, caller(req), readScope(req.query), readPageQuery(req.query, LESSON_SORT_KEYS, ['scope'])));
  });
  router.post('/', async (req, res: Response<LessonDetail>) => {
    const input = valueOrThrow(parseLessonCreate(req.body), 'The lesson has invalid fields.');
    res.status(HTTP.created).json(await lessonsService.createLesson(db, caller(req), input));
  });
  router.get('/:lessonId', async (req, res: Response<LessonDetail>) => {
    res.json(await lessonsService.getLesson(db, caller(req), lessonId(req.params.lessonId)));
  });
  router.patch('/:lessonId', async (req, res: Response<LessonDetail>) => {
    const patch = valueOrThrow(parseLessonPatch(req.body), 'The lesson has invalid fields.');
    res.json(await lessonsService.updateLesson(db, caller(req), lessonId(req.params.lessonId), patch));
  });
  router.delete('/:lessonId', async (req, res) => {
    await lessonsService.deleteLesson(db, caller(req), lessonId(req.params.lessonId), readVersion(req.query));
    res.status(NO_CONTENT).end();
  });
  router.post('/:lessonId/copy', async (req, res: Response<LessonDetail>) => {
    res.status(HTTP.created).json(await lessonsService.copyLesson(db, caller(req), lessonId(req.params.lessonId)));
  });
  router.get('/:lessonId/passage', async (req, res: Response<LessonPassage>) => {
    res.json(await lessonsService.getPassage(db, caller(req), lessonId(req.params.lessonId)));
  });
  router.get('/:lessonId/regions/:index/image.jpg', async (req, res) => {
    const image = await lessonsService.findTeacherRegion(db, caller(req), lessonId(req.params.lessonId), regionIndex(req.params.index));
    await sendRegionImage(db, storage, rendering, res, image, 'private, max-age=300');
  });
  router.get('/:lessonId/annotations', async (req, res) => {
    const lesson = await lessonsService.getLesson(db, caller(req), lessonId(req.params.lessonId));
    const collection = buildAnnotationCollection(config.publicUrl, lesson);
    res.set({ 'Content-Type': ANNOTATION_MEDIA_TYPE, 'Content-Disposition': 'attachment; filename="lesson-annotations.jsonld"' });
    res.send(Buffer.from(JSON.stringify(collection), 'utf8'));
  });
  router.get('/:lessonId/shares', async (req, res: Response<Page<ShareLink>>) => {
    res.json(await lessonsService.listShares(db, caller(req), lessonId(req.params.lessonId), readPageQuery(req.query, [])));
  });
  router.post('/:lessonId/shares', async (req, res: Response<ShareLink>) => {
    const input = valueOrThrow(parseShareLinkCreate(req.body), 'The share link has invalid fields.');
    res.status(HTTP.created).json(await lessonsService.createShare(db, caller(req), lessonId(req.params.lessonId), input));
  });
  router.patch('/:lessonId/shares/:shareId', async (req, res: Response<ShareLink>) => {
    const patch = valueOrThrow(parseShareLinkPatch(req.body), 'The share link has invalid fields.');
    const shareId = req.params.shareId;
    if (!isUuid(shareId)) throw new AppError(HTTP.notFound, 'share_link_not_found', 'This share link does not exist.');
    res.json(await lessonsService.updateShare(db, caller(req), lessonId(req.params.lessonId), shareId, patch));
  });
  return router;
}

/** Share pages and their API answers are for the class that holds the link, never for search engines. */
export const noIndex: RequestHandler = (_req, res, next) => {
  res.set('X-Robots-Tag', 'noindex, nofollow');
  next();
};

/**
 * Mounted at /api/shared, with no sign-in: a share link's token reads its one lesson and the chart regions of
 * that lesson, nothing else. Rate-limited per address.
 */
export function sharedLessonRoutes({ db, storage }: AppDeps, rendering: ImageRendering): Router {
  const router = Router();
  router.use(
    noIndex,
    sharedLinkLimit(),
  );
  router.get('/:token', async (req, res: Response<SharedLesson>) => {
    res.set('Cache-Control', 'no-store');
    res.json(await lessonsService.openSharedLesson(db, shareToken(req.params.token)));
  });
  router.get('/:token/regions/:index/image.jpg', async (req, res) => {
    const image = await lessonsService.findSharedRegion(db, shareToken(req.params.token), regionIndex(req.params.index));
    // no-store: a revoked link must stop showing the chart at once, not after a cache's lifetime.
    await sendRegionImage(db, storage, rendering, res, image, 'no-store');
  });
  return router;
}
