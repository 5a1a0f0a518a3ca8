import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import type { PointChart } from '@shared/api/series-point-chart';
import { SERIES_FLAG_WORDS } from '@shared/api/series-flag-words';
import type { PressureUnit } from '@shared/domain/pressure-units';

import { ChartRegionFigure, type RegionMark } from '../../shared/chart-region-figure/chart-region-figure';
import { formatPressure } from '../plot-math/unit-ticks';

/**
 * A point's provenance beside the plot: its ink line, scan and chart form, and the scan region around it
 * through IIIF with the ink line drawn over it and the point ringed.
 */
@Component({
  selector: 'isl-point-chart-panel',
  imports: [ChartRegionFigure, MatButtonModule, MatIconModule],
  template: `
    <section class="panel isl-paper" data-testid="point-chart" aria-label="The chart behind the point">
      <header class="head">
        <h2 class="title">The chart at {{ timeText() }}</h2>
        <button mat-icon-button type="button" (click)="closed.emit()" aria-label="Close the chart" data-testid="point-chart-close"><mat-icon>close</mat-icon></button>
      </header>
      <dl class="facts">
        <dt>Station pressure</dt>
        <dd>{{ pressureText() }}</dd>
        <dt>Chart form</dt>
        <dd>{{ chart().chartFormName ?? 'not recorded' }}</dd>
        <dt>Chart start</dt>
        <dd>{{ chart().chartStart ?? 'not recorded' }}</dd>
        <dt>Ink line</dt>
        <dd class="id">{{ chart().inkLineId }}</dd>
        <dt>Scan</dt>
        <dd class="id">{{ chart().scanId }}</dd>
      </dl>
      @if (figureRegion(); as region) {
        <isl-chart-region-figure [region]="region" [imageUrl]="imageUrl()" [marks]="marks()" [altText]="altText()" [caption]="caption()" />
      } @else {
        <p class="note">This line cannot be placed on its chart (its chart form or fit is missing), so there is no region to show.</p>
      }
    </section>
  `,
  styles: `
    .panel { padding: 12px 16px; border-radius: 8px; border: 1px solid var(--mat-sys-outline-variant); }
    .head { display: flex; align-items: center; justify-content: space-between; }
    .title { font: var(--mat-sys-title-medium); margin: 0; }
    .facts { display: grid; grid-template-columns: max-content 1fr; gap: 2px 16px; margin: 8px 0 12px; font: var(--mat-sys-body-small); }
    .facts dt { color: var(--mat-sys-on-surface-variant); }
    .facts dd { margin: 0; }
    .id { font-family: 'IBM Plex Mono', monospace; overflow-wrap: anywhere; }
    .note { font: var(--mat-sys-body-small); color: var(--mat-sys-on-surface-variant); }
    isl-chart-region-figure { display: block; max-width: 760px; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class PointChartPanel {
  readonly chart = input.required<PointChart>();
  /** Object URL of the region's IIIF image, once fetched. */
  readonly imageUrl = input<string | null>(null);
  readonly unit = input<PressureUnit>('hPa');
  readonly closed = output<void>();

  protected readonly timeText = computed(() => this.chart().time.slice(0, 16).replace('T', ' ') + ' UTC');
  protected readonly pressureText = computed(() => {
    const chart = this.chart();
    const uncertainty = chart.uncertaintyHpa === null ? '' : ` ± ${formatPressure(chart.uncertaintyHpa, this.unit())}`;
    return `${formatPressure(chart.pressureHpa, this.unit())}${uncertainty} (${SERIES_FLAG_WORDS[chart.flag]})`;
  });
  protected readonly figureRegion = computed(() => {
    const chart = this.chart();
    if (chart.region === null) return null;
    return { index: 0, scanId: chart.scanId, region: chart.region, inkLine: chart.inkLine, from: chart.regionFrom ?? chart.time, to: chart.regionTo ?? chart.time };
  });
  protected readonly marks = computed((): RegionMark[] => {
    const at = this.chart().pointPx;
    return at ? [{ number: 1, shape: 'point', xPx: at.xPx, yPx: at.yPx, widthPx: null, heightPx: null }] : [];
  });
  protected readonly altText = computed(() => `The scanned chart around ${this.timeText()}, with the traced ink line drawn over it`);
  protected readonly caption = computed(() => {
    const chart = this.chart();
    const span = chart.regionFrom && chart.regionTo ? `${chart.regionFrom.slice(0, 16).replace('T', ' ')} to ${chart.regionTo.slice(0, 16).replace('T', ' ')} UTC` : '';
    return `Ink line in cyan; mark 1 is the point. ${span}`;
  });
}
