import type { PageQuery } from '@shared/api/paging';
import type { ScanChangeAction, ScanChangeLogEntry } from '@shared/api/scans';
import type { DbOrTrx } from '../db/database';
import { changeLogNames, namesForEntry } from './change-log-names';
import type { AuditChanges } from './scan-audit.table';

export interface NewScanAudit {
  scanId: string;
  personId: string;
  action: ScanChangeAction;
  changes: AuditChanges;
}

/** Writes change-log rows (table scan_audit); call inside the transaction that makes the change, so both land or neither does. */
export async function insertScanAudit(db: DbOrTrx, ...entries: NewScanAudit[]): Promise<void> {
  if (entries.length === 0) return;
  await db
    .insertInto('scan_audit')
    .values(entries.map((entry) => ({ scan_id: entry.scanId, person_id: entry.personId, action: entry.action, changes: JSON.stringify(entry.changes) })))
    .execute();
}

/** A scan's change log, newest first, with the names of the registers it mentions. */
export async function listScanChangeLog(db: DbOrTrx, scanId: string, query: PageQuery): Promise<{ items: ScanChangeLogEntry[]; total: number }> {
  const rows = await db
    .selectFrom('scan_audit')
    .innerJoin('person', 'person.id', 'scan_audit.person_id')
    .select(['scan_audit.id', 'scan_audit.at', 'scan_audit.action', 'scan_audit.changes', 'person.display_name'])
    .where('scan_audit.scan_id', '=', scanId)
    .orderBy('scan_audit.at', 'desc')
    .orderBy('scan_audit.id', 'desc')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('scan_audit')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('scan_id', '=', scanId)
    .executeTakeFirstOrThrow();
  const names = await changeLogNames(db, rows.map((row) => row.changes));
  return {
    items: rows.map((row) => ({
      id: row.id,
      at: row.at.toISOString(),
      personName: row.display_name,
      action: row.action,
      changes: row.changes,
      names: namesForEntry(row.changes, names),
    })),
    total,
  };
}
