import { type CheckReading, correctPressureHpa, fitInstrumentCorrection } from './instrument-correction';

const hourMs = 3_600_000;
const chartOn = Date.UTC(2026, 2, 2, 9, 0);

function reading(hours: number, chartPressureHpa: number, barometerPressureHpa: number): CheckReading {
  return { timeMs: chartOn + hours * hourMs, chartPressureHpa, barometerPressureHpa };
}

describe('fitInstrumentCorrection', () => {
  it('when there are no check readings, then pressures pass unchanged', () => {
    const correction = fitInstrumentCorrection([]);

    expect(correction.method).toBe('none');
    expect(correctPressureHpa(correction, chartOn, 1001.3)).toBe(1001.3);
  });

  it('when one check reading is given, then its offset applies everywhere', () => {
    const correction = fitInstrumentCorrection([reading(24, 1000.0, 1001.2)]);

    expect(correction.method).toBe('offset');
    expect(correctPressureHpa(correction, chartOn + 100 * hourMs, 990)).toBeCloseTo(991.2, 9);
    expect(correction.residuals[0].residualHpa).toBeNull();
  });

  it.each<[number, number]>([
    [-10, 1.0],
    [0, 1.0],
    [12, 1.3],
    [24, 1.6],
    [72, 1.0],
    [200, 0.4],
  ])('when offsets drift 1.0 → 1.6 → 0.4 hPa at 0, 24, 120 h, then at %f h the offset is %f hPa', (hours, expectedOffset) => {
    const correction = fitInstrumentCorrection([reading(120, 1010, 1010.4), reading(0, 1000, 1001.0), reading(24, 995, 996.6)]);

    const corrected = correctPressureHpa(correction, chartOn + hours * hourMs, 1000);

    expect(correction.method).toBe('drift');
    expect(corrected - 1000).toBeCloseTo(expectedOffset, 9);
  });

  it('when drift readings are given, then each residual is what the other readings fail to predict', () => {
    const correction = fitInstrumentCorrection([reading(0, 1000, 1001.0), reading(24, 995, 996.6), reading(48, 990, 991.0)]);

    // Middle predicted 1.0 from its neighbours, shows 1.6 → +0.6; ends held at the nearest other reading.
    expect(correction.residuals.map((r) => r.residualHpa)).toEqual([expect.closeTo(-0.6, 9), expect.closeTo(0.6, 9), expect.closeTo(-0.6, 9)]);
    expect(correction.rmsHpa).toBeCloseTo(0.6, 9);
  });

  it('when readings span 40 hPa and the chart reads 2 % open with a 1 hPa offset, then the scale fit recovers a and b', () => {
    // Barometer p = −19 + 1.02·chart (invented instrument).
    const readings = [980, 995, 1005, 1020].map((chart, i) => reading(24 * i, chart, -19 + 1.02 * chart));

    const correction = fitInstrumentCorrection(readings, { fitScale: true });

    expect(correction.method).toBe('scale');
    expect(correction.scale?.factor).toBeCloseTo(1.02, 9);
    expect(correction.scale?.offsetHpa).toBeCloseTo(-19, 6);
    expect(correctPressureHpa(correction, chartOn, 1000)).toBeCloseTo(1001, 6);
    expect(correction.rmsHpa).toBeLessThan(1e-9);
  });

  it('when a scale fit has one reading off the line, then its residual shows it', () => {
    const readings = [980, 995, 1005, 1020].map((chart, i) => reading(24 * i, chart, chart + 1 + (i === 2 ? 0.8 : 0)));

    const correction = fitInstrumentCorrection(readings, { fitScale: true });

    const residuals = correction.residuals.map((r) => r.residualHpa ?? 0);
    expect(Math.abs(residuals[2])).toBe(Math.max(...residuals.map(Math.abs)));
    expect(residuals.reduce((s, r) => s + r, 0)).toBeCloseTo(0, 9);
  });

  it.each<[string, CheckReading[], { fitScale?: boolean }, string]>([
    ['a scale fit from readings within 5 hPa', [reading(0, 1000, 1001), reading(24, 1003, 1004), reading(48, 1005, 1006)], { fitScale: true }, 'scale_needs_spread'],
    ['a scale fit from two readings', [reading(0, 980, 981), reading(24, 1020, 1021)], { fitScale: true }, 'scale_needs_spread'],
    ['two readings at one time with different offsets', [reading(0, 1000, 1001), reading(0, 1000, 1003)], {}, 'contradictory_readings'],
    ['a reading without a barometer value', [reading(0, 1000, Number.NaN)], {}, 'invalid_reading'],
  ])('when given %s, then it throws', (_label, readings, options, code) => {
    const act = () => fitInstrumentCorrection(readings, options);

    expect(act).toThrow(expect.objectContaining({ code }));
  });
});
