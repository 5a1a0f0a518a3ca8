import type { ChartForm } from '@shared/domain/chart-form';
import { chartGrid } from '@shared/domain/chart-grid';

/** One grid drawing in SVG user units of millimetres, y downward (paper v is upward). */
export interface GridPaths {
  viewBox: string;
  widthMm: number;
  heightMm: number;
  /** The printed area's top-left corner in the drawing, mm (labels sit outside it). */
  originUMm: number;
  minorPath: string;
  majorPath: string;
  pressureLabels: { x: number; y: number; text: string }[];
  timeLabels: { x: number; y: number; text: string }[];
}

/** Room left of and below the printed area for the labels, mm. */
export const LABEL_MARGIN_MM = 8;

function fmt(n: number): string {
  return (Math.round(n * 100) / 100).toString();
}

/** A time label as printed: the hour of day, with the day number on midnight lines. */
export function timeLabel(hours: number): string {
  const hourOfDay = ((hours % 24) + 24) % 24;
  return hourOfDay === 0 ? `day ${hours / 24 + 1}` : `${hourOfDay}h`;
}

/**
 * SVG path data for a chart form's grid: labelled lines in `majorPath`, the rest in `minorPath`. The y axis
 * is flipped (SVG y = top of the range − v) and a label margin is added on the left and bottom.
 */
export function gridPaths(form: ChartForm, withLabels = true): GridPaths {
  const grid = chartGrid(form);
  const margin = withLabels ? LABEL_MARGIN_MM : 0;
  const top = grid.bounds.maxVMm;
  const y = (vMm: number) => top - vMm;
  const minor: string[] = [];
  const major: string[] = [];
  for (const line of grid.pressureLines) {
    (line.isLabelled ? major : minor).push(`M${fmt(line.fromUMm)} ${fmt(y(line.vMm))}H${fmt(line.toUMm)}`);
  }
  for (const arc of grid.timeArcs) {
    const d = arc.points.map((p, i) => `${i === 0 ? 'M' : 'L'}${fmt(p.uMm)} ${fmt(y(p.vMm))}`).join('');
    (arc.isLabelled ? major : minor).push(d);
  }
  const pressureLabels = withLabels
    ? grid.pressureLines.filter((l) => l.isLabelled).map((l) => ({ x: l.fromUMm - 1, y: y(l.vMm), text: String(l.pressure) }))
    : [];
  const timeLabels = withLabels
    ? grid.timeArcs.filter((a) => a.isLabelled).map((a) => ({ x: a.from.uMm, y: top + 4, text: timeLabel(a.hours) }))
    : [];
  const minX = grid.bounds.minUMm - margin;
  const widthMm = grid.bounds.maxUMm - grid.bounds.minUMm + margin * 2;
  const heightMm = top + margin * 1.5;
  return {
    viewBox: `${fmt(minX)} ${fmt(-margin / 2)} ${fmt(widthMm)} ${fmt(heightMm)}`,
    widthMm,
    heightMm,
    originUMm: grid.bounds.minUMm,
    minorPath: minor.join(''),
    majorPath: major.join(''),
    pressureLabels,
    timeLabels,
  };
}
