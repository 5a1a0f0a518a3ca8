import { ChangeDetectionStrategy, Component, computed, input } from '@angular/core';
import type { ReviewDetail } from '@shared/api/review';

import { overlayGeometry } from './overlay-geometry';

/**
 * The scan under review with the ink line, the ghost grid and the pins drawn over it (SVG over the image,
 * in scan pixels): a ghost line that misses its printed line shows a bad pin or a wrong chart form at a glance.
 */
@Component({
  selector: 'isl-review-overlay',
  templateUrl: './review-overlay.html',
  styleUrl: './review-overlay.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
})
export class ReviewOverlay {
  readonly detail = input.required<ReviewDetail>();
  /** Object URL of the scan image; null while it loads or when it cannot be shown. */
  readonly imageUrl = input<string | null>(null);
  /** The archivist can hide the ghost grid to see the printed grid under it. */
  readonly showsGrid = input(true);

  protected readonly geometry = computed(() => {
    const detail = this.detail();
    return overlayGeometry({
      widthPx: detail.scan.widthPx,
      heightPx: detail.scan.heightPx,
      chartForm: detail.chartForm,
      registration: detail.registration,
      pins: detail.line.pins,
      residuals: detail.line.residuals,
      limit: detail.pinRmsLimit,
      knots: detail.line.knots,
      crossKnots: detail.crossTrace?.knots ?? null,
    });
  });
  protected readonly viewBox = computed(() => `0 0 ${this.detail().scan.widthPx} ${this.detail().scan.heightPx}`);
}
