import type { ChartForm } from './chart-form';
import { applyUncertainty, combineUncertaintyHpa, lineCentringUncertaintyHpa, type UncertaintyBudget } from './point-uncertainty';
import type { RegularPoint } from './resample';

const budget: UncertaintyBudget = {
  registrationRmsHpa: 0.3,
  registrationRmsMinutes: 6,
  lineCentringHpa: 0.4,
  instrumentRmsHpa: 1.2,
  clockRmsMinutes: 8,
};

describe('combineUncertaintyHpa', () => {
  it.each<[number, number]>([
    // Root-sum-square (GUM, JCGM 100:2008 §5.1, from memory): √(0.3² + 0.4² + 1.2²) = 1.3 hPa with a flat trace.
    [0, 1.3],
    // 6 and 8 minutes → 10 minutes = 1/6 h; at 6 hPa/h that adds 1 hPa: √(1.3² + 1²).
    [6, Math.sqrt(1.69 + 1)],
    [-6, Math.sqrt(1.69 + 1)],
  ])('when the trace slopes %f hPa/h, then the uncertainty is %f hPa', (slope, expected) => {
    const u = combineUncertaintyHpa(budget, slope);

    expect(u).toBeCloseTo(expected, 9);
  });
});

describe('lineCentringUncertaintyHpa', () => {
  it.each<[ChartForm['pressureUnit'], number, number, number]>([
    // Rectangular distribution, u = (w/2)/√3 (GUM §4.3.7, from memory): 0.6 mm line at 0.9 mm/hPa.
    ['hPa', 0.9, 0.6, 0.3 / Math.sqrt(3) / 0.9],
    // Same line on an inHg chart at 30 mm/inHg; 1 inHg = 33.86389 hPa (NIST SP 811 B.8).
    ['inHg', 30, 0.6, (0.3 / Math.sqrt(3) / 30) * 33.86389],
  ])('when the chart is in %s at %f mm per unit and the line is %f mm wide, then the centring error is %f hPa', (pressureUnit, mmPerUnit, lineWidthMm, expected) => {
    const form = { pressureUnit, mmPerUnit } as ChartForm;

    const u = lineCentringUncertaintyHpa(form, lineWidthMm);

    expect(u).toBeCloseTo(expected, 6);
  });
});

describe('applyUncertainty', () => {
  const hourMs = 3_600_000;
  const point = (hour: number, pressureHpa: number | null, flag: RegularPoint['flag'] = 'ok', uncertaintyHpa: number | null = null): RegularPoint => ({
    timeMs: hour * hourMs,
    pressureHpa,
    flag,
    uncertaintyHpa,
  });

  it('when points rise 6 hPa/h, then each gets the budget with the slope term, and gaps and off-scale stay null', () => {
    const points = [point(0, 1000), point(1, 1006), point(2, 1012), point(3, null, 'gap'), point(4, 1050, 'off_scale')];

    const result = applyUncertainty(points, budget);

    expect(result.map((p) => p.uncertaintyHpa)).toEqual([
      expect.closeTo(Math.sqrt(2.69), 9),
      expect.closeTo(Math.sqrt(2.69), 9),
      expect.closeTo(Math.sqrt(2.69), 9),
      null,
      null,
    ]);
  });

  it('when a point already carries 0.5 hPa, then it is combined by root-sum-square', () => {
    const points = [point(0, 1000, 'ok', 0.5)];

    const result = applyUncertainty(points, budget);

    expect(result[0].uncertaintyHpa).toBeCloseTo(Math.sqrt(1.69 + 0.25), 9);
  });
});
