import type { ColumnType, Generated, JSONColumnType } from 'kysely';
import type { BenchWork, WorkKnot } from '@shared/api/bench-work';
import type { InkLineSaved, InkLineStatus } from '@shared/api/ink-lines';

export interface InkLineTable {
  id: Generated<string>;
  scan_id: string;
  /** Null while the line is a draft that was never handed in. */
  pin_set_id: string | null;
  author_id: string;
  status: InkLineStatus;
  version: Generated<number>;
  /** The knots as handed in, with their confidence and spans (a draft keeps its knots in `work`). */
  knots: JSONColumnType<WorkKnot[]>;
  /** The Bench's whole work, as autosaved and as handed in; `{}` on lines handed in before drafts existed. */
  work: ColumnType<Partial<BenchWork>, string | undefined, string>;
  /** What the hand-in computed, with the pipeline version and the fitted corrections. */
  result: ColumnType<StoredInkLineResult | null, string | null | undefined, string | null>;
  handed_in_at: ColumnType<Date | null, Date | null | undefined, Date | null>;
  created_at: ColumnType<Date, Date | undefined, never>;
  updated_at: ColumnType<Date, Date | undefined, Date>;
}

/** The stored result: the summary the volunteer saw, and the full corrections with their residuals. */
export interface StoredInkLineResult {
  summary: Omit<InkLineSaved, 'inkLineId' | 'scanId' | 'status' | 'version'>;
  corrections: {
    clock: unknown;
    instrument: unknown;
    matchedMarks: unknown;
    droppedMarkChartTimesMs: number[];
    checkReadingUses: string[];
  };
}
