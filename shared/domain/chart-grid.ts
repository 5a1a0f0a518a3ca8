import { type ChartForm, chartHeightMm, pivotLevelMm } from './chart-form';
import { type PaperPoint, paperFromReading } from './chart-geometry';

/** A printed pressure line: constant v, running between the first and last time arc at that height. */
export interface GridPressureLine {
  /** In the form's pressure unit. */
  pressure: number;
  vMm: number;
  fromUMm: number;
  toUMm: number;
  isLabelled: boolean;
}

/**
 * A printed time line: an arc of the pen-arm radius (a straight segment when the form has none), from the
 * pressureMin line to the pressureMax line. `points` samples it evenly in v for drawing as a polyline.
 */
export interface GridTimeArc {
  /** Hours after the chart-start line. */
  hours: number;
  isLabelled: boolean;
  from: PaperPoint;
  to: PaperPoint;
  /** Centre of the arc (the pen arm's pivot when the pen stands on this time line); null for straight lines. */
  centre: PaperPoint | null;
  radiusMm: number | null;
  points: PaperPoint[];
}

export interface ChartGrid {
  pressureLines: GridPressureLine[];
  timeArcs: GridTimeArc[];
  /** Smallest box holding every line, paper mm (v grows upward). */
  bounds: { minUMm: number; maxUMm: number; minVMm: number; maxVMm: number };
}

/** Polyline samples per arc: enough that a 1 mm pen width hides the chords on any printed form. */
const ARC_SAMPLES = 24;
// Grid values are sums of decimal steps; compare them with a tolerance well below any printed step.
const EPSILON = 1e-7;

/** Multiples of `step` from `min` to `max` inclusive, computed by counting so that no error accumulates. */
export function gridValues(min: number, max: number, step: number): number[] {
  if (!(step > 0) || !(max >= min)) return [];
  const first = Math.ceil(min / step - EPSILON);
  const last = Math.floor(max / step + EPSILON);
  const values: number[] = [];
  for (let i = first; i <= last; i++) values.push(roundOff(i * step));
  return values;
}

function roundOff(value: number): number {
  // `+ 0` turns the −0 that Math.ceil(−ε) gives into 0, so labels and equality checks see a plain zero.
  return Math.round(value * 1e9) / 1e9 + 0;
}

function isMultipleOf(value: number, step: number): boolean {
  if (!(step > 0)) return false;
  const ratio = value / step;
  return Math.abs(ratio - Math.round(ratio)) < 1e-6;
}

function timeArc(form: ChartForm, hours: number): GridTimeArc {
  const points: PaperPoint[] = [];
  const span = form.pressureMax - form.pressureMin;
  for (let i = 0; i <= ARC_SAMPLES; i++) {
    points.push(paperFromReading(form, { hours, pressure: form.pressureMin + (span * i) / ARC_SAMPLES }));
  }
  const radiusMm = form.penArmRadiusMm;
  // On a circle u = u0 + s·(R − √(R² − (v − vc)²)) the centre sits at (u0 + s·R, vc).
  const centre = radiusMm === null ? null : { uMm: hours * form.mmPerHour + form.arcSide * radiusMm, vMm: pivotLevelMm(form) };
  return {
    hours,
    isLabelled: isMultipleOf(hours, form.labelHoursStep),
    from: points[0],
    to: points[points.length - 1],
    centre,
    radiusMm,
    points,
  };
}

/**
 * The printed grid of a chart form in paper mm: a pressure line every gridPressureStep and a time arc every
 * gridHoursStep over one drum turn, flagged where the form prints a label. Arcs come from chart-geometry, so
 * the drawing and the registration use the same model of the paper.
 */
export function chartGrid(form: ChartForm): ChartGrid {
  const timeArcs = gridValues(0, form.drumHours, form.gridHoursStep).map((hours) => timeArc(form, hours));
  const pressureLines = gridValues(form.pressureMin, form.pressureMax, form.gridPressureStep).map((pressure): GridPressureLine => {
    const from = paperFromReading(form, { hours: 0, pressure });
    const to = paperFromReading(form, { hours: form.drumHours, pressure });
    return { pressure, vMm: from.vMm, fromUMm: from.uMm, toUMm: to.uMm, isLabelled: isMultipleOf(pressure, form.labelPressureStep) };
  });
  const us = [...timeArcs.flatMap((arc) => arc.points.map((p) => p.uMm)), ...pressureLines.flatMap((line) => [line.fromUMm, line.toUMm])];
  const bounds = {
    minUMm: us.length > 0 ? Math.min(...us) : 0,
    maxUMm: us.length > 0 ? Math.max(...us) : 0,
    minVMm: 0,
    maxVMm: chartHeightMm(form),
  };
  return { pressureLines, timeArcs, bounds };
}
