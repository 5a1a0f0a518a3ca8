import { Router, type RequestHandler, type Response } from 'express';
import type { SeriesResponse } from '@shared/api/series';
import type { PointChart } from '@shared/api/series-point-chart';
import type { SeriesQueryResponse, StationCoverage } from '@shared/api/series-query';
import type { AppDeps } from '../app-deps';
import { requireRoles } from '../auth/require-roles';
import { AppError, HTTP } from '../errors/app-error';
import { parsePathId } from '../http/parse-body';
import * as coverageService from './coverage.service';
import { parsePointChartQuery } from './parse-point-chart-query';
import * as pointChartService from './point-chart.service';
import { parseSeriesQuery } from './parse-series-query';
import { parseSeriesRange } from './parse-series-range';
import { SERIES_CSV_HEADER_LINE, seriesCsvFileName, seriesCsvLines } from './series-csv';
import { seriesNetcdf } from './series-netcdf';
import { seriesCsvColumnLine, seriesCsvHeader, seriesCsvRows, seriesFileName } from './series-query-csv';
import * as seriesService from './series.service';

function drainOrClose(res: Response): Promise<void> {
  return new Promise((resolve) => {
    res.once('drain', resolve);
    res.once('close', resolve);
  });
}

/** Who may read station series: climatologists and teachers (signed in, or with a climatologist's API token). */
export const SERIES_READER_ROLES = ['climatologist', 'teacher'] as const;

/**
 * Mounted at /api; each route authenticates itself so that unknown /api paths still reach the 404.
 * `authenticateRead` also takes API tokens (the series, coverage and station reads).
 */
export function seriesRoutes({ db }: AppDeps, authenticateRead: RequestHandler): Router {
  const router = Router();
  const mayRead = requireRoles(...SERIES_READER_ROLES);

  router.get('/series', authenticateRead, mayRead, async (req, res: Response<SeriesResponse>) => {
    res.json(await seriesService.getSeries(db, parseSeriesRange(req.query)));
  });

  router.get('/series.csv', authenticateRead, mayRead, async (req, res) => {
    const range = parseSeriesRange(req.query);
    const { station, version, batches } = await seriesService.openSeriesExport(db, range);
    res.status(200);
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('X-Series-Version', String(version.version));
    res.attachment(seriesCsvFileName(station.code, range.fromMs, range.toMs));
    res.write(SERIES_CSV_HEADER_LINE);
    for await (const points of batches) {
      if (res.destroyed) return;
      // Wait for the socket to drain so a slow client does not make us buffer the whole series.
      if (!res.write(seriesCsvLines(points))) await drainOrClose(res);
    }
    res.end();
  });

  router.get('/series/query', authenticateRead, mayRead, async (req, res: Response<SeriesQueryResponse | string | Buffer>) => {
    const query = parseSeriesQuery(req.query);
    const accessedAt = new Date().toISOString();
    if (query.format === 'json') {
      res.type('application/json').send(await seriesService.querySeriesJson(db, query));
      return;
    }
    const stations = await seriesService.getQueryStations(db, query.stationIds);
    const series = [];
    for (const station of stations) series.push(await seriesService.queryStationSeries(db, station, query));
    res.setHeader('X-Series-Version', series.map((one) => `${one.stationCode}=${one.version}`).join(', '));
    if (query.format === 'netcdf') {
      if (series[0].points.length === 0) {
        throw new AppError(HTTP.notFound, 'series_empty', 'There are no points in this range at this step, so there is no file to write.');
      }
      res.setHeader('Content-Type', 'application/x-netcdf');
      res.attachment(seriesFileName([stations[0].code], query, 'nc'));
      res.send(Buffer.from(seriesNetcdf(stations[0], series[0], query, accessedAt)));
      return;
    }
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.attachment(seriesFileName(stations.map((station) => station.code), query, 'csv'));
    res.write(seriesCsvHeader(query, stations, series, accessedAt));
    res.write(seriesCsvColumnLine(query));
    for (const one of series) res.write(seriesCsvRows(one.stationCode, one.points, query.step === 'raw'));
    res.end();
  });

  router.get('/series/point-chart', authenticateRead, mayRead, async (req, res: Response<PointChart>) => {
    const { stationId, timeMs } = parsePointChartQuery(req.query);
    res.json(await pointChartService.getPointChart(db, stationId, timeMs));
  });

  router.get('/stations/:stationId/coverage', authenticateRead, mayRead, async (req, res: Response<StationCoverage>) => {
    res.json(await coverageService.getStationCoverage(db, parsePathId(req.params.stationId, 'station_not_found', 'station')));
  });

  return router;
}
