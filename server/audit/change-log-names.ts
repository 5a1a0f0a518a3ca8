import type { DbOrTrx } from '../db/database';
import type { AuditChanges } from './scan-audit.table';

/** Change-log fields whose values are ids of a register row, and which register. */
const ID_FIELDS = { stationId: 'station', instrumentId: 'instrument', chartFormId: 'chartForm', batchId: 'batch' } as const;
type Register = (typeof ID_FIELDS)[keyof typeof ID_FIELDS];

/** The ids of each register that the given changes mention, before or after. */
function idsByRegister(changesList: readonly AuditChanges[]): Record<Register, Set<string>> {
  const ids: Record<Register, Set<string>> = { station: new Set(), instrument: new Set(), chartForm: new Set(), batch: new Set() };
  for (const changes of changesList) {
    for (const [field, register] of Object.entries(ID_FIELDS)) {
      const change = changes[field];
      if (!change) continue;
      for (const value of [change.before, change.after]) if (typeof value === 'string' && value !== '') ids[register].add(value);
    }
  }
  return ids;
}

/**
 * Display names for every station, instrument, chart form and intake batch id in a page of change-log
 * entries: one query per register that is mentioned, not one per entry. An id whose row is gone stays out,
 * so the log shows the id itself.
 */
export async function changeLogNames(db: DbOrTrx, changesList: readonly AuditChanges[]): Promise<Map<string, string>> {
  const ids = idsByRegister(changesList);
  const names = new Map<string, string>();
  if (ids.station.size) {
    for (const row of await db.selectFrom('station').select(['id', 'name']).where('id', 'in', [...ids.station]).execute()) names.set(row.id, row.name);
  }
  if (ids.instrument.size) {
    const rows = await db.selectFrom('instrument').select(['id', 'maker', 'serial']).where('id', 'in', [...ids.instrument]).execute();
    for (const row of rows) names.set(row.id, [row.maker, row.serial].filter(Boolean).join(' '));
  }
  if (ids.chartForm.size) {
    for (const row of await db.selectFrom('chart_form').select(['id', 'name']).where('id', 'in', [...ids.chartForm]).execute()) names.set(row.id, row.name);
  }
  if (ids.batch.size) {
    for (const row of await db.selectFrom('intake_batch').select(['id', 'label']).where('id', 'in', [...ids.batch]).execute()) names.set(row.id, row.label || 'intake batch');
  }
  return names;
}

/** The names of the ids one entry mentions. */
export function namesForEntry(changes: AuditChanges, names: ReadonlyMap<string, string>): Record<string, string> {
  const own: Record<string, string> = {};
  for (const field of Object.keys(ID_FIELDS)) {
    const change = changes[field];
    if (!change) continue;
    for (const value of [change.before, change.after]) {
      if (typeof value === 'string' && names.has(value)) own[value] = names.get(value) as string;
    }
  }
  return own;
}
