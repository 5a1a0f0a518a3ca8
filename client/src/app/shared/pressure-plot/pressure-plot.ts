import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { SeriesFlag, SeriesPoint } from '@shared/api/series';
import { SERIES_FLAG_WORDS } from '@shared/api/series-flag-words';

import { flagMarkPath, isMarkedFlag } from '../plot-marks/flag-marks';
import { FlagLegend } from '../plot-marks/flag-legend';
import { gapBracketPath } from '../plot-marks/gap-brackets';
import { findGapEnds } from './plot-gaps';
import { buildLinePath, createPlotScales, medianStepMs, type PlotBox } from './plot-scales';
import { pressureTicks, timeTicks } from './plot-ticks';
import { buildUncertaintyBandPath } from './uncertainty-band';

const BOX: PlotBox = { width: 960, height: 360, marginLeft: 56, marginRight: 16, marginTop: 12, marginBottom: 36 };
// A step more than this many typical steps long is treated as missing data.
const GAP_FACTOR = 3;
/** Half size of a flag mark and one line width of the gap brackets, plot units. */
const MARK_RADIUS = 3.5;
const BRACKET_UNIT = 0.75;

/**
 * Pressure (hPa) against time (UTC) as SVG: axes with ticks, the line with red brackets at its gaps (as on
 * the Bench), a light band of ± one standard uncertainty around it, flagged points marked with one shape
 * per flag, and a legend in words beneath.
 */
@Component({
  selector: 'isl-pressure-plot',
  imports: [FlagLegend],
  templateUrl: './pressure-plot.html',
  styleUrl: './pressure-plot.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PressurePlot {
  readonly points = input.required<readonly SeriesPoint[]>();
  /** The requested range in epoch ms; without it the plot spans the points. */
  readonly timeDomainMs = input<[number, number] | undefined>(undefined);

  protected readonly box = BOX;
  private readonly scales = computed(() => createPlotScales(this.points(), BOX, this.timeDomainMs()));
  private readonly maxStepMs = computed(() => {
    const maxStepMs = medianStepMs(this.points()) * GAP_FACTOR;
    return maxStepMs > 0 ? maxStepMs : Number.POSITIVE_INFINITY;
  });
  protected readonly linePath = computed(() => buildLinePath(this.points(), this.scales(), this.maxStepMs()));
  protected readonly bandPath = computed(() => buildUncertaintyBandPath(this.points(), this.scales(), this.maxStepMs()));
  protected readonly xTicks = computed(() => timeTicks(this.scales(), BOX, 8));
  protected readonly yTicks = computed(() => pressureTicks(this.scales(), 6));
  protected readonly flaggedMarks = computed(() => {
    const { x, y } = this.scales();
    return this.points().flatMap((point) =>
      isMarkedFlag(point.flag)
        ? [{ path: flagMarkPath(point.flag, x(new Date(point.time)), y(point.pressureHpa), MARK_RADIUS), flag: point.flag, word: SERIES_FLAG_WORDS[point.flag] }]
        : [],
    );
  });
  protected readonly gapBrackets = computed(() => findGapEnds(this.points(), this.scales(), this.maxStepMs()).map((ends) => gapBracketPath(ends.before, ends.after, BRACKET_UNIT)));
  /** The flags the legend explains: those on the plot, and gap whenever the line is lifted. */
  protected readonly shownFlags = computed(() => {
    const flags = new Set<SeriesFlag>(this.points().map((point) => point.flag));
    if (this.gapBrackets().length > 0) flags.add('gap');
    return [...flags];
  });
}
