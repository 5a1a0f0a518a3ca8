import type { ChartForm } from './chart-form';
import { type ChartReading, paperFromReading, readingFromPaper } from './chart-geometry';
import { chartGrid, gridValues } from './chart-grid';
import { fitRegistration, pixelToReading, type RegistrationPin } from './registration';

/** What the Pin step knows when a crossing is clicked: the form, the scan, the pins so far and the click. */
export interface PinPrefillInput {
  form: ChartForm;
  /** Full-resolution scan size, px. */
  scanWidthPx: number;
  scanHeightPx: number;
  /** Scan resolution; null when the file did not say (the scale is then guessed from the scan's size). */
  dpi: number | null;
  /** Pins already placed (scan px, hours after the chart-start line, pressure in the form's unit). */
  pins: readonly RegistrationPin[];
  /** The crossing just clicked, scan px. */
  click: { xPx: number; yPx: number };
}

/** Where the guess came from: the fitted pins (3 or more), one or two pins and the scan's scale, or the scan alone. */
export type PrefillBasis = 'registration' | 'pins' | 'scan';

/** The Pin step's pre-filled reading for a click: the nearest printed lines and the time lines around it. */
export interface PinPrefill {
  /** Hours after the chart-start line of the printed time line nearest the guess (a multiple of gridHoursStep). */
  hours: number;
  /** The printed pressure line nearest the guess, in the form's unit (a multiple of gridPressureStep). */
  pressure: number;
  /** Printed time lines near the guess, hours after the chart-start line, earliest first (the guess among them). */
  nearbyHours: number[];
  basis: PrefillBasis;
}

/** Printed time lines offered either side of the guess. */
const NEARBY_LINES_EACH_SIDE = 3;
// Without a dpi the grid is taken to fill this share of the scan's width or height, whichever binds first:
// a scanned chart sheet has a paper margin round the printed grid (common practice: 10–20 mm on a 300 mm sheet).
const GRID_SHARE_WITHOUT_DPI = 0.9;
// Two pins fix a scale along an axis only when they are this far apart on the paper, mm.
const MIN_SPREAD_FOR_SCALE_MM = 20;
const MM_PER_INCH = 25.4;

/** An axis-aligned model of the scan: pixel = origin + scale · paper, with y growing down the scan and v up the paper. */
interface AxisModel {
  originXPx: number;
  originYPx: number;
  pxPerMmU: number;
  pxPerMmV: number;
}

/**
 * Pre-fills a pin from the click: 3 pins or more → the fitted registration; 1–2 pins → the scan's scale (from
 * its dpi, or the grid's share of the scan) anchored on those pins; no pin → the printed grid centred on the
 * scan. The reading is rounded to the nearest printed time line and pressure line, clamped to the chart.
 */
export function prefillPin(input: PinPrefillInput): PinPrefill {
  const { reading, basis } = guessReading(input);
  const { form } = input;
  const lastLineHours = gridValues(0, form.drumHours, form.gridHoursStep).at(-1) ?? 0;
  const hours = clamp(roundTo(reading.hours, form.gridHoursStep), 0, lastLineHours);
  const pressure = clamp(roundTo(reading.pressure, form.gridPressureStep), form.pressureMin, form.pressureMax);
  const nearbyHours = gridValues(
    Math.max(0, hours - NEARBY_LINES_EACH_SIDE * form.gridHoursStep),
    Math.min(lastLineHours, hours + NEARBY_LINES_EACH_SIDE * form.gridHoursStep),
    form.gridHoursStep,
  );
  return { hours, pressure, nearbyHours, basis };
}

/** The next printed time line from `hours`, `steps` lines later (negative: earlier), clamped to the drum turn. */
export function stepTimeLine(form: ChartForm, hours: number, steps: number): number {
  const lastLineHours = gridValues(0, form.drumHours, form.gridHoursStep).at(-1) ?? 0;
  return clamp(roundTo(hours, form.gridHoursStep) + steps * form.gridHoursStep, 0, lastLineHours);
}

/** The next printed pressure line from `pressure`, `steps` lines up (negative: down), clamped to the printed range. */
export function stepPressureLine(form: ChartForm, pressure: number, steps: number): number {
  return clamp(roundTo(pressure, form.gridPressureStep) + steps * form.gridPressureStep, form.pressureMin, form.pressureMax);
}

function guessReading(input: PinPrefillInput): { reading: ChartReading; basis: PrefillBasis } {
  const { form, pins, click } = input;
  if (pins.length >= 3) {
    try {
      const fit = fitRegistration(form, [...pins]);
      return { reading: pixelToReading(form, fit, click.xPx, click.yPx), basis: 'registration' };
    } catch {
      // Pins that cannot be fitted yet (all on one line, or contradictory) still give a scale-based guess below.
    }
  }
  const model = pins.length > 0 ? anchorOnPins(input) : centreOnScan(input);
  const paper = { uMm: (click.xPx - model.originXPx) / model.pxPerMmU, vMm: (model.originYPx - click.yPx) / model.pxPerMmV };
  return { reading: readingFromPaper(form, paper), basis: pins.length > 0 ? 'pins' : 'scan' };
}

/** Scan px per paper mm from the dpi, or from the printed grid filling most of the scan when the dpi is unknown. */
function scanScalePxPerMm(input: PinPrefillInput): number {
  if (input.dpi !== null && input.dpi > 0) return input.dpi / MM_PER_INCH;
  const { bounds } = chartGrid(input.form);
  return GRID_SHARE_WITHOUT_DPI * Math.min(input.scanWidthPx / (bounds.maxUMm - bounds.minUMm), input.scanHeightPx / (bounds.maxVMm - bounds.minVMm));
}

function centreOnScan(input: PinPrefillInput): AxisModel {
  const scale = scanScalePxPerMm(input);
  const { bounds } = chartGrid(input.form);
  return {
    originXPx: input.scanWidthPx / 2 - ((bounds.minUMm + bounds.maxUMm) / 2) * scale,
    originYPx: input.scanHeightPx / 2 + ((bounds.minVMm + bounds.maxVMm) / 2) * scale,
    pxPerMmU: scale,
    pxPerMmV: scale,
  };
}

/** Anchors the model on the pins: each axis takes its scale from two pins far enough apart on it, else the scan's scale. */
function anchorOnPins(input: PinPrefillInput): AxisModel {
  const scale = scanScalePxPerMm(input);
  const placed = input.pins.map((pin) => ({ pin, paper: paperFromReading(input.form, pin) }));
  const [a, b] = placed;
  const spreadU = b ? (b.pin.xPx - a.pin.xPx) / (b.paper.uMm - a.paper.uMm) : 0;
  const spreadV = b ? (a.pin.yPx - b.pin.yPx) / (b.paper.vMm - a.paper.vMm) : 0;
  // A scale that comes out negative means a mistyped pin; the scan's own scale is the safer guess then.
  const pxPerMmU = b && Math.abs(b.paper.uMm - a.paper.uMm) >= MIN_SPREAD_FOR_SCALE_MM && spreadU > 0 ? spreadU : scale;
  const pxPerMmV = b && Math.abs(b.paper.vMm - a.paper.vMm) >= MIN_SPREAD_FOR_SCALE_MM && spreadV > 0 ? spreadV : scale;
  const mean = (values: number[]) => values.reduce((sum, value) => sum + value, 0) / values.length;
  return {
    originXPx: mean(placed.map(({ pin, paper }) => pin.xPx - paper.uMm * pxPerMmU)),
    originYPx: mean(placed.map(({ pin, paper }) => pin.yPx + paper.vMm * pxPerMmV)),
    pxPerMmU,
    pxPerMmV,
  };
}

function roundTo(value: number, step: number): number {
  // Rounded off so that 1012.9999999 reads as 1013 and no float noise reaches the field.
  return Math.round(Math.round(value / step) * step * 1e9) / 1e9;
}

function clamp(value: number, min: number, max: number): number {
  return Math.min(max, Math.max(min, value));
}
