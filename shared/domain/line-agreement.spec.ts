import { compareLines, type AgreementPoint } from './line-agreement';

const HOUR_MS = 3_600_000;

function line(values: readonly number[], uncertaintyHpa: number | null = 0.2, startHour = 0): AgreementPoint[] {
  return values.map((pressureHpa, i) => ({ timeMs: (startHour + i) * HOUR_MS, pressureHpa, uncertaintyHpa }));
}

describe('compareLines', () => {
  it('when two lines are the same, then RMS, largest difference and offset are 0 and nothing disagrees', () => {
    const a = line([1000, 1001, 1002, 1003]);

    const agreement = compareLines(a, a);

    expect(agreement).toEqual({ commonPointCount: 4, rmsHpa: 0, maxDifferenceHpa: 0, bestOffsetMinutes: 0, disagreeingPointCount: 0 });
  });

  it('when b differs by +0.3, −0.3, +0.3, −0.3 hPa, then RMS is 0.3 and the largest difference 0.3 (worked by hand)', () => {
    const a = line([1000, 1000, 1000, 1000]);
    const b = line([1000.3, 999.7, 1000.3, 999.7]);

    const agreement = compareLines(a, b);

    // √((0.09 · 4) / 4) = 0.3; with u = 0.2 hPa each, 2·√(0.04 + 0.04) = 0.566 hPa, so no point disagrees.
    expect(agreement.rmsHpa).toBeCloseTo(0.3, 9);
    expect(agreement.maxDifferenceHpa).toBeCloseTo(0.3, 9);
    expect(agreement.disagreeingPointCount).toBe(0);
  });

  it('when one time differs by 1 hPa with u = 0.2 hPa each, then that time disagrees beyond 2·√(u₁² + u₂²)', () => {
    const a = line([1000, 1000, 1000]);
    const b = line([1000, 1001, 1000]);

    const agreement = compareLines(a, b);

    expect(agreement.disagreeingPointCount).toBe(1);
    expect(agreement.maxDifferenceHpa).toBeCloseTo(1, 9);
  });

  it('when b is a steady rise read one hour late, then the best offset is +60 minutes', () => {
    // a(t) = 1000 + t; b(t) = a(t − 1 h): b read at t + 60 min equals a at t.
    const a = line(Array.from({ length: 24 }, (_, i) => 1000 + i));
    const b = line(Array.from({ length: 24 }, (_, i) => 999 + i));

    const agreement = compareLines(a, b);

    expect(agreement.rmsHpa).toBeCloseTo(1, 9);
    expect(agreement.bestOffsetMinutes).toBe(60);
  });

  it('when the lines share fewer than two times, then the figures are null', () => {
    const agreement = compareLines(line([1000, 1001], 0.2, 0), line([1000, 1001], 0.2, 1));

    // The one common time (hour 1) reads 1001 against 1000, a disagreement, but one time gives no RMS.
    expect(agreement).toEqual({ commonPointCount: 1, rmsHpa: null, maxDifferenceHpa: null, bestOffsetMinutes: null, disagreeingPointCount: 1 });
  });
});
