import { formatPressure, unitTicks } from './unit-ticks';

describe('unitTicks', () => {
  it('when the unit is hPa, then ticks are round hPa at their own places', () => {
    const ticks = unitTicks([990, 1010], 'hPa', 4);

    expect(ticks.map((tick) => tick.label)).toEqual(['990', '995', '1000', '1005', '1010']);
    expect(ticks[0].valueHpa).toBe(990);
  });

  it('when the unit is inHg, then ticks are round inHg placed at their hPa equivalents', () => {
    const ticks = unitTicks([1000, 1020], 'inHg', 4);

    expect(ticks.map((tick) => tick.label)).toEqual(['29.6', '29.8', '30.0']);
    // 29.8 inHg × 33.86389 hPa/inHg (NIST SP 811, docs/references.md §2).
    expect(ticks[1].valueHpa).toBeCloseTo(29.8 * 33.86389, 6);
  });
});

describe('formatPressure', () => {
  it.each([
    ['hPa', '1013.3 hPa'],
    // 1013.25 hPa = 29.92 inHg = 760.0 mmHg (docs/references.md §2).
    ['inHg', '29.92 inHg'],
    ['mmHg', '760.0 mmHg'],
  ] as const)('when the unit is %s, then 1013.25 hPa reads %s', (unit, expected) => {
    expect(formatPressure(1013.25, unit)).toBe(expected);
  });
});
