import type { ChartForm } from '@shared/domain/chart-form';
import { type ClockCorrection, ClockCorrectionError, type ClockMark, correctChartTime, fitClockCorrection } from '@shared/domain/clock-correction';
import { followInk, type FollowInkOptions } from '@shared/domain/ink/follow-ink';
import type { InkTrace } from '@shared/domain/ink/ink-trace';
import { parseHexColour, type RawImage } from '@shared/domain/ink/raw-image';
import { type CheckReading, correctPressureHpa, fitInstrumentCorrection, type InstrumentCorrection } from '@shared/domain/instrument-correction';
import { applyUncertainty, lineCentringUncertaintyHpa } from '@shared/domain/point-uncertainty';
import { toHpa } from '@shared/domain/pressure-units';
import { fitRegistration, pixelToReading, readingToPixel, type RegistrationFit } from '@shared/domain/registration';
import type { RegularPoint, TimedPressure } from '@shared/domain/resample';
import type { ChartFile } from './chart-file';
import { resampleStretches, type StretchSample } from './segmented-resample';

export interface DigitizeOptions {
  /** Series step, minutes (60: hourly). */
  stepMinutes?: number;
  follow?: Partial<FollowInkOptions>;
}

/** Everything one run produced, for the CLI, the spec and the bench. */
export interface DigitizeResult {
  registration: RegistrationFit;
  trace: InkTrace;
  /** Pen line as corrected samples (true time, station hPa), in time order. */
  samples: TimedPressure[];
  clock: ClockCorrection | null;
  instrument: InstrumentCorrection | null;
  series: RegularPoint[];
  /** Time marks found on the line and matched to chart.json's, as chart time → true time. */
  matchedMarks: ClockMark[];
}

const HOUR_MS = 3_600_000;
// The ink is followed a little beyond chart on / chart off: a drum clock error moves the line along the chart.
const SPAN_MARGIN_HOURS = 2;
// A found mark is matched to a listed one only within this much chart time (the clock error bound we accept).
const MARK_MATCH_HOURS = 2;
// A mark the others contradict by more than this is taken as misread (a steep stretch of line, not a mark).
const MARK_OUTLIER_MINUTES = 12;
// A check reading the others contradict by more than this is taken as misread or mistyped.
const CHECK_OUTLIER_HPA = 1.5;
// Lines fitted before and after a check reading must agree this well for the reading to be used.
const CHECK_SIDES_AGREE_HPA = 0.5;
const DEFAULT_MAX_BRIDGE_MM = 0.5;
// Longest spacing of samples inside one stretch of ink (a bridged pen skip, or the columns under a time mark).
const MAX_STRETCH_SPACING_MINUTES = 90;

/** Registration → ink following → clock and instrument corrections → regular series. */
export function digitizeChart(image: RawImage, chart: ChartFile, options: DigitizeOptions = {}): DigitizeResult {
  const form = chart.form;
  const chartStartMs = Date.parse(chart.chartStart);
  const hoursOf = (iso: string) => (Date.parse(iso) - chartStartMs) / HOUR_MS;
  const registration = fitRegistration(
    form,
    chart.pins.map((p) => ({ xPx: p.xPx, yPx: p.yPx, hours: hoursOf(p.time), pressure: p.pressure })),
  );
  const startHours = Math.max(0, chart.chartOn ? hoursOf(chart.chartOn) - SPAN_MARGIN_HOURS : 0);
  const endHours = Math.min(form.drumHours, chart.chartOff ? hoursOf(chart.chartOff) + SPAN_MARGIN_HOURS : form.drumHours);
  const maxBridgeMm = options.follow?.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM;
  const trace = followInk(image, form, registration, {
    startHours,
    endHours,
    inkColour: chart.ink.colour ? (parseHexColour(chart.ink.colour) ?? undefined) : undefined,
    seed: chart.ink.seed,
    maxBridgeMm,
    ...options.follow,
  });

  // Chart readings of the line, with off-scale marks and their stretch of unbroken ink, in chart time.
  const n = trace.xPx.length;
  const offScale = new Uint8Array(n);
  const breakBefore = new Uint8Array(n + 1);
  let leadingGap = false;
  let trailingGap = false;
  for (const span of trace.spans) {
    if (span.kind === 'off_scale') offScale.fill(1, span.startIndex, span.endIndex + 1);
    else if (span.kind !== 'gap') continue;
    else if (span.startIndex < 0) leadingGap = true;
    else if (span.endIndex >= n) trailingGap = true;
    else breakBefore[span.endIndex] = 1;
  }
  const chartSamples: StretchSample[] = [];
  let stretch = 0;
  for (let i = 0; i < n; i++) {
    if (breakBefore[i]) stretch++;
    const reading = pixelToReading(form, registration, trace.xPx[i], trace.yPx[i]);
    // The trace runs forward in time; the two ends of a vertical stroke can differ by a rounding of the arc.
    const timeMs = Math.max(chartStartMs + reading.hours * HOUR_MS, i > 0 ? chartSamples[i - 1].timeMs : -Infinity);
    chartSamples.push({
      timeMs,
      pressureHpa: toHpa(reading.pressure, form.pressureUnit),
      confidence: trace.confidence[i],
      isOffScale: offScale[i] === 1,
      stretch,
    });
  }

  const capMs = ((trace.lineWidthPx / 2) / pixelsPerHour(form, registration)) * HOUR_MS;
  const matchedMarks = matchTimeMarks(chart, trace, registration, chartStartMs, chartSamples, capMs);
  const clock = fitRobustClock(matchedMarks);
  const timed = chartSamples.map((s) => ({ ...s, timeMs: clock ? correctChartTime(clock, s.timeMs) : s.timeMs }));

  const columnMinutes = ((25.4 / estimateDpi(registration)) / form.mmPerHour) * 60;
  const instrument = fitInstrument(chart, timed);
  const samples = instrument ? timed.map((s) => ({ ...s, pressureHpa: correctPressureHpa(instrument, s.timeMs, s.pressureHpa) })) : timed;

  const resampled = resampleStretches(samples, {
    stepMinutes: options.stepMinutes ?? 60,
    // Inside a stretch nothing is missing: the longest spacing is a bridged skip or the columns under a time mark.
    maxGapMinutes: MAX_STRETCH_SPACING_MINUTES,
    maxOkSpanMinutes: 4 * columnMinutes,
    gapFromMs: leadingGap && chart.chartOn ? Date.parse(chart.chartOn) : undefined,
    gapToMs: trailingGap && chart.chartOff ? Date.parse(chart.chartOff) : undefined,
  });
  const series = applyUncertainty(resampled, {
    registrationRmsHpa: registration.rmsHpa,
    registrationRmsMinutes: registration.rmsMinutes,
    lineCentringHpa: lineCentringUncertaintyHpa(form, trace.lineWidthPx / pixelsPerMm(registration)),
    instrumentRmsHpa: instrument?.rmsHpa ?? 0,
    clockRmsMinutes: clock?.rmsMinutes ?? 0,
  });
  return { registration, trace, samples, clock, instrument, series, matchedMarks };
}

/** Scan pixels per hour along the time direction, at mid-range pressure. */
function pixelsPerHour(form: ChartForm, fit: RegistrationFit): number {
  const pressure = (form.pressureMin + form.pressureMax) / 2;
  const a = readingToPixel(form, fit, { hours: form.drumHours / 2, pressure });
  const b = readingToPixel(form, fit, { hours: form.drumHours / 2 + 1, pressure });
  return Math.hypot(b.xPx - a.xPx, b.yPx - a.yPx);
}

/**
 * Clock correction that survives a misread mark: marks that put time backwards, or that the others contradict
 * by more than MARK_OUTLIER_MINUTES (leave-one-out), are dropped one at a time, worst first.
 */
function fitRobustClock(marks: ClockMark[]): ClockCorrection | null {
  let kept = [...marks];
  while (kept.length > 0) {
    let fit: ClockCorrection;
    try {
      fit = fitClockCorrection(kept);
    } catch (error) {
      // Contradictory marks: drop the one whose offset is furthest from the median offset, and try again.
      if (!(error instanceof ClockCorrectionError) || kept.length <= 1) throw error;
      kept = withoutFurthestOffset(kept);
      continue;
    }
    let worst = -1;
    let worstMinutes = MARK_OUTLIER_MINUTES;
    fit.residuals.forEach((r, i) => {
      if (r.leaveOneOutMinutes !== null && Math.abs(r.leaveOneOutMinutes) > worstMinutes) {
        worstMinutes = Math.abs(r.leaveOneOutMinutes);
        worst = i;
      }
    });
    if (worst < 0 || kept.length <= 3) return fit;
    const dropChartMs = fit.residuals[worst].chartTimeMs;
    kept = kept.filter((m) => m.chartTimeMs !== dropChartMs);
  }
  return null;
}

function withoutFurthestOffset(marks: ClockMark[]): ClockMark[] {
  const offsets = marks.map((m) => m.trueTimeMs - m.chartTimeMs);
  const middle = [...offsets].sort((a, b) => a - b)[offsets.length >> 1];
  let furthest = 0;
  offsets.forEach((o, i) => {
    if (Math.abs(o - middle) > Math.abs(offsets[furthest] - middle)) furthest = i;
  });
  return marks.filter((_, i) => i !== furthest);
}

/** Scan pixels per paper mm, from the registration's linear part. */
function pixelsPerMm(fit: RegistrationFit): number {
  const [a, b, , d, e] = fit.paperToPixel;
  return Math.sqrt(Math.abs(a * e - b * d));
}

function estimateDpi(fit: RegistrationFit): number {
  return pixelsPerMm(fit) * 25.4;
}

/**
 * Clock marks: each listed time mark against its foot on the chart (given, or the nearest found mark in chart
 * time), plus chart on / chart off against the ends of the ink.
 */
function matchTimeMarks(
  chart: ChartFile,
  trace: InkTrace,
  fit: RegistrationFit,
  chartStartMs: number,
  samples: TimedPressure[],
  capMs: number,
): ClockMark[] {
  const marks: ClockMark[] = [];
  const found = trace.timeMarks.map((m) => chartStartMs + pixelToReading(chart.form, fit, m.xPx, m.yPx).hours * HOUR_MS);
  const used = new Set<number>();
  for (const mark of chart.timeMarks) {
    const trueTimeMs = Date.parse(mark.time);
    if (mark.xPx !== undefined && mark.yPx !== undefined) {
      marks.push({ chartTimeMs: chartStartMs + pixelToReading(chart.form, fit, mark.xPx, mark.yPx).hours * HOUR_MS, trueTimeMs, kind: 'time_mark' });
      continue;
    }
    let best = -1;
    for (let i = 0; i < found.length; i++) {
      if (used.has(i) || Math.abs(found[i] - trueTimeMs) > MARK_MATCH_HOURS * HOUR_MS) continue;
      if (best < 0 || Math.abs(found[i] - trueTimeMs) < Math.abs(found[best] - trueTimeMs)) best = i;
    }
    if (best >= 0) {
      used.add(best);
      marks.push({ chartTimeMs: found[best], trueTimeMs, kind: 'time_mark' });
    }
  }
  if (samples.length > 1) {
    // The pen's round end reaches half a line width beyond the instant the pen touched or left the paper.
    if (chart.chartOn) marks.push({ chartTimeMs: samples[0].timeMs + capMs, trueTimeMs: Date.parse(chart.chartOn), kind: 'chart_on' });
    if (chart.chartOff) marks.push({ chartTimeMs: samples[samples.length - 1].timeMs - capMs, trueTimeMs: Date.parse(chart.chartOff), kind: 'chart_off' });
  }
  return marks;
}

/** Instrument correction from check readings that fall on good ink (not in a gap, not off the scale). */
function fitInstrument(chart: ChartFile, samples: StretchSample[]): InstrumentCorrection | null {
  const readings: CheckReading[] = [];
  for (const check of chart.checkReadings) {
    const timeMs = Date.parse(check.time);
    const chartPressureHpa = interpolateAt(samples, timeMs);
    if (chartPressureHpa !== null) readings.push({ timeMs, chartPressureHpa, barometerPressureHpa: check.pressureHpa });
  }
  let kept = readings;
  while (kept.length > 0) {
    const fit = fitInstrumentCorrection(kept);
    let worst = -1;
    let worstHpa = CHECK_OUTLIER_HPA;
    fit.residuals.forEach((r, i) => {
      if (r.residualHpa !== null && Math.abs(r.residualHpa) > worstHpa) {
        worstHpa = Math.abs(r.residualHpa);
        worst = i;
      }
    });
    if (worst < 0 || kept.length <= 2) return fit;
    const dropMs = fit.residuals[worst].timeMs;
    kept = kept.filter((r) => r.timeMs !== dropMs);
  }
  return null;
}

/**
 * The line's pressure at a check reading's time. The observer usually makes a time mark while reading the
 * barometer, so the few minutes around the time are left out: a straight line is fitted to the samples 6–40
 * minutes either side (same stretch, not off-scale; at least two on each side).
 */
function interpolateAt(samples: StretchSample[], timeMs: number): number | null {
  const near = 6 * 60_000;
  const far = 40 * 60_000;
  let low = 0;
  let high = samples.length;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (samples[mid].timeMs < timeMs - far) low = mid + 1;
    else high = mid;
  }
  const used: StretchSample[] = [];
  for (let i = low; i < samples.length && samples[i].timeMs <= timeMs + far; i++) {
    const s = samples[i];
    if (!s.isOffScale && Math.abs(s.timeMs - timeMs) >= near) used.push(s);
  }
  const before = used.filter((s) => s.timeMs < timeMs);
  const after = used.filter((s) => s.timeMs > timeMs);
  if (before.length < 2 || after.length < 2 || before[before.length - 1].stretch !== after[0].stretch) return null;
  const fromBefore = lineAt(before, timeMs);
  const fromAfter = lineAt(after, timeMs);
  // The two sides disagree: the pressure jumped (or the line is misread) right at the reading; it cannot check the chart.
  if (Math.abs(fromBefore - fromAfter) > CHECK_SIDES_AGREE_HPA) return null;
  return lineAt([...before, ...after], timeMs);
}

/** Least-squares straight line through the samples, evaluated at timeMs. */
function lineAt(samples: StretchSample[], timeMs: number): number {
  const meanT = samples.reduce((sum, s) => sum + (s.timeMs - timeMs), 0) / samples.length;
  const meanP = samples.reduce((sum, s) => sum + s.pressureHpa, 0) / samples.length;
  let sxx = 0;
  let sxy = 0;
  for (const s of samples) {
    const dt = s.timeMs - timeMs - meanT;
    sxx += dt * dt;
    sxy += dt * (s.pressureHpa - meanP);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  return meanP - slope * meanT;
}
