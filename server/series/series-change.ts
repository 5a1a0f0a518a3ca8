import type { DbOrTrx } from '../db/database';
import type { SeriesChangeKind } from './series-change.table';

/** One ink line entering or leaving its station's series. */
export interface SeriesChange {
  stationId: string;
  inkLineId: string;
  change: SeriesChangeKind;
  personId: string | null;
  reason: string;
}

/**
 * Records that ink lines entered or left a station series. Call it inside the transaction that makes the
 * decision (approve, return, withdraw, restore), so the record and the decision stand or fall together;
 * whatever keeps the published series up to date reads these rows.
 */
export async function recordSeriesChanges(trx: DbOrTrx, changes: readonly SeriesChange[]): Promise<void> {
  if (changes.length === 0) return;
  await trx
    .insertInto('series_change')
    .values(
      changes.map((change) => ({
        station_id: change.stationId,
        ink_line_id: change.inkLineId,
        change: change.change,
        person_id: change.personId,
        reason: change.reason,
      })),
    )
    .execute();
}
