import { Router, type Response } from 'express';
import { CHART_FORM_SORT_KEYS, type ChartFormSummary } from '@shared/api/chart-forms';
import type { Page } from '@shared/api/paging';
import type { AppDeps } from '../app-deps';
import { readPageQuery } from '../http/parse-query';
import * as chartFormsService from './chart-forms.service';

/** Mounted at /api/chart-forms behind authenticate: any signed-in person may list chart forms. */
export function chartFormsRoutes({ db }: AppDeps): Router {
  const router = Router();
  router.get('/', async (req, res: Response<Page<ChartFormSummary>>) => {
    res.json(await chartFormsService.listChartForms(db, readPageQuery(req.query, CHART_FORM_SORT_KEYS)));
  });
  return router;
}
