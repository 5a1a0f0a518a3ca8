import type { GhostGridLine } from '@shared/domain/ghost-grid';
import Konva from 'konva';

// Konva cannot read CSS custom properties; a see-through deep teal (the structure colour), never amber or cyan,
// so the grid reads as a guide under the pins and the ink line.
const GHOST_TEAL = 'hsla(183, 85%, 24%, 0.55)';

/** Replaces the layer's content with the ghost grid (scan px in, preview px drawn); nothing when `lines` is null. */
export function drawGhostGrid(layer: Konva.Layer, lines: readonly GhostGridLine[] | null, scanPxPerPreviewPx: number): void {
  layer.destroyChildren();
  for (const line of lines ?? []) {
    layer.add(
      new Konva.Line({
        points: line.points.flatMap((point) => [point.xPx / scanPxPerPreviewPx, point.yPx / scanPxPerPreviewPx]),
        stroke: GHOST_TEAL,
        // Screen pixels at every zoom: the grid is redrawn only when the pins change, never on a pan or zoom.
        strokeWidth: line.isLabelled ? 1.6 : 0.8,
        strokeScaleEnabled: false,
        dash: line.isLabelled ? undefined : [3, 3],
        listening: false,
        perfectDrawEnabled: false,
      }),
    );
  }
  layer.batchDraw();
}
