import { Router, type Response } from 'express';
import { CHART_FORM_SORT_KEYS, type ChartFormSummary } from '@shared/api/chart-forms';
import type { Page } from '@shared/api/paging';
import { parseChartFormInput, parseChartFormPatch } from '@shared/api/parse-chart-form';
import type { RegisterChangeLogEntry } from '@shared/api/register-changes';
import { listRegisterChangeLog } from '../audit/register-change.service';
import type { AppDeps } from '../app-deps';
import { requireRoles, signedInPerson } from '../auth/require-roles';
import { HTTP } from '../errors/app-error';
import { parsePathId, valueOrThrow } from '../http/parse-body';
import { readPageQuery } from '../http/parse-query';
import * as chartFormsService from './chart-forms.service';

const chartFormId = (value: unknown) => parsePathId(value, 'chart_form_not_found', 'chart form');

/** Mounted at /api/chart-forms behind authenticate: any signed-in person may read; archivists keep the library. */
export function chartFormsRoutes({ db }: AppDeps): Router {
  const router = Router();
  const mayEdit = requireRoles('archivist');
  router.get('/', async (req, res: Response<Page<ChartFormSummary>>) => {
    res.json(await chartFormsService.listChartForms(db, readPageQuery(req.query, CHART_FORM_SORT_KEYS)));
  });
  router.post('/', mayEdit, async (req, res: Response<ChartFormSummary>) => {
    const form = valueOrThrow(parseChartFormInput(req.body), 'The chart form has invalid fields.');
    res.status(HTTP.created).json(await chartFormsService.createChartForm(db, form, signedInPerson(req.user).id));
  });
  router.get('/:chartFormId', async (req, res: Response<ChartFormSummary>) => {
    res.json(await chartFormsService.getChartForm(db, chartFormId(req.params.chartFormId)));
  });
  router.get('/:chartFormId/change-log', requireRoles('archivist', 'admin'), async (req, res: Response<Page<RegisterChangeLogEntry>>) => {
    res.json(await listRegisterChangeLog(db, 'chart_form', chartFormId(req.params.chartFormId), readPageQuery(req.query, [] as const)));
  });
  router.patch('/:chartFormId', mayEdit, async (req, res: Response<ChartFormSummary>) => {
    const id = chartFormId(req.params.chartFormId);
    const patch = valueOrThrow(parseChartFormPatch(req.body), 'The chart form has invalid fields.');
    res.json(await chartFormsService.updateChartForm(db, id, patch, signedInPerson(req.user).id));
  });
  return router;
}
