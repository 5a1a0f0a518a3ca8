import { Router, type RequestHandler, type Response } from 'express';
import type { SeriesResponse } from '@shared/api/series';
import type { AppDeps } from '../app-deps';
import { requireRoles } from '../auth/require-roles';
import { parseSeriesRange } from './parse-series-range';
import { SERIES_CSV_HEADER_LINE, seriesCsvFileName, seriesCsvLines } from './series-csv';
import * as seriesService from './series.service';

function drainOrClose(res: Response): Promise<void> {
  return new Promise((resolve) => {
    res.once('drain', resolve);
    res.once('close', resolve);
  });
}

/** Mounted at /api; each route authenticates itself so that unknown /api paths still reach the 404. */
export function seriesRoutes({ db }: AppDeps, authenticate: RequestHandler): Router {
  const router = Router();
  const mayRead = requireRoles('climatologist', 'teacher');

  router.get('/series', authenticate, mayRead, async (req, res: Response<SeriesResponse>) => {
    res.json(await seriesService.getSeries(db, parseSeriesRange(req.query)));
  });

  router.get('/series.csv', authenticate, mayRead, async (req, res) => {
    const range = parseSeriesRange(req.query);
    const { stationCode, batches } = await seriesService.openSeriesExport(db, range);
    res.status(200);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.attachment(seriesCsvFileName(stationCode, range.fromMs, range.toMs));
    res.write(SERIES_CSV_HEADER_LINE);
    for await (const points of batches) {
      if (res.destroyed) return;
      // Wait for the socket to drain so a slow client does not make us buffer the whole series.
      if (!res.write(seriesCsvLines(points))) await drainOrClose(res);
    }
    res.end();
  });

  return router;
}
