/**
 * The Pin step's live check of the pins placed so far: residuals, the pin the others disown, and the ghost grid
 * (ghost-grid.ts) of the fit.
 */
import type { ChartForm } from './chart-form';
import { ghostGrid, type GhostGridLine } from './ghost-grid';
import { pinRmsLimit, type PinRmsLimit } from './pin-rms-limit';
import { toHpa } from './pressure-units';
import { fitRegistration, pixelToReading, RegistrationError, type RegistrationFit, type RegistrationPin } from './registration';

/** A pin's check against the grid fitted to all pins: its residual, and whether it is off the others. */
export interface PinCheck {
  /** Fitted minus typed, in hPa and minutes. */
  pressureHpa: number;
  minutes: number;
  /** Flagged by the leave-one-out search, or its own residual beyond half a printed grid step. */
  isOutlier: boolean;
}

/** The Pin step's live check: nothing yet (under 3 pins), a fit with its ghost grid, or why the pins do not fit. */
export type PinsCheck =
  | { kind: 'too_few' }
  | { kind: 'fitted'; fit: RegistrationFit; pins: PinCheck[]; grid: GhostGridLine[] }
  | { kind: 'problem'; message: string };

const FEWEST_PINS_FOR_GRID = 3;

/**
 * Fits the pins placed so far (3 or more) and checks each: residuals in hPa and minutes, and an outlier
 * mark as soon as a pin is off, either by the leave-one-out search (enough pins) or by a residual beyond
 * half a printed grid step (the pin RMS limit), which catches a wrong line even with 3 or 4 pins.
 */
export function checkPins(form: ChartForm, pins: readonly RegistrationPin[]): PinsCheck {
  if (pins.length < FEWEST_PINS_FOR_GRID) return { kind: 'too_few' };
  let fit: RegistrationFit;
  try {
    fit = fitRegistration(form, [...pins]);
  } catch (error) {
    if (error instanceof RegistrationError) return { kind: 'problem', message: error.message };
    throw error;
  }
  const limit = pinRmsLimit(form);
  const leftOut = pins.length > FEWEST_PINS_FOR_GRID ? findLeftOutPin(form, pins, limit) : null;
  const checks = fit.residuals.map(
    (residual, index): PinCheck => ({
      pressureHpa: residual.pressureHpa,
      minutes: residual.minutes,
      // With 3 pins no pin can be told from the others: a residual beyond the limit marks the pin itself.
      isOutlier: residual.isOutlier || index === leftOut || (pins.length === FEWEST_PINS_FOR_GRID && isOff(residual, limit)),
    }),
  );
  return { kind: 'fitted', fit, pins: checks, grid: ghostGrid(form, fit) };
}

/**
 * The one pin the others disown: the pin whose removal leaves the best-agreeing rest (as findOutlierPins
 * chooses), when that rest agrees within the limit and the pin misses it by more. Least squares spreads one
 * bad pin's error over all (four corner pins share it equally), so the full fit's residuals cannot name it;
 * refitting without each pin in turn can. Null when no single pin explains the misfit.
 */
function findLeftOutPin(form: ChartForm, pins: readonly RegistrationPin[], limit: PinRmsLimit): number | null {
  const size = (miss: { pressureHpa: number; minutes: number }) => (miss.pressureHpa / limit.hPa) ** 2 + (miss.minutes / limit.minutes) ** 2;
  let best: { index: number; restMisfit: number; fit: RegistrationFit } | null = null;
  for (let index = 0; index < pins.length; index++) {
    let fit: RegistrationFit;
    try {
      fit = fitRegistration(form, pins.filter((_, i) => i !== index));
    } catch {
      // The rest alone cannot be fitted (on one line, say): this pin is needed, so it is not the odd one out.
      continue;
    }
    const restMisfit = fit.residuals.reduce((sum, residual) => sum + size(residual), 0);
    if (best === null || restMisfit < best.restMisfit) best = { index, restMisfit, fit };
  }
  if (best === null || best.fit.residuals.some((residual) => isOff(residual, limit))) return null;
  const pin = pins[best.index];
  const reading = pixelToReading(form, best.fit, pin.xPx, pin.yPx);
  const miss = { pressureHpa: toHpa(reading.pressure, form.pressureUnit) - toHpa(pin.pressure, form.pressureUnit), minutes: (reading.hours - pin.hours) * 60 };
  return isOff(miss, limit) ? best.index : null;
}

function isOff(miss: { pressureHpa: number; minutes: number }, limit: PinRmsLimit): boolean {
  return Math.abs(miss.pressureHpa) > limit.hPa || Math.abs(miss.minutes) > limit.minutes;
}

