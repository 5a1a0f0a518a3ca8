import { ChangeDetectionStrategy, Component, computed, input, output } from '@angular/core';
import type { ChartRegion } from '@shared/api/lessons';

/** A mark drawn on a chart region, canvas pixels; a box has width and height. */
export interface RegionMark {
  number: number;
  shape: 'point' | 'box';
  xPx: number;
  yPx: number;
  widthPx: number | null;
  heightPx: number | null;
}

/**
 * One chart region: the scan's image with the ink line drawn over it in cyan and the notes' marks, numbered as
 * in the notes. The overlay's viewBox is the region in canvas pixels, so knots and marks need no conversion.
 * While `isMarking`, a click gives the canvas pixel under it.
 */
@Component({
  selector: 'isl-chart-region-figure',
  template: `
    <figure class="figure" [class.marking]="isMarking()">
      <div class="frame">
        @if (imageUrl(); as url) {
          <img class="image" [src]="url" [alt]="altText()" data-testid="chart-region-image" />
        } @else {
          <div class="image placeholder" role="img" [attr.aria-label]="altText()"></div>
        }
        <svg class="overlay" [attr.viewBox]="viewBox()" preserveAspectRatio="none" aria-hidden="true" (click)="pick($event)" data-testid="chart-region-overlay">
          <polyline class="ink" [attr.points]="inkPoints()" [attr.stroke-width]="strokePx()" />
          @for (mark of marks(); track mark.number) {
            @if (mark.shape === 'box') {
              <rect class="mark" data-testid="chart-mark" [attr.x]="mark.xPx" [attr.y]="mark.yPx" [attr.width]="mark.widthPx" [attr.height]="mark.heightPx" [attr.stroke-width]="strokePx() * 1.5" />
            } @else {
              <circle class="mark" data-testid="chart-mark" [attr.cx]="mark.xPx" [attr.cy]="mark.yPx" [attr.r]="strokePx() * 5" [attr.stroke-width]="strokePx() * 1.5" />
            }
            <text class="mark-number" [attr.x]="mark.xPx + strokePx() * 6" [attr.y]="mark.yPx - strokePx() * 4" [attr.font-size]="strokePx() * 12">{{ mark.number }}</text>
          }
        </svg>
      </div>
      <figcaption class="caption">{{ caption() }}</figcaption>
    </figure>
  `,
  styleUrl: './chart-region-figure.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ChartRegionFigure {
  readonly region = input.required<Omit<ChartRegion, 'imagePath'>>();
  readonly imageUrl = input<string | null>(null);
  readonly marks = input<readonly RegionMark[]>([]);
  readonly altText = input.required<string>();
  readonly caption = input('');
  readonly isMarking = input(false);
  readonly canvasPoint = output<{ xPx: number; yPx: number }>();

  protected readonly viewBox = computed(() => {
    const { xPx, yPx, widthPx, heightPx } = this.region().region;
    return `${xPx} ${yPx} ${widthPx} ${heightPx}`;
  });
  protected readonly inkPoints = computed(() => this.region().inkLine.map((knot) => `${knot.xPx},${knot.yPx}`).join(' '));
  /** About 2 screen px at the figure's usual width, in canvas pixels. */
  protected readonly strokePx = computed(() => Math.max(1, this.region().region.widthPx / 500));

  protected pick(event: MouseEvent): void {
    if (!this.isMarking()) return;
    const svg = event.currentTarget as SVGSVGElement;
    const box = svg.getBoundingClientRect();
    const { xPx, yPx, widthPx, heightPx } = this.region().region;
    this.canvasPoint.emit({
      xPx: Math.round(xPx + ((event.clientX - box.left) / box.width) * widthPx),
      yPx: Math.round(yPx + ((event.clientY - box.top) / box.height) * heightPx),
    });
  }
}
