import { Router, type Response } from 'express';
import type { InstrumentSummary } from '@shared/api/instruments';
import { INSTRUMENT_SORT_KEYS, parseInstrumentInput } from '@shared/api/instruments';
import type { Page } from '@shared/api/paging';
import { parseStationInput, parseStationPatch, STATION_SORT_KEYS, type StationSummary } from '@shared/api/stations';
import type { RegisterChangeLogEntry } from '@shared/api/register-changes';
import { listRegisterChangeLog } from '../audit/register-change.service';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP } from '../errors/app-error';
import * as instrumentsService from '../instruments/instruments.service';
import { parsePathId, valueOrThrow } from '../http/parse-body';
import { readPageQuery } from '../http/parse-query';
import * as stationsService from './stations.service';

const stationId = (value: unknown) => parsePathId(value, 'station_not_found', 'station');

/** Mounted at /api/stations behind authenticate: any signed-in person may read; archivists keep the register. */
export function stationsRoutes({ db }: AppDeps): Router {
  const router = Router();
  const mayEdit = requireRoles('archivist');

  router.get('/', async (req, res: Response<Page<StationSummary>>) => {
    res.json(await stationsService.listStations(db, readPageQuery(req.query, STATION_SORT_KEYS)));
  });
  router.post('/', mayEdit, async (req, res: Response<StationSummary>) => {
    const input = valueOrThrow(parseStationInput(req.body), 'The station has invalid fields.');
    res.status(HTTP.created).json(await stationsService.createStation(db, input, signedInPerson(req.user).id));
  });
  router.get('/:stationId', async (req, res: Response<StationSummary>) => {
    res.json(await stationsService.getStation(db, stationId(req.params.stationId)));
  });
  router.patch('/:stationId', mayEdit, async (req, res: Response<StationSummary>) => {
    const patch = valueOrThrow(parseStationPatch(req.body), 'The station has invalid fields.');
    res.json(await stationsService.updateStation(db, stationId(req.params.stationId), patch, signedInPerson(req.user).id));
  });
  router.get('/:stationId/change-log', requireRoles('archivist', 'admin'), async (req, res: Response<Page<RegisterChangeLogEntry>>) => {
    res.json(await listRegisterChangeLog(db, 'station', stationId(req.params.stationId), readPageQuery(req.query, [] as const)));
  });
  router.get('/:stationId/instruments', async (req, res: Response<Page<InstrumentSummary>>) => {
    const query = readPageQuery(req.query, INSTRUMENT_SORT_KEYS);
    res.json(await instrumentsService.listInstruments(db, stationId(req.params.stationId), query));
  });
  router.post('/:stationId/instruments', mayEdit, async (req, res: Response<InstrumentSummary>) => {
    const input = valueOrThrow(parseInstrumentInput(req.body), 'The instrument has invalid fields.');
    res.status(HTTP.created).json(await instrumentsService.createInstrument(db, stationId(req.params.stationId), input, signedInPerson(req.user).id));
  });
  return router;
}
