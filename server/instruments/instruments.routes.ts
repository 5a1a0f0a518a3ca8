import { Router, type Response } from 'express';
import { parseInstrumentPatch, type InstrumentSummary } from '@shared/api/instruments';
import type { RegisterChangeLogEntry } from '@shared/api/register-changes';
import { listRegisterChangeLog } from '../audit/register-change.service';
import type { Page } from '@shared/api/paging';
import { readPageQuery } from '../http/parse-query';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { parsePathId, valueOrThrow } from '../http/parse-body';
import * as instrumentsService from './instruments.service';

/** Mounted at /api/instruments behind authenticate (listing and creating live under /api/stations/:id/instruments). */
export function instrumentsRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/:instrumentId', async (req, res: Response<InstrumentSummary>) => {
    res.json(await instrumentsService.getInstrument(db, parsePathId(req.params.instrumentId, 'instrument_not_found', 'instrument')));
  });
  router.get('/:instrumentId/change-log', requireRoles('archivist', 'admin'), async (req, res: Response<Page<RegisterChangeLogEntry>>) => {
    const instrumentId = parsePathId(req.params.instrumentId, 'instrument_not_found', 'instrument');
    res.json(await listRegisterChangeLog(db, 'instrument', instrumentId, readPageQuery(req.query, [] as const)));
  });
  router.patch('/:instrumentId', requireRoles('archivist'), async (req, res: Response<InstrumentSummary>) => {
    const instrumentId = parsePathId(req.params.instrumentId, 'instrument_not_found', 'instrument');
    const patch = valueOrThrow(parseInstrumentPatch(req.body), 'The instrument has invalid fields.');
    res.json(await instrumentsService.updateInstrument(db, instrumentId, patch, signedInPerson(req.user).id));
  });
  return router;
}
