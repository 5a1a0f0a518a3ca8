import { afterNextRender, ChangeDetectionStrategy, Component, computed, DestroyRef, effect, ElementRef, inject, input, output, signal, viewChild } from '@angular/core';
import { scaleUtc } from 'd3-scale';
import { pointer, select } from 'd3-selection';
import { zoom, zoomIdentity, zoomTransform, type D3ZoomEvent, type ZoomBehavior } from 'd3-zoom';
import { SERIES_FLAG_WORDS } from '@shared/api/series-flag-words';
import type { PressureUnit } from '@shared/domain/pressure-units';

import type { PlotBox } from '../../shared/pressure-plot/plot-scales';
import { nearestPointIndex } from '../plot-math/plot-points';
import { formatPressure } from '../plot-math/unit-ticks';
import { detailTicks, drawLines, type StationLine } from './detail-lines';

// The top margin holds the unit's name above the pressure labels, so the two never meet.
const BOX: PlotBox = { width: 960, height: 392, marginLeft: 60, marginRight: 16, marginTop: 24, marginBottom: 40 };
/** The closest zoom: half an hour across the plot. */
const MIN_VIEW_MS = 30 * 60_000;

/** What the hover read-out says for one station at the pointer's time. */
interface HoverLine {
  slot: number;
  label: string;
  text: string;
}

/**
 * The detail plot: pressure against UTC time over the chosen range, zoomed and panned with the wheel and the
 * pointer (d3-zoom) from the whole record down to half an hour. Draws each station's line with its
 * uncertainty band, gap brackets and flag marks; the hover read-out gives each station's value at the
 * pointer; a click picks the nearest point of the first station.
 */
@Component({
  selector: 'isl-series-detail',
  templateUrl: './series-detail.html',
  styleUrl: './series-detail.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class SeriesDetail {
  readonly lines = input.required<readonly StationLine[]>();
  readonly viewMs = input.required<readonly [number, number]>();
  readonly recordMs = input.required<readonly [number, number]>();
  readonly unit = input<PressureUnit>('hPa');
  /** True when the first station's line is reduced to mean sea level (the axis says so). */
  readonly isSeaLevel = input(false);
  /** Neighbours further apart than this are a gap (a few steps of the fetched data). */
  readonly maxStepMs = input.required<number>();
  readonly viewChanged = output<[number, number]>();
  readonly pointPicked = output<{ stationId: string; timeMs: number }>();

  private readonly svgRef = viewChild.required<ElementRef<SVGSVGElement>>('svg');
  protected readonly box = BOX;
  protected readonly innerWidth = BOX.width - BOX.marginLeft - BOX.marginRight;
  protected readonly innerHeight = BOX.height - BOX.marginTop - BOX.marginBottom;
  private behaviour: ZoomBehavior<SVGSVGElement, unknown> | null = null;
  protected readonly hoverX = signal<number | null>(null);

  private readonly plotted = computed(() => drawLines(this.lines(), this.viewMs(), BOX, this.maxStepMs()));
  protected readonly drawn = computed(() => this.plotted().drawn);
  protected readonly ticks = computed(() => detailTicks(this.plotted().scales, BOX, this.unit()));
  protected readonly pointCount = computed(() => this.lines().reduce((sum, line) => sum + line.points.length, 0));
  protected readonly hover = computed((): { x: number; time: string; lines: HoverLine[] } | null => {
    const x = this.hoverX();
    if (x === null) return null;
    const timeMs = this.plotted().scales.x.invert(x).getTime();
    const lines = this.lines().flatMap((line) => {
      const index = nearestPointIndex(line.points, timeMs);
      if (index === -1) return [];
      const point = line.points[index];
      if (Math.abs(point.timeMs - timeMs) > this.maxStepMs()) return [];
      const spread = point.count > 1 ? `, ${formatPressure(point.minHpa, this.unit())} to ${formatPressure(point.maxHpa, this.unit())}` : '';
      const uncertainty = point.uncertaintyHpa === null ? '' : ` ± ${formatPressure(point.uncertaintyHpa, this.unit()).replace(/ .*/, '')}`;
      const flag = point.count > 1 ? (point.flaggedShare > 0 ? `, ${Math.round(point.flaggedShare * 100)} % flagged` : '') : `, ${SERIES_FLAG_WORDS[point.flag]}`;
      return [{ slot: line.slot, label: line.label, text: `${formatPressure(point.pressureHpa, this.unit())}${uncertainty}${spread}${flag}` }];
    });
    return { x, time: new Date(timeMs).toISOString().slice(0, 16).replace('T', ' ') + ' UTC', lines };
  });

  constructor() {
    const destroyRef = inject(DestroyRef);
    afterNextRender(() => {
      const svg = this.svgRef().nativeElement;
      const behaviour = zoom<SVGSVGElement, unknown>()
        .extent([
          [BOX.marginLeft, 0],
          [BOX.width - BOX.marginRight, BOX.height],
        ])
        .translateExtent([
          [BOX.marginLeft, 0],
          [BOX.width - BOX.marginRight, BOX.height],
        ])
        .on('zoom', (event: D3ZoomEvent<SVGSVGElement, unknown>) => {
          // A transform set by the code (following the brush) carries no source event and sends nothing back.
          if (!event.sourceEvent) return;
          const domain = event.transform.rescaleX(this.baseX()).domain();
          this.viewChanged.emit([domain[0].getTime(), domain[1].getTime()]);
        });
      select(svg).call(behaviour).on('dblclick.zoom', null);
      this.behaviour = behaviour;
      this.followView();
    });
    effect(() => {
      this.viewMs();
      this.recordMs();
      this.followView();
    });
    destroyRef.onDestroy(() => {
      if (this.behaviour) select(this.svgRef().nativeElement).on('.zoom', null);
    });
  }

  /** The record across the plot: the zoom transform is relative to it. */
  private baseX() {
    const [fromMs, toMs] = this.recordMs();
    return scaleUtc()
      .domain([new Date(fromMs), new Date(Math.max(toMs, fromMs + MIN_VIEW_MS))])
      .range([BOX.marginLeft, BOX.width - BOX.marginRight]);
  }

  /** Sets the zoom transform to the current view, and the zoom's limits to the record's span. */
  private followView(): void {
    if (!this.behaviour) return;
    const base = this.baseX();
    const [fromMs, toMs] = this.viewMs();
    const left = BOX.marginLeft;
    const right = BOX.width - BOX.marginRight;
    const recordSpan = base.domain()[1].getTime() - base.domain()[0].getTime();
    this.behaviour.scaleExtent([1, Math.max(1, recordSpan / MIN_VIEW_MS)]);
    const k = (right - left) / Math.max(1e-9, base(new Date(toMs)) - base(new Date(fromMs)));
    const tx = left - k * base(new Date(fromMs));
    const svg = this.svgRef().nativeElement;
    // The view came from this very transform (a wheel or drag): setting it again inside the gesture would
    // send the gesture's event once more, and the view back, without end.
    const current = zoomTransform(svg);
    if (Math.abs(current.k - k) <= 1e-9 * k && Math.abs(current.x - tx) <= 1e-6 * Math.max(1, Math.abs(tx))) return;
    select(svg).call(this.behaviour.transform, zoomIdentity.translate(tx, 0).scale(k));
  }

  protected trackPointer(event: PointerEvent): void {
    const [x] = pointer(event, this.svgRef().nativeElement);
    this.hoverX.set(x >= BOX.marginLeft && x <= BOX.width - BOX.marginRight ? x : null);
  }

  protected pickPoint(event: MouseEvent): void {
    const first = this.lines()[0];
    if (!first || event.defaultPrevented) return;
    const [x] = pointer(event, this.svgRef().nativeElement);
    const timeMs = this.plotted().scales.x.invert(x).getTime();
    const index = nearestPointIndex(first.points, timeMs);
    if (index === -1) return;
    this.pointPicked.emit({ stationId: first.stationId, timeMs: first.points[index].timeMs });
  }
}
