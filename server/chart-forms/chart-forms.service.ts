import type { ChartFormPatch, ChartFormSortKey, ChartFormSummary } from '@shared/api/chart-forms';
import type { Page, PageQuery } from '@shared/api/paging';
import { checkChartForm, type ChartForm } from '@shared/domain/chart-form';
import { diffFields, insertRegisterChange } from '../audit/register-change.repository';
import type { Db, DbOrTrx } from '../db/database';
import { PG_UNIQUE_VIOLATION, pgErrorCode } from '../db/pg-errors';
import { AppError, HTTP, validationFailed } from '../errors/app-error';
import { versionConflict } from '../http/version-conflict';
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

function duplicateName(error: unknown): never {
  if (pgErrorCode(error) === PG_UNIQUE_VIOLATION) {
    throw new AppError(HTTP.conflict, 'chart_form_name_taken', 'Another chart form already has this name.', { name: 'already used by another chart form' });
  }
  throw error;
}

/** Adds a chart form, with its change log entry in the same transaction. */
export async function createChartForm(db: Db, form: ChartForm, personId: string): Promise<ChartFormSummary> {
  return db.transaction().execute(async (trx) => {
    const created = await chartFormsRepository.insertChartForm(trx, form).catch(duplicateName);
    await insertRegisterChange(trx, { personId, register: 'chart_form', recordId: created.id, action: 'create', changes: diffFields({}, { ...form }) });
    return created;
  });
}

function inUse(scanCount: number): AppError {
  return new AppError(
    HTTP.conflict,
    'chart_form_in_use',
    `This chart form is used by ${scanCount} scan${scanCount === 1 ? '' : 's'}, whose tracing depends on its geometry; create a new chart form instead.`,
    { scanCount },
  );
}

/** Edits a chart form that no scan uses yet; the merged form must pass checkChartForm. */
export async function updateChartForm(db: Db, chartFormId: string, patch: ChartFormPatch, personId: string): Promise<ChartFormSummary> {
  return db.transaction().execute(async (trx) => {
    const { version: _version, ...fields } = patch;
    const before = await getChartForm(trx, chartFormId);
    const updated = await updateUnusedChartForm(trx, chartFormId, patch);
    await insertRegisterChange(trx, { personId, register: 'chart_form', recordId: chartFormId, action: 'edit', changes: diffFields({ ...before }, { ...fields }) });
    return updated;
  });
}

async function updateUnusedChartForm(db: DbOrTrx, chartFormId: string, patch: ChartFormPatch): Promise<ChartFormSummary> {
  const { version, ...fields } = patch;
  const current = await getChartForm(db, chartFormId);
  if (current.scanCount > 0) throw inUse(current.scanCount);
  const { id: _id, version: _version, scanCount: _scanCount, ...currentForm } = current;
  const problems = checkChartForm({ ...currentForm, ...fields });
  if (Object.keys(problems).length > 0) throw validationFailed(problems, 'The chart form has invalid fields.');
  const isUpdated = await chartFormsRepository.updateUnusedChartForm(db, chartFormId, version, fields).catch(duplicateName);
  if (isUpdated) return getChartForm(db, chartFormId);
  const now = await getChartForm(db, chartFormId);
  if (now.scanCount > 0) throw inUse(now.scanCount);
  throw versionConflict('chart form', now.version);
}
