import type { PinInput } from '@shared/api/ink-lines';
import type { RegistrationPin } from '@shared/domain/registration';

const HOUR_MS = 3_600_000;

/** The Bench's pins (ISO 8601 UTC times) as the registration takes them: hours after the chart-start line. */
export function toRegistrationPins(pins: readonly PinInput[], chartStartMs: number): RegistrationPin[] {
  return pins.map((pin) => ({ xPx: pin.xPx, yPx: pin.yPx, pressure: pin.pressure, hours: (Date.parse(pin.time) - chartStartMs) / HOUR_MS }));
}
