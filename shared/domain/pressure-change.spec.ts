import { pressureChange } from './pressure-change';

const hourMs = 3_600_000;
const t0 = Date.UTC(2026, 2, 3, 12, 0);
const hourly = (values: (number | null)[]) => values.map((pressureHpa, k) => ({ timeMs: t0 + k * hourMs, pressureHpa }));

describe('pressureChange', () => {
  it('when pressure rises 1012.0 → 1015.6 hPa over 3 h, then the change is +3.6 hPa at 1.2 hPa/h', () => {
    // Arithmetic of the definition (common practice): change = p(t2) − p(t1), rate = change ÷ hours.
    const change = pressureChange(hourly([1012.0, 1013.0, 1014.4, 1015.6]), t0, t0 + 3 * hourMs);

    expect(change?.changeHpa).toBeCloseTo(3.6, 9);
    expect(change?.rateHpaPerHour).toBeCloseTo(1.2, 9);
  });

  it('when an end falls between samples, then it is interpolated linearly', () => {
    // 1010 → 1008 over an hour: half-way is 1009 (common practice, linear interpolation between readings).
    const change = pressureChange(hourly([1010, 1008]), t0, t0 + 0.5 * hourMs);

    expect(change?.changeHpa).toBeCloseTo(-1, 9);
    expect(change?.rateHpaPerHour).toBeCloseTo(-2, 9);
  });

  it('when a fall of 1.6 hPa in 3 h is measured, then it reads as "falling" in the Met Office 3-hour terms', () => {
    // UK Met Office Shipping Forecast terms, 1.6–3.5 hPa in 3 h is "falling" (docs/references.md §5).
    const change = pressureChange(hourly([1012.0, 1011.4, 1011.0, 1010.4]), t0, t0 + 3 * hourMs);

    expect(Math.abs(change?.changeHpa ?? 0)).toBeGreaterThanOrEqual(1.6 - 1e-9);
    expect(Math.abs(change?.changeHpa ?? 0)).toBeLessThanOrEqual(3.5);
  });

  it('when an end lies in a gap or outside the samples, then there is no change', () => {
    expect(pressureChange(hourly([1010, null, 1012]), t0, t0 + 1.5 * hourMs)).toBeNull();
    expect(pressureChange(hourly([1010, 1011]), t0 - hourMs, t0 + hourMs)).toBeNull();
    expect(pressureChange(hourly([1010, 1011]), t0 + hourMs, t0)).toBeNull();
  });

  it('when samples are further apart than the largest gap, then the span between them is unknown', () => {
    const sparse = [
      { timeMs: t0, pressureHpa: 1010 },
      { timeMs: t0 + 3 * hourMs, pressureHpa: 1013 },
    ];

    expect(pressureChange(sparse, t0, t0 + 2 * hourMs)).toBeNull();
    expect(pressureChange(sparse, t0, t0 + 3 * hourMs)?.changeHpa).toBeCloseTo(3, 9);
  });
});
