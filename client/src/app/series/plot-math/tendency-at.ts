import type { SeriesStep } from '@shared/api/series-query';
import { type PressureTendency, threeHourTendency } from '@shared/domain/pressure-tendency';

import type { PlotPoint } from './plot-points';

/** Steps fine enough to read a three-hour tendency from (its half-periods need points 1.5 h apart at most). */
const TENDENCY_STEPS: readonly SeriesStep[] = ['raw', '10min', 'hourly'];

/**
 * The three-hour tendency (WMO code table 0200, docs/references.md §5) ending at timeMs from the plotted
 * points; 'too_coarse' when the step is daily or monthly, null when the curve is not known across the 3 h.
 */
export function tendencyAt(points: readonly PlotPoint[], step: SeriesStep, timeMs: number): PressureTendency | null | 'too_coarse' {
  if (!TENDENCY_STEPS.includes(step)) return 'too_coarse';
  const samples = points
    .filter((point) => point.timeMs >= timeMs - 4 * 3_600_000 && point.timeMs <= timeMs + 3_600_000)
    .map((point) => ({ timeMs: point.timeMs, pressureHpa: point.flag === 'gap' ? null : point.pressureHpa }));
  return threeHourTendency(samples, timeMs);
}
