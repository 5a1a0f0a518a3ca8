import { type ChartForm, chartHeightMm, checkChartForm } from './chart-form';
import { type ChartReading, paperFromReading, readingFromPaper } from './chart-geometry';
import { applyHomography, invert3x3, type PlanePoint, sumSquaredError } from './homography';
import { findOutlierPins } from './pin-outliers';
import { toHpa } from './pressure-units';
import { findRadiusCurvature } from './radius-search';
import { fitTransform, MIN_PINS, PARAMETER_COUNT, paperPoints, type RegistrationModel } from './registration-model';

/** Re-exported from registration-model.ts: 'similarity' | 'affine' | 'projective'. */
export type { RegistrationModel };

/** A pin: a scan pixel (x right, y down) with the reading typed for it; hours after the chart-start line, pressure in the form's unit. */
export interface RegistrationPin {
  xPx: number;
  yPx: number;
  hours: number;
  pressure: number;
}

/** One pin's residual: fitted reading at the pin's pixel minus its typed reading (form unit, hPa, minutes). */
export interface PinResidual {
  index: number;
  pressure: number;
  pressureHpa: number;
  minutes: number;
  isOutlier: boolean;
}

/** A fitted registration of a scan against its chart form. */
export interface RegistrationFit {
  model: RegistrationModel;
  /** 3×3 row-major homography (last row 0,0,1 for similarity/affine): paper (u,v mm) → pixel (x right, y down). */
  paperToPixel: number[];
  /** The form's radius, or the fitted one (null: straight time lines). */
  penArmRadiusMm: number | null;
  isRadiusFitted: boolean;
  residuals: PinResidual[];
  rmsHpa: number;
  rmsMinutes: number;
}

/** Codes of RegistrationError, one per kind of bad input. */
export type RegistrationErrorCode =
  | 'too_few_pins'
  | 'collinear_pins'
  | 'contradictory_pins'
  | 'radius_too_small'
  | 'invalid_chart_form'
  | 'invalid_pin';

/** Thrown for input that cannot be registered; code names the problem, message says it for a person. */
export class RegistrationError extends Error {
  constructor(
    readonly code: RegistrationErrorCode,
    message: string,
  ) {
    super(message);
    this.name = 'RegistrationError';
  }
}

/** Options of fitRegistration: the model (default by pin count) and whether to fit the pen-arm radius. */
export interface RegistrationOptions {
  model?: RegistrationModel;
  /** Default: fit when the form gives no radius and canFitRadius allows it. */
  fitRadius?: boolean;
}

// Beyond these the pins cannot describe one chart: the RMS would exceed a tenth of the printed range.
const ABSURD_RMS_FRACTION = 0.1;
// Readings closer than this on paper are "the same reading".
const SAME_READING_MM = 0.01;

/**
 * Model chosen by pin count (pins ≥ 0): 3 → similarity, 4–9 → affine, ≥ 10 → projective. Each choice leaves
 * enough spare equations that a bad pin shows (findOutlierPins needs the other pins to hold twice the model's
 * equations) instead of the fit absorbing it.
 */
export function chooseRegistrationModel(pinCount: number): RegistrationModel {
  if (pinCount >= 10) return 'projective';
  if (pinCount >= 4) return 'affine';
  return 'similarity';
}

/**
 * True when the pins can pin down the pen-arm radius under the model: pins on ≥ 3 pressure levels (the arc
 * offset depends on v only, and any 2 levels are absorbed by shear) and ≥ 2 spare equations with R added.
 */
export function canFitRadius(pins: RegistrationPin[], model: RegistrationModel): boolean {
  const levels = new Set(pins.map((p) => p.pressure.toFixed(6)));
  return levels.size >= 3 && 2 * pins.length >= PARAMETER_COUNT[model] + 1 + 2;
}

/**
 * Fits the paper → pixel transform (and the pen-arm radius when asked or when the form lacks one) to ≥ 3 pins.
 * Throws RegistrationError naming the problem for bad input.
 */
export function fitRegistration(form: ChartForm, pins: RegistrationPin[], options: RegistrationOptions = {}): RegistrationFit {
  checkFormForRegistration(form);
  checkPinValues(pins);
  if (options.model !== undefined) return fitWithModel(form, pins, options.model, options.fitRadius);
  const model = chooseRegistrationModel(pins.length);
  try {
    return fitWithModel(form, pins, model, options.fitRadius);
  } catch (error) {
    // A chosen (not asked-for) projective model that the pins cannot fix plausibly falls back to affine.
    if (model === 'projective' && error instanceof RegistrationError && error.code === 'collinear_pins') {
      return fitWithModel(form, pins, 'affine', options.fitRadius);
    }
    throw error;
  }
}

function fitWithModel(form: ChartForm, pins: RegistrationPin[], model: RegistrationModel, fitRadius: boolean | undefined): RegistrationFit {
  if (pins.length < MIN_PINS[model]) {
    throw new RegistrationError('too_few_pins', `a ${model} registration needs at least ${MIN_PINS[model]} pins; ${pins.length} given`);
  }
  checkContradictions(form, pins);
  const pixels: PlanePoint[] = pins.map((p) => ({ x: p.xPx, y: p.yPx }));
  if (isCollinear(pins.map((p) => toPlane(paperFromReading(form, p))))) {
    throw new RegistrationError('collinear_pins', 'the pins lie on one line of the chart; place at least one pin off that line');
  }
  if (isCollinear(pixels)) {
    throw new RegistrationError('collinear_pins', 'the pins lie on one line of the scan; place at least one pin off that line');
  }

  const isRadiusFitted = fitRadius ?? (form.penArmRadiusMm === null && canFitRadius(pins, model));
  if (isRadiusFitted && !canFitRadius(pins, model)) {
    throw new RegistrationError(
      'too_few_pins',
      `fitting the pen-arm radius with a ${model} model needs pins on at least 3 pressure levels and at least ${Math.ceil((PARAMETER_COUNT[model] + 3) / 2)} pins`,
    );
  }
  const radiusMm = isRadiusFitted ? fitRadiusMm(form, pins, pixels, model) : form.penArmRadiusMm;
  const matrix = fitTransform(form, model, paperPoints(form, pins, radiusMm), pixels);
  if (matrix === null) {
    throw new RegistrationError(
      'collinear_pins',
      `the pins do not fix a ${model} transform (too many on one line, or a projective fit that would fold the chart); spread them over the chart`,
    );
  }

  const fit: RegistrationFit = { model, paperToPixel: matrix, penArmRadiusMm: radiusMm, isRadiusFitted, residuals: [], rmsHpa: 0, rmsMinutes: 0 };
  fit.residuals = pinResiduals(form, fit, pins);
  fit.rmsHpa = rootMeanSquare(fit.residuals.map((r) => r.pressureHpa));
  fit.rmsMinutes = rootMeanSquare(fit.residuals.map((r) => r.minutes));
  checkAbsurdRms(form, fit);
  return fit;
}

/** Scan pixel → chart reading (hours after the chart-start line, pressure in the form's unit), along the fitted arcs. */
export function pixelToReading(form: ChartForm, fit: RegistrationFit, xPx: number, yPx: number): ChartReading {
  const pixelToPaper = invert3x3(fit.paperToPixel);
  if (pixelToPaper === null) throw new RegistrationError('contradictory_pins', 'the registration transform is singular');
  const paper = applyHomography(pixelToPaper, { x: xPx, y: yPx });
  return readingFromPaper(form, { uMm: paper.x, vMm: paper.y }, fit.penArmRadiusMm);
}

/** Chart reading (hours, pressure in the form's unit) → scan pixel (x right, y down). */
export function readingToPixel(form: ChartForm, fit: RegistrationFit, reading: ChartReading): { xPx: number; yPx: number } {
  const pixel = applyHomography(fit.paperToPixel, toPlane(paperFromReading(form, reading, fit.penArmRadiusMm)));
  return { xPx: pixel.x, yPx: pixel.y };
}

function checkFormForRegistration(form: ChartForm): void {
  const problems = checkChartForm(form);
  const radiusProblem = problems['penArmRadiusMm'];
  if (radiusProblem !== undefined && form.penArmRadiusMm !== null && form.penArmRadiusMm > 0) {
    throw new RegistrationError('radius_too_small', radiusProblem);
  }
  const messages = Object.values(problems);
  if (messages.length > 0) throw new RegistrationError('invalid_chart_form', `the chart form is not usable: ${messages.join('; ')}`);
}

function checkPinValues(pins: RegistrationPin[]): void {
  pins.forEach((p, i) => {
    if (![p.xPx, p.yPx, p.hours, p.pressure].every(Number.isFinite)) {
      throw new RegistrationError('invalid_pin', `pin ${i + 1} has a missing or non-numeric value`);
    }
  });
}

/**
 * Two pins contradict each other when they sit ten times closer on the scan than their readings are on paper
 * (one place, two readings), or when one reading sits at two places more than 1 mm apart. The scan scale
 * (px per mm) is the median over pin pairs, so the test does not depend on the scan resolution.
 */
function checkContradictions(form: ChartForm, pins: RegistrationPin[]): void {
  const paper = pins.map((p) => toPlane(paperFromReading(form, p)));
  const pairs: { i: number; j: number; pixelDistance: number; paperDistance: number }[] = [];
  for (let i = 0; i < pins.length; i++) {
    for (let j = i + 1; j < pins.length; j++) {
      pairs.push({
        i,
        j,
        pixelDistance: Math.hypot(pins[i].xPx - pins[j].xPx, pins[i].yPx - pins[j].yPx),
        paperDistance: Math.hypot(paper[i].x - paper[j].x, paper[i].y - paper[j].y),
      });
    }
  }
  const ratios = pairs.filter((p) => p.paperDistance > 1).map((p) => p.pixelDistance / p.paperDistance);
  const pxPerMm = ratios.length > 0 ? median(ratios) : null;
  for (const { i, j, pixelDistance, paperDistance } of pairs) {
    const isSamePlace = pxPerMm === null ? pixelDistance < 1 : pixelDistance < 0.1 * pxPerMm * paperDistance;
    if (paperDistance > SAME_READING_MM && isSamePlace) {
      throw new RegistrationError('contradictory_pins', `pins ${i + 1} and ${j + 1} sit at the same place with different readings`);
    }
    const isApart = pxPerMm === null ? pixelDistance >= 1 : pixelDistance > pxPerMm * 1;
    if (paperDistance <= SAME_READING_MM && isApart) {
      throw new RegistrationError('contradictory_pins', `pins ${i + 1} and ${j + 1} have the same reading at different places`);
    }
  }
}

function median(values: number[]): number {
  const sorted = values.slice().sort((a, b) => a - b);
  const mid = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? sorted[mid] : (sorted[mid - 1] + sorted[mid]) / 2;
}

function checkAbsurdRms(form: ChartForm, fit: RegistrationFit): void {
  const rangeHpa = toHpa(form.pressureMax - form.pressureMin, form.pressureUnit);
  const drumMinutes = form.drumHours * 60;
  if (fit.rmsHpa > ABSURD_RMS_FRACTION * rangeHpa || fit.rmsMinutes > ABSURD_RMS_FRACTION * drumMinutes) {
    throw new RegistrationError(
      'contradictory_pins',
      `the pins contradict each other: the best fit still misses them by ${fit.rmsHpa.toFixed(1)} hPa and ${fit.rmsMinutes.toFixed(0)} minutes (RMS); check the typed readings`,
    );
  }
}

/** True when the points' thinnest spread is below 1/1000 of their widest (or they coincide). */
function isCollinear(points: PlanePoint[]): boolean {
  const n = points.length;
  const cx = points.reduce((s, p) => s + p.x, 0) / n;
  const cy = points.reduce((s, p) => s + p.y, 0) / n;
  let sxx = 0;
  let syy = 0;
  let sxy = 0;
  for (const p of points) {
    sxx += (p.x - cx) ** 2;
    syy += (p.y - cy) ** 2;
    sxy += (p.x - cx) * (p.y - cy);
  }
  const mean = (sxx + syy) / 2;
  const spread = Math.sqrt(((sxx - syy) / 2) ** 2 + sxy * sxy);
  const largest = mean + spread;
  const smallest = mean - spread;
  return !(largest > 0) || smallest <= largest * 1e-6;
}

function fitRadiusMm(form: ChartForm, pins: RegistrationPin[], pixels: PlanePoint[], model: RegistrationModel): number | null {
  const maxCurvature = 2 / chartHeightMm(form);
  const sumSquared = (curvature: number) => {
    const paper = paperPoints(form, pins, curvature > 0 ? 1 / curvature : null);
    const matrix = fitTransform(form, model, paper, pixels);
    return matrix === null ? Number.POSITIVE_INFINITY : sumSquaredError(matrix, paper, pixels);
  };
  const curvature = findRadiusCurvature(sumSquared, maxCurvature);
  if (curvature >= maxCurvature * (1 - 1e-6)) {
    throw new RegistrationError(
      'radius_too_small',
      `the pins call for a pen-arm radius below half the chart height (${(chartHeightMm(form) / 2).toFixed(1)} mm); check the chart form and the pins`,
    );
  }
  // A curvature of ~0 means the pins see straight time lines.
  return curvature > maxCurvature * 1e-6 ? 1 / curvature : null;
}

function pinResiduals(form: ChartForm, fit: RegistrationFit, pins: RegistrationPin[]): PinResidual[] {
  const raw = pins.map((pin, index) => {
    const reading = pixelToReading(form, fit, pin.xPx, pin.yPx);
    const pressure = reading.pressure - pin.pressure;
    const hours = reading.hours - pin.hours;
    return { index, pressure, pressureHpa: toHpa(pressure, form.pressureUnit), minutes: hours * 60 };
  });
  const outliers = findOutlierPins(form, fit.model, fit.penArmRadiusMm, pins);
  return raw.map(({ index, pressure, pressureHpa, minutes }) => ({ index, pressure, pressureHpa, minutes, isOutlier: outliers.has(index) }));
}

function rootMeanSquare(values: number[]): number {
  return values.length === 0 ? 0 : Math.sqrt(values.reduce((s, v) => s + v * v, 0) / values.length);
}

function toPlane(point: { uMm: number; vMm: number }): PlanePoint {
  return { x: point.uMm, y: point.vMm };
}
