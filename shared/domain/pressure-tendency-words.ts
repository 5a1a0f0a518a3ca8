import type { TendencyCharacteristic } from './pressure-tendency';

/**
 * The characteristic a of the three-hour tendency in words, after WMO-No. 306, Manual on Codes, Vol. I.1,
 * code table 0200 (docs/references.md §5), shortened for a label.
 */
export const TENDENCY_CHARACTERISTIC_WORDS: Readonly<Record<TendencyCharacteristic, string>> = {
  0: 'rising, then falling; now the same or higher',
  1: 'rising, then steady or rising more slowly; now higher',
  2: 'rising, steadily or not; now higher',
  3: 'falling or steady, then rising, or rising faster; now higher',
  4: 'steady; the same as 3 hours ago',
  5: 'falling, then rising; now the same or lower',
  6: 'falling, then steady or falling more slowly; now lower',
  7: 'falling, steadily or not; now lower',
  8: 'steady or rising, then falling, or falling faster; now lower',
};
