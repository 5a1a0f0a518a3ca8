import type { ChartFormSortKey, ChartFormSummary } from '@shared/api/chart-forms';
import type { Page, PageQuery } from '@shared/api/paging';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import * as chartFormsRepository from './chart-forms.repository';

export async function listChartForms(db: DbOrTrx, query: PageQuery<ChartFormSortKey>): Promise<Page<ChartFormSummary>> {
  const { items, total } = await chartFormsRepository.listChartForms(db, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}

/** The chart form, or 404 chart_form_not_found. */
export async function getChartForm(db: DbOrTrx, chartFormId: string): Promise<ChartFormSummary> {
  const form = await chartFormsRepository.findChartFormById(db, chartFormId);
  if (!form) throw new AppError(HTTP.notFound, 'chart_form_not_found', 'There is no chart form with this id.');
  return form;
}
