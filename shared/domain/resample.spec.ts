import { resampleRegular, type RegularPoint, type TimedPressure } from './resample';

const hourMs = 3_600_000;
const minuteMs = 60_000;
const start = Date.UTC(2026, 0, 5, 0, 0, 0);

function sample(minutes: number, pressureHpa: number, extra: Partial<TimedPressure> = {}): TimedPressure {
  return { timeMs: start + minutes * minuteMs, pressureHpa, ...extra };
}

describe('resampleRegular', () => {
  it('when samples run every 20 minutes from 00:07 to 03:47, then hourly points fall on 01:00, 02:00, 03:00 with linear values', () => {
    const samples = Array.from({ length: 12 }, (_, k) => sample(7 + 20 * k, 1000 + 0.1 * (7 + 20 * k)));

    const points = resampleRegular(samples, { stepMinutes: 60, maxGapMinutes: 90, baseUncertaintyHpa: 0.3 });

    expect(points.map((p) => p.timeMs)).toEqual([start + hourMs, start + 2 * hourMs, start + 3 * hourMs]);
    points.forEach((p, k) => expect(p.pressureHpa).toBeCloseTo(1000 + 0.1 * 60 * (k + 1), 9));
    expect(points.map((p) => p.flag)).toEqual(['ok', 'ok', 'ok']);
    expect(points.map((p) => p.uncertaintyHpa)).toEqual([0.3, 0.3, 0.3]);
  });

  it('when samples are out of order, then they are sorted before interpolation', () => {
    const samples = [sample(70, 1002), sample(-10, 1000), sample(130, 1004)];

    const points = resampleRegular(samples, { stepMinutes: 60, maxGapMinutes: 90 });

    const expected = [1000 + (10 / 80) * 2, 1000 + (70 / 80) * 2, 1002 + (50 / 60) * 2];
    points.forEach((p, k) => expect(p.pressureHpa).toBeCloseTo(expected[k], 9));
    expect(points).toHaveLength(3);
  });

  it.each<[string, TimedPressure[], Partial<RegularPoint>]>([
    ['bracketing samples 30 min apart (≤ step)', [sample(45, 1000), sample(75, 1003)], { flag: 'ok', pressureHpa: 1001.5 }],
    ['bracketing samples 100 min apart (> step, ≤ max gap)', [sample(0.5, 1000), sample(100.5, 1010)], { flag: 'interpolated' }],
    ['bracketing samples 200 min apart (> max gap)', [sample(-100, 1000), sample(100, 1010)], { flag: 'gap', pressureHpa: null, uncertaintyHpa: null }],
    ['an off-scale sample on either side', [sample(50, 1050, { isOffScale: true }), sample(70, 1050)], { flag: 'off_scale', pressureHpa: 1050, uncertaintyHpa: null }],
    ['a low-confidence sample on either side', [sample(50, 1000), sample(70, 1002, { confidence: 0.2 })], { flag: 'suspect', pressureHpa: 1001 }],
    ['confidences at or above the threshold', [sample(50, 1000, { confidence: 0.5 }), sample(70, 1002, { confidence: 0.9 })], { flag: 'ok' }],
    ['a bracketing span marked as a bridge, though short', [sample(50, 1000, { bridgesToNext: true }), sample(70, 1002)], { flag: 'interpolated', pressureHpa: 1001 }],
    ['a bridge mark on the later sample only (it bridges onwards, not back)', [sample(50, 1000), sample(70, 1002, { bridgesToNext: true })], { flag: 'ok' }],
    ['a sample exactly on the clock time with far neighbours', [sample(-200, 990), sample(60, 1000), sample(300, 1010)], { flag: 'ok', pressureHpa: 1000 }],
  ])('when the 01:00 point has %s, then its flag and value follow', (_label, samples, expected) => {
    const points = resampleRegular(samples, { stepMinutes: 60, maxGapMinutes: 180, baseUncertaintyHpa: 0.4 });

    const point = points.find((p) => p.timeMs === start + hourMs);
    expect(point).toMatchObject(expected);
  });

  it('when the step is 10 minutes, then points sit on exact 10-minute clock times', () => {
    const samples = [sample(3, 1000), sample(37, 1003.4)];

    const points = resampleRegular(samples, { stepMinutes: 10, maxGapMinutes: 60 });

    expect(points.map((p) => (p.timeMs - start) / minuteMs)).toEqual([10, 20, 30]);
    expect(points[1].pressureHpa).toBeCloseTo(1001.7, 9);
  });

  it.each<[string, TimedPressure[]]>([
    ['no samples', []],
    ['one sample between clock times', [sample(10, 1000)]],
    ['samples that do not span a clock time', [sample(10, 1000), sample(50, 1001)]],
  ])('when given %s, then no points result', (_label, samples) => {
    const points = resampleRegular(samples, { stepMinutes: 60, maxGapMinutes: 90 });

    expect(points).toEqual([]);
  });

  it('when the step is not positive, then it throws a RangeError', () => {
    const act = () => resampleRegular([sample(0, 1000)], { stepMinutes: 0, maxGapMinutes: 60 });

    expect(act).toThrow(RangeError);
  });
});
