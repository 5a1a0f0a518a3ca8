import { convertPressure, fromHpa, isPressureUnit, type PressureUnit, toHpa } from './pressure-units';

describe('convertPressure', () => {
  // Factors (Pa per unit): NIST SP 811 (2008) Appendix B.8.
  it.each<[PressureUnit, number, number]>([
    ['hPa', 100, 0], // SI prefix, exact
    ['mbar', 100, 0], // NIST SP 811 B.8: millibar = 1.0 E+02 Pa, exact
    ['kPa', 1000, 0], // SI prefix, exact
    ['inHg', 3386.389, 3], // NIST SP 811 B.8: inch of mercury, conventional = 3.386 389 E+03 Pa
    ['mmHg', 133.3224, 4], // NIST SP 811 B.8: millimetre of mercury, conventional = 1.333 224 E+02 Pa
  ])('when one %s is converted to hPa, then it equals the NIST factor %f Pa', (unit, pascals, digits) => {
    const hpa = toHpa(1, unit);

    expect(hpa * 100).toBeCloseTo(pascals, digits);
  });

  // Check values derived from the NIST SP 811 B.8 factors (docs/references.md §2, [D]).
  it.each<[number, PressureUnit, PressureUnit, number, number]>([
    [1013.25, 'hPa', 'inHg', 29.9213, 4],
    [1013.25, 'hPa', 'mmHg', 759.9999, 4],
    [1013.25, 'hPa', 'kPa', 101.325, 9],
    [1000, 'hPa', 'inHg', 29.53, 4],
    [1000, 'hPa', 'mmHg', 750.062, 3], // also WMO-No. 8 Ch. 3 §3.1.2: 1 hPa = 0.750 062 (mm Hg)n
    [29.92, 'inHg', 'hPa', 1013.208, 3],
    [30.0, 'inHg', 'hPa', 1015.917, 3],
    [28.0, 'inHg', 'hPa', 948.189, 3],
    [31.0, 'inHg', 'hPa', 1049.781, 3],
    [950, 'mbar', 'inHg', 28.0535, 4],
    [1050, 'hPa', 'inHg', 31.0065, 4],
  ])('when %f %s is converted to %s, then it gives %f (NIST SP 811 B.8, derived)', (value, from, to, expected, digits) => {
    const converted = convertPressure(value, from, to);

    expect(converted).toBeCloseTo(expected, digits);
  });

  it.each<PressureUnit>(['hPa', 'mbar', 'kPa', 'inHg', 'mmHg'])('when %s goes to hPa and back, then the value returns', (unit) => {
    const value = 29.87;

    const back = fromHpa(toHpa(value, unit), unit);

    expect(back).toBeCloseTo(value, 12);
  });
});

describe('isPressureUnit', () => {
  it.each<[unknown, boolean]>([
    ['hPa', true],
    ['inHg', true],
    ['psi', false],
    ['HPA', false],
    [100, false],
    [null, false],
  ])('when given %p, then it answers %p', (value, expected) => {
    const answer = isPressureUnit(value);

    expect(answer).toBe(expected);
  });
});
