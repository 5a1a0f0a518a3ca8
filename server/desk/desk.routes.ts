import { Router, type RequestHandler, type Response } from 'express';
import {
  DESK_SECTIONS,
  type DeskLine,
  type DeskSection,
  type DeskSummary,
  type NextChartResult,
  parseStationTracing,
  parseTracePriorityInput,
  PROGRESS_GROUPS,
  type ProgressGroup,
  type StationTracing,
  type TracePriority,
  type TracingProgressRow,
} from '@shared/api/desk';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP, validationFailed } from '../errors/app-error';
import { parsePathId, valueOrThrow } from '../http/parse-body';
import { readPageQuery } from '../http/parse-query';
import * as deskService from './desk.service';

function oneOf<T extends string>(value: unknown, values: readonly T[], name: string, fallback: T): T {
  if (value === undefined || value === '') return fallback;
  if (typeof value === 'string' && (values as readonly string[]).includes(value)) return value as T;
  throw validationFailed({ [name]: `${name} must be one of: ${values.join(', ')}` });
}

/** The volunteer's Desk (mounted at /api/desk) and the archivist's tracing settings and progress (at /api/tracing). */
export function deskRoutes({ db }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  const volunteer = requireRoles('volunteer');
  const archivist = requireRoles('archivist');

  router.get('/desk/summary', authenticate, volunteer, async (req, res: Response<DeskSummary>) => {
    res.json(await deskService.getDeskSummary(db, signedInPerson(req.user).id));
  });

  router.get('/desk/lines', authenticate, volunteer, async (req, res: Response<Page<DeskLine>>) => {
    const section = oneOf<DeskSection>(req.query['section'], DESK_SECTIONS, 'section', 'drafts');
    res.json(await deskService.listDeskLines(db, signedInPerson(req.user).id, section, readPageQuery(req.query, [] as const, ['section'])));
  });

  router.post('/desk/next', authenticate, volunteer, async (req, res: Response<NextChartResult>) => {
    res.json(await deskService.takeNextChart(db, signedInPerson(req.user).id));
  });

  router.delete('/desk/claims/:scanId', authenticate, volunteer, async (req, res) => {
    await deskService.giveBackChart(db, parsePathId(req.params.scanId, 'scan_not_found', 'scan'), signedInPerson(req.user).id);
    res.status(204).end();
  });

  router.get('/tracing/progress', authenticate, archivist, async (req, res: Response<Page<TracingProgressRow>>) => {
    const group = oneOf<ProgressGroup>(req.query['groupBy'], PROGRESS_GROUPS, 'groupBy', 'station');
    res.json(await deskService.listProgress(db, group, readPageQuery(req.query, [] as const, ['groupBy'])));
  });

  router.get('/tracing/priorities', authenticate, archivist, async (req, res: Response<Page<TracePriority>>) => {
    res.json(await deskService.listTracePriorities(db, readPageQuery(req.query, [] as const)));
  });

  router.put('/tracing/priorities', authenticate, archivist, async (req, res: Response<TracePriority>) => {
    const input = valueOrThrow(parseTracePriorityInput(req.body), 'The priority is invalid.');
    res.status(HTTP.ok).json(await deskService.setTracePriority(db, input, signedInPerson(req.user).id));
  });

  router.get('/tracing/stations/:stationId', authenticate, archivist, async (req, res: Response<StationTracing>) => {
    res.json(await deskService.getStationTracing(db, parsePathId(req.params.stationId, 'station_not_found', 'station')));
  });

  router.put('/tracing/stations/:stationId', authenticate, archivist, async (req, res: Response<StationTracing>) => {
    const stationId = parsePathId(req.params.stationId, 'station_not_found', 'station');
    const { inkLinesRequired } = valueOrThrow(parseStationTracing(req.body), 'The tracing setting is invalid.');
    res.json(await deskService.setStationTracing(db, stationId, inkLinesRequired));
  });

  return router;
}
