import { reduceLineToSeaLevel, reductionHeightM, seaLevelAssumptionText } from './sea-level-line';
import type { PlotPoint } from './plot-points';

const point = (pressureHpa: number, uncertaintyHpa: number | null): PlotPoint => ({
  time: '2026-03-02T00:00:00.000Z',
  timeMs: Date.UTC(2026, 2, 2),
  pressureHpa,
  flag: 'ok',
  uncertaintyHpa,
  inkLineId: 'a',
  flaggedShare: 0,
  minHpa: pressureHpa - 1,
  maxHpa: pressureHpa + 1,
  count: 1,
});

describe('reduceLineToSeaLevel', () => {
  it('when a station at 500 m reads 950 hPa at 15 °C with 10 hPa vapour pressure, then the line reads 1007.40 hPa', () => {
    // Check value of docs/references.md §4 [D]: 950.0 hPa, 500 m, 15 °C, es 10 hPa → 1007.40 hPa.
    const [reduced] = reduceLineToSeaLevel([point(950, 0.5)], { heightM: 500, temperatureC: 15, vapourPressureHpa: 10 });

    expect(reduced.pressureHpa).toBeCloseTo(1007.4, 2);
    expect(reduced.uncertaintyHpa).toBeCloseTo(0.5 * (reduced.pressureHpa / 950), 9);
    expect(reduced.minHpa).toBeLessThan(reduced.pressureHpa);
    expect(reduced.maxHpa).toBeGreaterThan(reduced.pressureHpa);
  });

  it('when a point has no uncertainty, then its reduced point has none either', () => {
    const [reduced] = reduceLineToSeaLevel([point(1000, null)], { heightM: 100, temperatureC: 20, vapourPressureHpa: 15 });

    // docs/references.md §4 [D]: 1000.0 hPa, 100 m, 20 °C, 15 hPa → 1011.63 hPa.
    expect(reduced.pressureHpa).toBeCloseTo(1011.63, 2);
    expect(reduced.uncertaintyHpa).toBeNull();
  });
});

describe('reductionHeightM', () => {
  it('when the barometer height is known, then it is used; else the elevation; else none', () => {
    expect(reductionHeightM({ barometerHeightM: 413.2, elevationM: 412 })).toBe(413.2);
    expect(reductionHeightM({ barometerHeightM: null, elevationM: 412 })).toBe(412);
    expect(reductionHeightM({ barometerHeightM: null, elevationM: null })).toBeNull();
  });
});

describe('seaLevelAssumptionText', () => {
  it('when the reduction is described, then it names the method, the height and both assumed values', () => {
    const text = seaLevelAssumptionText({ heightM: 413.2, temperatureC: 8, vapourPressureHpa: 0 }, 'barometer');

    expect(text).toContain('WMO-No. 8');
    expect(text).toContain('413.2 m (the barometer height on record)');
    expect(text).toContain('8 °C');
    expect(text).toContain('0 hPa');
  });
});
