import type { SeriesFlag } from '@shared/api/series';

export interface SeriesPointTable {
  ink_line_id: string;
  station_id: string;
  time: Date;
  /** Null only for a `gap` point; the hand-in does not store gaps today (see ink-lines.service.ts). */
  pressure_hpa: number | null;
  uncertainty_hpa: number | null;
  flag: SeriesFlag;
}
