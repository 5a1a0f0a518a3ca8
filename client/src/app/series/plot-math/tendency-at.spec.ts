import type { PlotPoint } from './plot-points';
import { tendencyAt } from './tendency-at';

const HOUR_MS = 3_600_000;
const hourly = (values: number[]): PlotPoint[] =>
  values.map((pressureHpa, k) => ({ time: '', timeMs: k * HOUR_MS, pressureHpa, flag: 'ok', uncertaintyHpa: 0.3, inkLineId: 'a', flaggedShare: 0, minHpa: pressureHpa, maxHpa: pressureHpa, count: 1 }));

describe('tendencyAt', () => {
  it('when the pressure rises steadily over three hours at an hourly step, then a = 2 and ppp is the rise in tenths', () => {
    // docs/references.md §5: a = 2 "rising, steadily or not", higher; 1.5 hPa in 3 h → ppp 015, group 52015.
    const tendency = tendencyAt(hourly([1000, 1000.5, 1001, 1001.5]), 'hourly', 3 * HOUR_MS);

    expect(tendency).toMatchObject({ characteristic: 2, ppp: 15, group: '52015' });
  });

  it('when the step is daily, then the tendency is too coarse to read', () => {
    expect(tendencyAt(hourly([1000, 1001, 1002, 1003]), 'daily', 3 * HOUR_MS)).toBe('too_coarse');
  });

  it('when the three hours before the time are not all there, then there is no tendency', () => {
    expect(tendencyAt(hourly([1000, 1001]), 'raw', 3 * HOUR_MS)).toBeNull();
  });
});
