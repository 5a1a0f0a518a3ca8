import type { DbOrTrx } from '../db/database';

/** What Follow ink needs of a scan: its state, catalogue fields and chart span. */
export interface ScanToFollow {
  status: string;
  chartFormId: string | null;
  chartStart: Date | null;
  chartOn: Date | null;
  chartOff: Date | null;
}

export async function findScanToFollow(db: DbOrTrx, scanId: string): Promise<ScanToFollow | undefined> {
  const row = await db
    .selectFrom('scan')
    .select(['status', 'chart_form_id', 'chart_start', 'chart_on', 'chart_off'])
    .where('id', '=', scanId)
    .executeTakeFirst();
  return row
    ? { status: row.status, chartFormId: row.chart_form_id, chartStart: row.chart_start, chartOn: row.chart_on, chartOff: row.chart_off }
    : undefined;
}
