import type { ChartForm } from '../chart-form';
import type { ClockCorrection, ClockMark } from '../clock-correction';
import { correctChartTime } from '../clock-correction';
import { correctPressureHpa, type InstrumentCorrection } from '../instrument-correction';
import { applyUncertainty, lineCentringUncertaintyHpa } from '../point-uncertainty';
import { toHpa } from '../pressure-units';
import { fitRegistration, pixelToReading, readingToPixel, type RegistrationFit } from '../registration';
import type { RegularPoint } from '../resample';
import { followSpanHours } from './follow-span';
import { type GivenTimeMark, matchTimeMarks } from './match-time-marks';
import { fitRobustClock } from './robust-clock';
import { type CheckReadingUse, fitRobustInstrument, type TimedBarometerReading } from './robust-instrument';
import { resampleStretches, type StretchSample } from './segmented-resample';

/**
 * The one digitizing pipeline: pins → registration → ink → marks → corrections → resample → flags and
 * uncertainty. `npm run digitize`, the server's hand-in and the Bench's Proof step all call digitizeLine, so
 * one chart gives one series wherever it is read. Bump PIPELINE_VERSION when a change alters any output, so a
 * stored ink line tells which pipeline made its points.
 */
export const PIPELINE_VERSION = 1;

const HOUR_MS = 3_600_000;
/** Width of a barograph pen line on paper, mm (common practice: about 0.4 mm); used when the width was not measured. */
export const PEN_LINE_WIDTH_MM = 0.4;

export interface PipelinePin {
  xPx: number;
  yPx: number;
  /** Printed instant of the pin's time line, UTC epoch ms. */
  timeMs: number;
  /** Printed pressure, chart form's unit. */
  pressure: number;
}

/** A flagged span of the line by point index (as InkSpan): gap bounds are the points either side. */
export interface PipelineSpan {
  /** Gaps break the line and off-scale stretches are flagged; jumps and time marks are ink and read as such. */
  kind: 'gap' | 'off_scale' | 'jump' | 'time_mark';
  startIndex: number;
  endIndex: number;
}

/** The pen line in scan pixels, in time order: followed per pixel column, or knots placed on the Bench. */
export interface PipelineLine {
  xPx: ArrayLike<number>;
  yPx: ArrayLike<number>;
  /** Finder's confidence 0–1 per point; NaN (or no list) for a point placed by hand, which is the volunteer's word. */
  confidence: ArrayLike<number> | null;
  spans: PipelineSpan[];
  /** Indices i whose stretch to i + 1 joins a short skip on purpose (flagged interpolated). */
  bridgesAfter: number[];
  /** Measured width of the pen line, px; null when the points are knots and the width was not measured. */
  lineWidthPx: number | null;
  /** Feet of time marks found on the line, scan px (matched to listed marks that have no position). */
  foundTimeMarks: { xPx: number; yPx: number }[];
}

export interface PipelineTimeMark {
  trueTimeMs: number;
  /** The mark's foot on the scan, when known. */
  xPx?: number;
  yPx?: number;
}

export interface PipelineInput {
  form: ChartForm;
  /** The chart's chart start (instant of its first printed time line), UTC epoch ms. */
  chartStartMs: number;
  pins: PipelinePin[];
  /** The line, or how to follow it once the registration and the hours to follow are known. */
  ink: PipelineLine | ((registration: RegistrationFit, hours: { startHours: number; endHours: number }) => PipelineLine);
  timeMarks: PipelineTimeMark[];
  /** Chart on / chart off as written on the chart, UTC epoch ms. */
  chartOnMs: number | null;
  chartOffMs: number | null;
  checkReadings: TimedBarometerReading[];
}

export interface PipelineOptions {
  /** Series step, minutes (60: hourly). */
  stepMinutes?: number;
}

export interface PipelineResult {
  pipelineVersion: number;
  registration: RegistrationFit;
  line: PipelineLine;
  /** Pen line as corrected samples (true time, station hPa), in time order. */
  samples: StretchSample[];
  /** Clock marks used for the fit (time marks, chart on, chart off), chart time → true time. */
  matchedMarks: ClockMark[];
  /** Chart times of marks dropped as contradicting the others. */
  droppedMarkChartTimesMs: number[];
  clock: ClockCorrection | null;
  instrument: InstrumentCorrection | null;
  /** One entry per given check reading. */
  checkReadingUses: CheckReadingUse[];
  series: RegularPoint[];
}

/** Runs the whole pipeline; throws RegistrationError for pins that cannot register the chart. */
export function digitizeLine(input: PipelineInput, options: PipelineOptions = {}): PipelineResult {
  const { form, chartStartMs } = input;
  const hoursOf = (ms: number) => (ms - chartStartMs) / HOUR_MS;
  const registration = fitRegistration(
    form,
    input.pins.map((p) => ({ xPx: p.xPx, yPx: p.yPx, hours: hoursOf(p.timeMs), pressure: p.pressure })),
  );
  const line =
    typeof input.ink === 'function'
      ? input.ink(registration, followSpanHours(form, chartStartMs, input.chartOnMs, input.chartOffMs))
      : input.ink;
  const { samples: chartSamples, leadingGap, trailingGap } = readLine(form, registration, chartStartMs, line);

  // The pen's round end reaches half a line width beyond the instant the pen touched or left the paper.
  const capMs = line.lineWidthPx === null ? 0 : (line.lineWidthPx / 2 / pixelsPerHour(form, registration)) * HOUR_MS;
  const chartTimeAt = (xPx: number, yPx: number) => chartStartMs + pixelToReading(form, registration, xPx, yPx).hours * HOUR_MS;
  const given: GivenTimeMark[] = input.timeMarks.map((m) => ({
    trueTimeMs: m.trueTimeMs,
    chartTimeMs: m.xPx !== undefined && m.yPx !== undefined ? chartTimeAt(m.xPx, m.yPx) : null,
  }));
  const matchedMarks = matchTimeMarks(
    given,
    line.foundTimeMarks.map((m) => chartTimeAt(m.xPx, m.yPx)),
  );
  if (chartSamples.length > 1) {
    if (input.chartOnMs !== null) matchedMarks.push({ chartTimeMs: chartSamples[0].timeMs + capMs, trueTimeMs: input.chartOnMs, kind: 'chart_on' });
    if (input.chartOffMs !== null) {
      matchedMarks.push({ chartTimeMs: chartSamples[chartSamples.length - 1].timeMs - capMs, trueTimeMs: input.chartOffMs, kind: 'chart_off' });
    }
  }
  const { clock, droppedChartTimesMs } = fitRobustClock(matchedMarks);
  const timed = chartSamples.map((s) => ({ ...s, timeMs: clock ? correctChartTime(clock, s.timeMs) : s.timeMs }));

  const { instrument, uses } = fitRobustInstrument(input.checkReadings, timed);
  const samples = instrument ? timed.map((s) => ({ ...s, pressureHpa: correctPressureHpa(instrument, s.timeMs, s.pressureHpa) })) : timed;

  const stepMinutes = options.stepMinutes ?? 60;
  const followed = line.lineWidthPx !== null;
  const columnMinutes = ((1 / pixelsPerMm(registration)) / form.mmPerHour) * 60;
  const resampled = resampleStretches(samples, {
    stepMinutes,
    // A followed line has a point per pixel column: its longest spacing inside a stretch is a bridged skip or the
    // columns under a time mark (90 min). Knots placed by hand may stand up to three hours apart (common practice
    // for an hourly series) and are the volunteer's word, so only spans longer than the step are 'interpolated'.
    maxGapMinutes: followed ? 90 : 180,
    maxOkSpanMinutes: followed ? 4 * columnMinutes : stepMinutes,
    gapFromMs: leadingGap && input.chartOnMs !== null ? input.chartOnMs : undefined,
    gapToMs: trailingGap && input.chartOffMs !== null ? input.chartOffMs : undefined,
  });
  const lineWidthMm = line.lineWidthPx === null ? PEN_LINE_WIDTH_MM : line.lineWidthPx / pixelsPerMm(registration);
  const series = applyUncertainty(resampled, {
    registrationRmsHpa: registration.rmsHpa,
    registrationRmsMinutes: registration.rmsMinutes,
    lineCentringHpa: lineCentringUncertaintyHpa(form, lineWidthMm),
    instrumentRmsHpa: instrument?.rmsHpa ?? 0,
    clockRmsMinutes: clock?.rmsMinutes ?? 0,
  });
  return {
    pipelineVersion: PIPELINE_VERSION,
    registration,
    line,
    samples,
    matchedMarks,
    droppedMarkChartTimesMs: droppedChartTimesMs,
    clock,
    instrument,
    checkReadingUses: uses,
    series,
  };
}

/** Chart readings of the line (chart time, hPa) with off-scale marks and their stretch of unbroken ink. */
function readLine(
  form: ChartForm,
  registration: RegistrationFit,
  chartStartMs: number,
  line: PipelineLine,
): { samples: StretchSample[]; leadingGap: boolean; trailingGap: boolean } {
  const n = line.xPx.length;
  const offScale = new Uint8Array(n);
  const breakBefore = new Uint8Array(n + 1);
  const bridged = new Set(line.bridgesAfter);
  let leadingGap = false;
  let trailingGap = false;
  for (const span of line.spans) {
    if (span.kind === 'off_scale') offScale.fill(1, Math.max(0, span.startIndex), Math.min(n, span.endIndex + 1));
    // Jumps and time marks are kinds of ink, not breaks in it (the kinds of Follow ink's spans).
    else if (span.kind !== 'gap') continue;
    else if (span.startIndex < 0) leadingGap = true;
    else if (span.endIndex >= n) trailingGap = true;
    else breakBefore[span.endIndex] = 1;
  }
  const samples: StretchSample[] = [];
  let stretch = 0;
  for (let i = 0; i < n; i++) {
    if (breakBefore[i]) stretch++;
    const reading = pixelToReading(form, registration, line.xPx[i], line.yPx[i]);
    // The line runs forward in time; the two ends of a vertical stroke can differ by a rounding of the arc.
    const timeMs = Math.max(chartStartMs + reading.hours * HOUR_MS, i > 0 ? samples[i - 1].timeMs : -Infinity);
    const confidence = line.confidence ? line.confidence[i] : Number.NaN;
    samples.push({
      timeMs,
      pressureHpa: toHpa(reading.pressure, form.pressureUnit),
      ...(Number.isNaN(confidence) ? {} : { confidence }),
      isOffScale: offScale[i] === 1 || reading.pressure < form.pressureMin || reading.pressure > form.pressureMax,
      ...(bridged.has(i) ? { bridgesToNext: true } : {}),
      stretch,
    });
  }
  return { samples, leadingGap, trailingGap };
}

/** Scan pixels per hour along the time direction, at mid-range pressure. */
function pixelsPerHour(form: ChartForm, fit: RegistrationFit): number {
  const pressure = (form.pressureMin + form.pressureMax) / 2;
  const a = readingToPixel(form, fit, { hours: form.drumHours / 2, pressure });
  const b = readingToPixel(form, fit, { hours: form.drumHours / 2 + 1, pressure });
  return Math.hypot(b.xPx - a.xPx, b.yPx - a.yPx);
}

/** Scan pixels per paper mm, from the registration's linear part. */
function pixelsPerMm(fit: RegistrationFit): number {
  const [a, b, , d, e] = fit.paperToPixel;
  return Math.sqrt(Math.abs(a * e - b * d));
}
