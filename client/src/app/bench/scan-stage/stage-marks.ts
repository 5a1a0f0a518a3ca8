import type { KnotInput, PinInput } from '@shared/api/ink-lines';
import Konva from 'konva';

import type { ScanPoint } from '../bench-state';

// Konva draws on canvas and cannot read CSS custom properties; these match --isl-pin-amber and --isl-ink-cyan.
const PIN_AMBER = 'hsl(38, 95%, 48%)';
const INK_CYAN = 'hsl(188, 100%, 42%)';
const OUTLINE = 'rgba(20, 30, 30, 0.85)';

export interface Marks {
  pins: readonly PinInput[];
  knots: readonly KnotInput[];
  pendingPin: ScanPoint | null;
  /** Full-resolution scan px per preview px: marks are stored in scan px but drawn in preview px. */
  scanPxPerPreviewPx: number;
  /** Current zoom, so marks keep the same size on screen. */
  screenPxPerPreviewPx: number;
}

/** Replaces the layer's content with the ink line (cyan), its knots, the pins (amber) and the picked crossing. */
export function drawMarks(layer: Konva.Layer, marks: Marks): void {
  layer.destroyChildren();
  const toPreview = (point: { xPx: number; yPx: number }) => ({ x: point.xPx / marks.scanPxPerPreviewPx, y: point.yPx / marks.scanPxPerPreviewPx });
  const unit = 1 / marks.screenPxPerPreviewPx;

  const knotPoints = marks.knots.map(toPreview);
  if (knotPoints.length > 1) {
    layer.add(new Konva.Line({ points: knotPoints.flatMap((p) => [p.x, p.y]), stroke: INK_CYAN, strokeWidth: 2 * unit, lineJoin: 'round', lineCap: 'round' }));
  }
  for (const point of knotPoints) {
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 3.5 * unit, fill: INK_CYAN, stroke: OUTLINE, strokeWidth: unit }));
  }

  marks.pins.forEach((pin, index) => {
    const point = toPreview(pin);
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 6 * unit, fill: PIN_AMBER, stroke: OUTLINE, strokeWidth: unit }));
    layer.add(new Konva.Text({ x: point.x + 8 * unit, y: point.y - 16 * unit, text: String(index + 1), fontSize: 13 * unit, fontStyle: 'bold', fill: OUTLINE }));
  });

  if (marks.pendingPin) {
    const point = toPreview(marks.pendingPin);
    layer.add(new Konva.Circle({ x: point.x, y: point.y, radius: 9 * unit, stroke: PIN_AMBER, strokeWidth: 2.5 * unit, dash: [4 * unit, 3 * unit] }));
    layer.add(new Konva.Line({ points: [point.x - 14 * unit, point.y, point.x + 14 * unit, point.y], stroke: PIN_AMBER, strokeWidth: unit }));
    layer.add(new Konva.Line({ points: [point.x, point.y - 14 * unit, point.x, point.y + 14 * unit], stroke: PIN_AMBER, strokeWidth: unit }));
  }
  layer.batchDraw();
}
