/**
 * How a gap is drawn everywhere (the Bench's Konva stage, the series plot, the lesson plot): a red "[" just
 * after the last point before the gap and a red "]" just before the first point after it, nothing between.
 * Konva cannot read CSS custom properties, so the colour lives here and the plots' SCSS reads the same
 * value from --isl-gap-red (theme).
 */
export const GAP_RED = 'hsl(0, 80%, 48%)';

export interface XY {
  x: number;
  y: number;
}

/** Bracket size in units of the drawing's line width: arm length, half height, gap from the point. */
const ARM = 4;
const HALF_HEIGHT = 8;
const INSET = 3;

/** The two brackets as polylines [x0, y0, x1, y1, …]; `unit` is one line width in the drawing's units. */
export function gapBracketLines(before: XY, after: XY, unit: number): [number[], number[]] {
  const arm = ARM * unit;
  const half = HALF_HEIGHT * unit;
  const open = before.x + INSET * unit;
  const close = after.x - INSET * unit;
  return [
    [open + arm, before.y - half, open, before.y - half, open, before.y + half, open + arm, before.y + half],
    [close - arm, after.y - half, close, after.y - half, close, after.y + half, close - arm, after.y + half],
  ];
}

/** The same polylines as SVG path data. */
export function gapBracketPath(before: XY, after: XY, unit: number): string {
  return gapBracketLines(before, after, unit)
    .map((line) => {
      let path = '';
      for (let i = 0; i < line.length; i += 2) path += `${i === 0 ? 'M' : 'L'}${Math.round(line[i] * 10) / 10},${Math.round(line[i + 1] * 10) / 10}`;
      return path;
    })
    .join('');
}
