import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { StoredPointView } from '@shared/api/review';

import { lineDifferences } from './line-difference';

const WIDTH = 960;
const HEIGHT = 160;
const MARGIN = 32;

/** The difference of two ink lines along time (b − a, hPa), the times beyond their combined uncertainty marked red. */
@Component({
  selector: 'isl-line-difference-plot',
  template: `
    <svg [attr.viewBox]="'0 0 ' + width + ' ' + height" role="img" [attr.aria-label]="label()" data-testid="difference-plot">
      <line [attr.x1]="margin" [attr.x2]="width - margin" [attr.y1]="zeroY()" [attr.y2]="zeroY()" class="zero" />
      <polyline [attr.points]="path()" class="line" />
      @for (mark of marks(); track mark.x) {
        <circle [attr.cx]="mark.x" [attr.cy]="mark.y" r="4" class="beyond" data-testid="difference-beyond" />
      }
      <text [attr.x]="4" [attr.y]="14" class="label">±{{ scaleHpa().toFixed(2) }} hPa</text>
    </svg>
  `,
  styles: `
    svg { width: 100%; height: auto; display: block; }
    .zero { stroke: var(--mat-sys-outline); stroke-dasharray: 4 4; }
    .line { fill: none; stroke: var(--mat-sys-primary); stroke-width: 1.5; }
    .beyond { fill: var(--mat-sys-error); }
    .label { font-size: 12px; fill: var(--mat-sys-on-surface-variant); }
  `,
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class LineDifferencePlot {
  readonly a = input.required<readonly StoredPointView[]>();
  readonly b = input.required<readonly StoredPointView[]>();

  protected readonly width = WIDTH;
  protected readonly height = HEIGHT;
  protected readonly margin = MARGIN;
  private readonly differences = computed(() => lineDifferences(this.a(), this.b()));
  protected readonly scaleHpa = computed(() => Math.max(0.5, ...this.differences().map((d) => Math.abs(d.differenceHpa))));
  protected readonly zeroY = computed(() => HEIGHT / 2);
  private readonly toXy = computed(() => {
    const points = this.differences();
    const t0 = points[0]?.timeMs ?? 0;
    const t1 = points[points.length - 1]?.timeMs ?? 1;
    const span = Math.max(1, t1 - t0);
    return (d: { timeMs: number; differenceHpa: number }) => ({
      x: MARGIN + ((d.timeMs - t0) / span) * (WIDTH - 2 * MARGIN),
      y: HEIGHT / 2 - (d.differenceHpa / this.scaleHpa()) * (HEIGHT / 2 - 16),
    });
  });
  protected readonly path = computed(() => this.differences().map((d) => { const p = this.toXy()(d); return `${p.x.toFixed(1)},${p.y.toFixed(1)}`; }).join(' '));
  protected readonly marks = computed(() => this.differences().filter((d) => d.isBeyondUncertainty).map((d) => this.toXy()(d)));
  protected readonly label = computed(() => `Difference of the two lines over ${this.differences().length} common hours; ${this.marks().length} beyond their combined uncertainty.`);
}
