import { afterNextRender, ChangeDetectionStrategy, Component, computed, DestroyRef, effect, ElementRef, inject, input, output, viewChild } from '@angular/core';
import { brushX, type BrushBehavior } from 'd3-brush';
import { scaleLinear, scaleUtc } from 'd3-scale';
import { select } from 'd3-selection';

import type { PlotPoint } from '../plot-math/plot-points';
import { rangeBandPath } from '../plot-math/plot-points';
import { formatTimeTick, thinTickLabels } from '../plot-math/tick-labels';

const BOX = { width: 960, height: 96, marginLeft: 56, marginRight: 16, marginTop: 6, marginBottom: 22 };
const DAY_MS = 86_400_000;

/**
 * The whole station record at a glance: the daily minimum–maximum band, with a brush (d3-brush) that chooses
 * the detail plot's range. The brush follows the detail plot's zoom and sends a new range when dragged.
 */
@Component({
  selector: 'isl-series-overview',
  template: `
    <svg #svg class="overview" [attr.viewBox]="'0 0 ' + box.width + ' ' + box.height" role="img" aria-label="The whole record: daily minimum to maximum, with a brush to choose the range" data-testid="series-overview">
      <rect class="paper" [attr.x]="box.marginLeft" [attr.y]="box.marginTop" [attr.width]="innerWidth" [attr.height]="innerHeight" />
      <clipPath id="isl-overview-clip">
        <rect [attr.x]="box.marginLeft" [attr.y]="box.marginTop" [attr.width]="innerWidth" [attr.height]="innerHeight" />
      </clipPath>
      <path class="range-band" data-testid="overview-band" clip-path="url(#isl-overview-clip)" [attr.d]="bandPath()" />
      @for (tick of ticks(); track tick.at) {
        <text class="tick" [attr.x]="tick.at" [attr.y]="box.height - 6" text-anchor="middle">{{ tick.label }}</text>
      }
      <g #brush class="brush" data-testid="overview-brush"></g>
    </svg>
  `,
  styles: `
    @use '../../shared/plot-marks/plot-marks' as marks;
    @include marks.plot-marks;
    :host { display: block; }
    .overview { width: 100%; height: auto; display: block; }
    .range-band { fill: var(--mat-sys-primary); fill-opacity: 0.45; }
    :host ::ng-deep .brush .selection { fill: var(--mat-sys-tertiary); fill-opacity: 0.18; stroke: var(--mat-sys-tertiary); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesOverview {
  /** Daily buckets of the record, in time order. */
  readonly days = input.required<readonly PlotPoint[]>();
  /** The record's first and last instant, epoch ms. */
  readonly recordMs = input.required<readonly [number, number]>();
  /** The detail plot's range, epoch ms: the brush shows it. */
  readonly selectionMs = input<readonly [number, number] | null>(null);
  readonly brushed = output<[number, number]>();

  private readonly brushRef = viewChild.required<ElementRef<SVGGElement>>('brush');
  protected readonly box = BOX;
  protected readonly innerWidth = BOX.width - BOX.marginLeft - BOX.marginRight;
  protected readonly innerHeight = BOX.height - BOX.marginTop - BOX.marginBottom;
  private brush: BrushBehavior<unknown> | null = null;

  private readonly x = computed(() =>
    scaleUtc()
      .domain(this.recordMs().map((ms) => new Date(ms)))
      .range([BOX.marginLeft, BOX.width - BOX.marginRight]),
  );
  private readonly y = computed(() => {
    const days = this.days();
    const low = days.length ? Math.min(...days.map((day) => day.minHpa)) : 990;
    const high = days.length ? Math.max(...days.map((day) => day.maxHpa)) : 1030;
    return scaleLinear()
      .domain([low - 1, high + 1])
      .range([BOX.height - BOX.marginBottom, BOX.marginTop]);
  });
  protected readonly bandPath = computed(() => {
    const x = this.x();
    const y = this.y();
    // A day's band sits at its middle, so the record's first and last days are not drawn half outside.
    const halfStepMs = this.days().length > 1 ? (this.days()[1].timeMs - this.days()[0].timeMs) / 2 : DAY_MS / 2;
    return rangeBandPath(this.days(), (ms) => x(new Date(ms + halfStepMs)), (hPa) => y(hPa), 3 * halfStepMs);
  });
  protected readonly ticks = computed(() => {
    const x = this.x();
    const ticks = x.ticks(8);
    const stepMs = ticks.length > 1 ? ticks[1].getTime() - ticks[0].getTime() : DAY_MS;
    return thinTickLabels(
      ticks.map((tick) => ({ at: x(tick), label: formatTimeTick(tick, stepMs) })),
      0,
      BOX.width,
    );
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const brush = brushX<unknown>()
        .extent([
          [BOX.marginLeft, BOX.marginTop],
          [BOX.width - BOX.marginRight, BOX.height - BOX.marginBottom],
        ])
        .on('end', (event: { selection: [number, number] | null; sourceEvent: unknown }) => {
          // Moves made by the code (following the detail plot) carry no source event and send nothing back.
          if (!event.sourceEvent || !event.selection) return;
          const x = this.x();
          this.brushed.emit([x.invert(event.selection[0]).getTime(), x.invert(event.selection[1]).getTime()]);
        });
      select(this.brushRef().nativeElement).call(brush);
      this.brush = brush;
      this.moveBrush();
    });
    effect(() => {
      this.selectionMs();
      this.x();
      this.moveBrush();
    });
    destroyRef.onDestroy(() => {
      if (this.brush) select(this.brushRef().nativeElement).on('.brush', null);
    });
  }

  private moveBrush(): void {
    const selection = this.selectionMs();
    if (!this.brush || !selection) return;
    const x = this.x();
    const [left, right] = x.range();
    const from = Math.max(left, Math.min(right, x(new Date(selection[0]))));
    const to = Math.max(left, Math.min(right, x(new Date(selection[1]))));
    // A view of the whole record shows no brush, so a drag anywhere starts a new one (inside a brush, a drag moves it).
    const isWhole = from <= left + 1 && to >= right - 1;
    select(this.brushRef().nativeElement).call(this.brush.move, isWhole ? null : [from, Math.max(from + 1, to)]);
  }
}
