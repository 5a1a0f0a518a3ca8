import type { PageQuery } from '@shared/api/paging';
import type { Register, RegisterChangeAction, RegisterChangeLogEntry } from '@shared/api/register-changes';
import type { DbOrTrx } from '../db/database';
import type { AuditChanges } from './scan-audit.table';

export interface NewRegisterChange {
  personId: string;
  register: Register;
  recordId: string;
  action: RegisterChangeAction;
  changes: AuditChanges;
}

/** Writes a change-log row; call inside the transaction that makes the change, so both land or neither does. Nothing is written when nothing changed. */
export async function insertRegisterChange(db: DbOrTrx, entry: NewRegisterChange): Promise<void> {
  if (Object.keys(entry.changes).length === 0) return;
  await db
    .insertInto('register_change')
    .values({ person_id: entry.personId, register: entry.register, record_id: entry.recordId, action: entry.action, changes: JSON.stringify(entry.changes) })
    .execute();
}

/** One record's change log, newest first. */
export async function listRegisterChanges(db: DbOrTrx, register: Register, recordId: string, query: PageQuery): Promise<{ items: RegisterChangeLogEntry[]; total: number }> {
  const rows = await db
    .selectFrom('register_change')
    .innerJoin('person', 'person.id', 'register_change.person_id')
    .select(['register_change.id', 'register_change.at', 'register_change.action', 'register_change.changes', 'person.display_name'])
    .where('register_change.register', '=', register)
    .where('register_change.record_id', '=', recordId)
    .orderBy('register_change.at', 'desc')
    .orderBy('register_change.id', 'desc')
    .limit(query.pageSize)
    .offset(query.page * query.pageSize)
    .execute();
  const { total } = await db
    .selectFrom('register_change')
    .select((eb) => eb.fn.countAll<number>().as('total'))
    .where('register', '=', register)
    .where('record_id', '=', recordId)
    .executeTakeFirstOrThrow();
  return { items: rows.map((row) => ({ id: row.id, at: row.at.toISOString(), personName: row.display_name, action: row.action, changes: row.changes })), total: Number(total) };
}

/** `{ field: { before, after } }` for each field of `after` whose value differs from `before` (compared as JSON). */
export function diffFields(before: Record<string, unknown>, after: Record<string, unknown>): AuditChanges {
  const changes: AuditChanges = {};
  for (const [field, value] of Object.entries(after)) {
    if (field === 'version' || value === undefined) continue;
    if (JSON.stringify(before[field] ?? null) !== JSON.stringify(value ?? null)) changes[field] = { before: before[field] ?? null, after: value };
  }
  return changes;
}

/** Whether the register holds a record with this id (each register is the table of its name). */
export async function hasRecord(db: DbOrTrx, register: Register, recordId: string): Promise<boolean> {
  const row = await db.selectFrom(register).select('id').where('id', '=', recordId).executeTakeFirst();
  return row !== undefined;
}
