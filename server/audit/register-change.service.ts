import type { ApiErrorCode } from '@shared/api/errors';
import type { Page, PageQuery } from '@shared/api/paging';
import type { Register, RegisterChangeLogEntry } from '@shared/api/register-changes';
import type { DbOrTrx } from '../db/database';
import { AppError, HTTP } from '../errors/app-error';
import { hasRecord, listRegisterChanges } from './register-change.repository';

const NOT_FOUND: Record<Register, { code: ApiErrorCode; what: string }> = {
  station: { code: 'station_not_found', what: 'station' },
  instrument: { code: 'instrument_not_found', what: 'instrument' },
  chart_form: { code: 'chart_form_not_found', what: 'chart form' },
  ink_line: { code: 'ink_line_not_found', what: 'ink line' },
};

/** One record's change log, newest first, paged; 404 for an id the register does not hold, so it never reads as an empty log. */
export async function listRegisterChangeLog(db: DbOrTrx, register: Register, recordId: string, query: PageQuery): Promise<Page<RegisterChangeLogEntry>> {
  if (!(await hasRecord(db, register, recordId))) {
    throw new AppError(HTTP.notFound, NOT_FOUND[register].code, `There is no ${NOT_FOUND[register].what} with this id.`);
  }
  const { items, total } = await listRegisterChanges(db, register, recordId, query);
  return { items, total, page: query.page, pageSize: query.pageSize };
}
