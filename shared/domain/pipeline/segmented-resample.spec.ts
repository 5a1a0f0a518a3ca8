import { resampleStretches, type StretchSample } from './segmented-resample';

const HOUR_MS = 3_600_000;
const T0 = Date.parse('2026-03-02T00:00:00Z');

function line(fromHours: number, toHours: number, stretch: number): StretchSample[] {
  const samples: StretchSample[] = [];
  for (let h = fromHours; h <= toHours + 1e-9; h += 0.1) samples.push({ timeMs: T0 + h * HOUR_MS, pressureHpa: 1000 + h, stretch });
  return samples;
}

describe('resampleStretches', () => {
  it('when the line breaks at a flagged gap, then the hours between the stretches are gaps even if the break is short', () => {
    const samples = [...line(0, 2.95, 0), ...line(3.3, 6, 1)];

    const points = resampleStretches(samples, { stepMinutes: 60, maxGapMinutes: 60 });

    expect(points.map((p) => p.flag)).toEqual(['ok', 'ok', 'ok', 'gap', 'ok', 'ok', 'ok']);
    expect(points[3]).toEqual({ timeMs: T0 + 3 * HOUR_MS, pressureHpa: null, flag: 'gap', uncertaintyHpa: null });
    expect(points[4].pressureHpa).toBeCloseTo(1004, 6);
  });

  it('when ink is missing after chart on, then the hours from chart on to the first sample are gaps', () => {
    const samples = line(2.5, 5, 0);

    const points = resampleStretches(samples, { stepMinutes: 60, maxGapMinutes: 60, gapFromMs: T0 });

    expect(points.slice(0, 3).map((p) => [p.timeMs, p.flag])).toEqual([
      [T0, 'gap'],
      [T0 + HOUR_MS, 'gap'],
      [T0 + 2 * HOUR_MS, 'gap'],
    ]);
    expect(points[3].flag).toBe('ok');
  });
});
