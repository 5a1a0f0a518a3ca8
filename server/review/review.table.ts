import type { ColumnType, Generated } from 'kysely';

export type ReviewDecision = 'approved' | 'returned';

export interface InkLineReviewTable {
  id: Generated<string>;
  ink_line_id: string;
  decision: ReviewDecision;
  /** What to fix, for a return (required then); may be empty for an approval. */
  note: ColumnType<string, string | undefined, never>;
  person_id: string;
  at: ColumnType<Date, Date | undefined, never>;
}

export interface CrossTraceAgreementTable {
  /** The pair in id order (ink_line_a < ink_line_b), so a pair has one row. */
  ink_line_a: string;
  ink_line_b: string;
  common_point_count: number;
  rms_hpa: number | null;
  max_difference_hpa: number | null;
  best_offset_minutes: number | null;
  disagreeing_point_count: number;
  computed_at: ColumnType<Date, Date | undefined, Date>;
}
