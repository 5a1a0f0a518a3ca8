import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ChartForm } from '@shared/domain/chart-form';

import { gridPaths } from './grid-paths';

/**
 * A chart form's printed grid drawn from its numbers as SVG in paper millimetres. With labels it is the
 * chart form page's picture; without, the scan page lays it over a scan.
 */
@Component({
  selector: 'isl-chart-grid-drawing',
  template: `
    @let p = paths();
    <svg [attr.viewBox]="p.viewBox" [attr.preserveAspectRatio]="overlay() ? 'none' : 'xMidYMid meet'" [class.overlay]="overlay()" role="img" [attr.aria-label]="'Grid of ' + form().name" data-testid="chart-grid-svg">
      <path class="minor" [attr.d]="p.minorPath" />
      <path class="major" [attr.d]="p.majorPath" />
      @for (label of p.pressureLabels; track label.text) {
        <text class="label" text-anchor="end" dominant-baseline="middle" [attr.x]="label.x" [attr.y]="label.y">{{ label.text }}</text>
      }
      @for (label of p.timeLabels; track label.x) {
        <text class="label" text-anchor="middle" [attr.x]="label.x" [attr.y]="label.y">{{ label.text }}</text>
      }
    </svg>
  `,
  styles: `
    :host { display: block; }
    svg { display: block; width: 100%; height: 100%; }
    .minor { stroke: var(--isl-grid-colour, #b5651d); stroke-width: 0.12; fill: none; opacity: 0.55; }
    .major { stroke: var(--isl-grid-colour, #b5651d); stroke-width: 0.3; fill: none; }
    /* Over a scan the lines keep one screen pixel whatever the zoom. */
    .overlay .minor, .overlay .major { vector-effect: non-scaling-stroke; }
    .overlay .minor { stroke-width: 1px; opacity: 0.6; }
    .overlay .major { stroke-width: 2px; opacity: 0.85; }
    .label { font-size: 2.6px; fill: var(--isl-grid-colour, #8a4b12); font-family: 'IBM Plex Sans', sans-serif; }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartGridDrawing {
  readonly form = input.required<ChartForm>();
  readonly withLabels = input(true);
  /** Drawn over a scan: stretched to its box, thin lines at any zoom. */
  readonly overlay = input(false);
  protected readonly paths = computed(() => gridPaths(this.form(), this.withLabels()));
}
