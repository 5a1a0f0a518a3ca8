import type { SeriesFlag } from './series';

/**
 * Every series flag in words, for labels, legends and tooltips: the wire code (`off_scale`) is for
 * machines, these are for people. One map, so the plot, its legend and any table say the same thing.
 */
export const SERIES_FLAG_WORDS: Readonly<Record<SeriesFlag, string>> = {
  ok: 'ok',
  interpolated: 'interpolated',
  gap: 'gap',
  off_scale: 'off scale',
  suspect: 'suspect',
};

/** What each flag means, one sentence each, for a legend's title text. */
export const SERIES_FLAG_MEANINGS: Readonly<Record<SeriesFlag, string>> = {
  ok: 'traced and corrected, nothing to note',
  interpolated: 'filled between traced points',
  gap: 'no pen line here: nothing is drawn',
  off_scale: 'the pen ran past the edge of the printed range',
  suspect: 'a doubtful stretch of ink or a failed check',
};
