/**
 * Pressure unit conversions. Factors from NIST SP 811 (2008), Appendix B.8:
 * inHg (conventional) = 3386.389 Pa, mmHg (conventional) = 133.322387415 Pa (13 595.1 kg/m³ × gn × 1 mm),
 * mbar = hPa = 100 Pa exactly, kPa = 1000 Pa exactly.
 */
export const PRESSURE_UNITS = ['hPa', 'mbar', 'kPa', 'inHg', 'mmHg'] as const;
/** One of PRESSURE_UNITS. */
export type PressureUnit = (typeof PRESSURE_UNITS)[number];

const PASCALS_PER_UNIT: Record<PressureUnit, number> = {
  hPa: 100,
  mbar: 100,
  kPa: 1000,
  inHg: 3386.389,
  mmHg: 133.322387415,
};

/** True when x is one of PRESSURE_UNITS (exact, case-sensitive). */
export function isPressureUnit(x: unknown): x is PressureUnit {
  return typeof x === 'string' && (PRESSURE_UNITS as readonly string[]).includes(x);
}

/** Converts a pressure from one unit to another (any of PRESSURE_UNITS). */
export function convertPressure(value: number, from: PressureUnit, to: PressureUnit): number {
  if (from === to) return value;
  return (value * PASCALS_PER_UNIT[from]) / PASCALS_PER_UNIT[to];
}

/** Pressure in the given unit → hPa. */
export function toHpa(value: number, unit: PressureUnit): number {
  return convertPressure(value, unit, 'hPa');
}

/** hPa → pressure in the given unit. */
export function fromHpa(valueHpa: number, unit: PressureUnit): number {
  return convertPressure(valueHpa, 'hPa', unit);
}
