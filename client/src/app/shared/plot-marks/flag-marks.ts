import type { SeriesFlag } from '@shared/api/series';

/** The flags a plot marks point by point (ok needs no mark; a gap is drawn as brackets, see gap-brackets.ts). */
export const MARKED_FLAGS = ['interpolated', 'suspect', 'off_scale'] as const satisfies readonly SeriesFlag[];
export type MarkedFlag = (typeof MARKED_FLAGS)[number];

export function isMarkedFlag(flag: SeriesFlag): flag is MarkedFlag {
  return (MARKED_FLAGS as readonly string[]).includes(flag);
}

/**
 * Each flag's mark has its own shape, so it reads without colour: an open circle for interpolated, a
 * triangle for suspect, a square for off scale. SVG path data centred on (cx, cy), `r` the half size.
 */
export function flagMarkPath(flag: MarkedFlag, cx: number, cy: number, r: number): string {
  const round = (value: number) => Math.round(value * 10) / 10;
  switch (flag) {
    case 'interpolated':
      return `M${round(cx - r)},${round(cy)}a${r},${r} 0 1,0 ${2 * r},0a${r},${r} 0 1,0 ${-2 * r},0z`;
    case 'suspect':
      return `M${round(cx)},${round(cy - r * 1.2)}L${round(cx + r * 1.1)},${round(cy + r * 0.8)}L${round(cx - r * 1.1)},${round(cy + r * 0.8)}z`;
    case 'off_scale':
      return `M${round(cx - r)},${round(cy - r)}h${2 * r}v${2 * r}h${-2 * r}z`;
  }
}
