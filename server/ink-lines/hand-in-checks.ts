import type { InkLineDraft } from '@shared/api/ink-lines';
import type { ChartForm } from '@shared/domain/chart-form';
import { pinRmsLimit } from '@shared/domain/pin-rms-limit';
import { pixelToReading, type RegistrationFit } from '@shared/domain/registration';
import { AppError, HTTP } from '../errors/app-error';

/** Indexes named in an error's details, at most this many (a long trace can have thousands at fault). */
const MAX_NAMED = 20;
/** A knot may read up to a minute before the one before it: below what a reading resolves (common practice). */
const TIME_ORDER_TOLERANCE_HOURS = 1 / 60;

function isInside(point: { xPx: number; yPx: number }, image: { widthPx: number; heightPx: number }): boolean {
  return point.xPx >= 0 && point.yPx >= 0 && point.xPx <= image.widthPx && point.yPx <= image.heightPx;
}

function indexesWhere<T>(items: readonly T[], test: (item: T, index: number) => boolean): number[] {
  const found: number[] = [];
  items.forEach((item, index) => {
    if (test(item, index)) found.push(index);
  });
  return found;
}

/** Pins and knots must lie on the scan's image (before any fit: a pin off the image registers nothing real). */
export function checkInsideImage(draft: InkLineDraft, image: { widthPx: number; heightPx: number }): void {
  const pinsOutside = indexesWhere(draft.pins, (pin) => !isInside(pin, image));
  if (pinsOutside.length > 0) {
    throw new AppError(HTTP.unprocessable, 'pin_outside_image', `Pins ${pinsOutside.map((i) => i + 1).join(', ')} lie outside the scan (${image.widthPx} × ${image.heightPx} px).`, {
      pins: pinsOutside.slice(0, MAX_NAMED),
    });
  }
  const knotsOutside = indexesWhere(draft.knots, (knot) => !isInside(knot, image));
  if (knotsOutside.length > 0) {
    throw new AppError(HTTP.unprocessable, 'knot_outside_image', `${knotsOutside.length} knots lie outside the scan (${image.widthPx} × ${image.heightPx} px).`, {
      knots: knotsOutside.slice(0, MAX_NAMED),
      count: knotsOutside.length,
    });
  }
}

/** The registration must be good enough for the chart form: pin RMS under pinRmsLimit, naming the pins at fault. */
export function checkRegistration(form: ChartForm, fit: RegistrationFit): void {
  const limit = pinRmsLimit(form);
  if (fit.rmsHpa <= limit.hPa && fit.rmsMinutes <= limit.minutes) return;
  let atFault = fit.residuals.filter((r) => r.isOutlier || Math.abs(r.pressureHpa) > limit.hPa || Math.abs(r.minutes) > limit.minutes).map((r) => r.index);
  if (atFault.length === 0) {
    // No single pin is over the limit, yet together they are: name the worst one, relative to the limits.
    const worst = fit.residuals.reduce((a, b) => (Math.hypot(a.pressureHpa / limit.hPa, a.minutes / limit.minutes) >= Math.hypot(b.pressureHpa / limit.hPa, b.minutes / limit.minutes) ? a : b));
    atFault = [worst.index];
  }
  throw new AppError(
    HTTP.unprocessable,
    'pin_rms_over_limit',
    `The pins disagree by ${fit.rmsHpa.toFixed(2)} hPa and ${fit.rmsMinutes.toFixed(1)} min (RMS), more than this chart form allows (${limit.hPa.toFixed(2)} hPa, ${limit.minutes.toFixed(0)} min). Check pins ${atFault.map((i) => i + 1).join(', ')}.`,
    { pins: atFault, rmsHpa: fit.rmsHpa, rmsMinutes: fit.rmsMinutes, limitHpa: limit.hPa, limitMinutes: limit.minutes },
  );
}

/**
 * The knots, read through the fit, must run forward in time and stay inside the drum period (from the chart start
 * to drumHours after it, give or take one time grid step for a chart fitted early or taken off late).
 */
export function checkKnotTimes(form: ChartForm, fit: RegistrationFit, draft: InkLineDraft): void {
  const hours = draft.knots.map((knot) => pixelToReading(form, fit, knot.xPx, knot.yPx).hours);
  const backwards = indexesWhere(hours, (h, i) => i > 0 && h < hours[i - 1] - TIME_ORDER_TOLERANCE_HOURS);
  if (backwards.length > 0) {
    throw new AppError(HTTP.unprocessable, 'knots_out_of_time_order', `${backwards.length} knots run back in time along the chart; knots must follow the pen line from left to right.`, {
      knots: backwards.slice(0, MAX_NAMED),
      count: backwards.length,
    });
  }
  const marginHours = Math.max(1, form.gridHoursStep);
  const outside = indexesWhere(hours, (h) => h < -marginHours || h > form.drumHours + marginHours);
  if (outside.length > 0) {
    throw new AppError(HTTP.unprocessable, 'span_outside_drum_period', `${outside.length} knots read outside the drum period (0–${form.drumHours} h after the chart start).`, {
      knots: outside.slice(0, MAX_NAMED),
      count: outside.length,
      firstHours: hours[0],
      lastHours: hours[hours.length - 1],
    });
  }
}
