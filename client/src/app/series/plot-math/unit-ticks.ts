import { scaleLinear } from 'd3-scale';
import { fromHpa, toHpa, type PressureUnit } from '@shared/domain/pressure-units';

/** Decimals a pressure is shown with in each unit (about 0.1 hPa of resolution, common practice). */
export const UNIT_DECIMALS: Readonly<Record<PressureUnit, number>> = { hPa: 1, mbar: 1, kPa: 2, inHg: 2, mmHg: 1 };

/**
 * Round ticks in the chosen unit over a pressure domain held in hPa, each placed back at its hPa value:
 * the plot's y scale stays in hPa whatever unit the labels read.
 */
export function unitTicks(domainHpa: readonly [number, number], unit: PressureUnit, count: number): { valueHpa: number; label: string }[] {
  const low = fromHpa(Math.min(...domainHpa), unit);
  const high = fromHpa(Math.max(...domainHpa), unit);
  const values = scaleLinear().domain([low, high]).ticks(count);
  const step = values.length > 1 ? values[1] - values[0] : 1;
  const decimals = Math.max(0, -Math.floor(Math.log10(step) + 1e-9));
  return values.map((value) => ({ valueHpa: toHpa(value, unit), label: value.toFixed(decimals) }));
}

/** A pressure in the chosen unit with its usual decimals and the unit: "1013.2 hPa", "29.92 inHg". */
export function formatPressure(valueHpa: number, unit: PressureUnit): string {
  return `${fromHpa(valueHpa, unit).toFixed(UNIT_DECIMALS[unit])} ${unit}`;
}
