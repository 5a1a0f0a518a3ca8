import { Router, type Response } from 'express';
import type { Page } from '@shared/api/paging';
import { STATION_SORT_KEYS, type StationSummary } from '@shared/api/stations';
import type { AppDeps } from '../app-deps';
import { readPageQuery } from '../http/parse-query';
import * as stationsService from './stations.service';

/** Mounted at /api/stations behind authenticate: any signed-in person may list stations. */
export function stationsRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res: Response<Page<StationSummary>>) => {
    res.json(await stationsService.listStations(db, readPageQuery(req.query, STATION_SORT_KEYS)));
  });
  return router;
}
