const DAY_MS = 86_400_000;
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/**
 * Label of a UTC time tick for any zoom, one style per axis: "1890" on yearly ticks, "Mar 1890" on monthly,
 * "2 Mar 1890" on daily, and "06:00" (or "06:10") within a day with the date at midnight.
 */
export function formatTimeTick(tick: Date, stepMs: number): string {
  const date = `${tick.getUTCDate()} ${MONTHS[tick.getUTCMonth()]} ${tick.getUTCFullYear()}`;
  if (stepMs >= 360 * DAY_MS) return String(tick.getUTCFullYear());
  if (stepMs >= 28 * DAY_MS) return `${MONTHS[tick.getUTCMonth()]} ${tick.getUTCFullYear()}`;
  if (stepMs >= DAY_MS) return date;
  if (tick.getUTCHours() === 0 && tick.getUTCMinutes() === 0) return date;
  return `${String(tick.getUTCHours()).padStart(2, '0')}:${String(tick.getUTCMinutes()).padStart(2, '0')}`;
}

/** A tick: where it sits along the axis (plot units) and its label. */
export interface AxisTick {
  at: number;
  label: string;
}

/** A label's width in plot units at the plot's 11-unit tick font (average glyph ~6.2 units, common practice). */
export function labelWidth(label: string, glyphWidth = 6.2): number {
  return label.length * glyphWidth;
}

/**
 * The ticks whose centred labels do not touch: left to right, a label is kept only when it starts at least
 * `gapPx` after the last kept one ends and lies within [minAt, maxAt]. Every kept label keeps its tick.
 */
export function thinTickLabels(ticks: readonly AxisTick[], minAt: number, maxAt: number, gapPx = 8): AxisTick[] {
  const kept: AxisTick[] = [];
  let lastEnd = Number.NEGATIVE_INFINITY;
  for (const tick of [...ticks].sort((a, b) => a.at - b.at)) {
    const half = labelWidth(tick.label) / 2;
    if (tick.at - half < minAt || tick.at + half > maxAt) continue;
    if (tick.at - half < lastEnd + gapPx) continue;
    kept.push(tick);
    lastEnd = tick.at + half;
  }
  return kept;
}

/** Vertical labels (one text line each, `lineHeight` tall) that do not overlap, top to bottom. */
export function thinStackedLabels(ticks: readonly AxisTick[], lineHeight = 12): AxisTick[] {
  const kept: AxisTick[] = [];
  for (const tick of [...ticks].sort((a, b) => a.at - b.at)) {
    const last = kept[kept.length - 1];
    if (last === undefined || tick.at - last.at >= lineHeight) kept.push(tick);
  }
  return kept;
}
