import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { SeriesPoint } from '@shared/api/series';

import { buildLinePath, createPlotScales, formatUtcTick, medianStepMs, type PlotBox } from './plot-scales';
import { buildUncertaintyBandPath } from './uncertainty-band';

const BOX: PlotBox = { width: 960, height: 360, marginLeft: 56, marginRight: 16, marginTop: 12, marginBottom: 36 };
// A step more than this many typical steps long is treated as missing data.
const GAP_FACTOR = 3;

/**
 * Pressure (hPa) against time (UTC) as SVG: axes with ticks, the line with gaps left blank, a light band of
 * ± one standard uncertainty around it, flagged points marked.
 */
@Component({
  selector: 'isl-pressure-plot',
  templateUrl: './pressure-plot.svg',
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
  protected readonly xTicks = computed(() => {
    const { x } = this.scales();
    const ticks = x.ticks(8);
    const stepMs = ticks.length > 1 ? ticks[1].getTime() - ticks[0].getTime() : 0;
    // Labels at the ends of the axis lean inwards so they are not cut off by the plot's edge.
    const edgePx = 40;
    return ticks.map((tick) => {
      const at = x(tick);
      const anchor = at > BOX.width - BOX.marginRight - edgePx ? 'end' : at < BOX.marginLeft + edgePx ? 'start' : 'middle';
      return { at, label: formatUtcTick(tick, stepMs), anchor };
    });
  });
  protected readonly yTicks = computed(() => {
    const { y } = this.scales();
    return y.ticks(6).map((tick) => ({ at: y(tick), label: String(tick) }));
  });
  protected readonly flaggedMarks = computed(() => {
    const { x, y } = this.scales();
    return this.points()
      .filter((point) => point.flag === 'suspect' || point.flag === 'off_scale' || point.flag === 'interpolated')
      .map((point) => ({ cx: x(new Date(point.time)), cy: y(point.pressureHpa), flag: point.flag }));
  });
  protected readonly gapSpans = computed(() => {
    const { x } = this.scales();
    return this.points()
      .filter((point) => point.flag === 'gap')
      .map((point) => x(new Date(point.time)));
  });
}
