import type { StationSeries } from '@shared/api/series-query';

import { nearestPointIndex, pointsInView, rangeBandPath, toPlotPoints } from './plot-points';

const STATION = { stationId: 's', stationCode: 'KRO', stationName: 'Kestrel Ridge', version: 1, builtAt: null };

describe('toPlotPoints', () => {
  it('when the answer is raw, then each point keeps its flag and a flagged one counts as fully flagged', () => {
    const series: StationSeries = {
      ...STATION,
      points: [
        { time: '2026-03-02T00:00:00.000Z', pressureHpa: 1000, flag: 'ok', uncertaintyHpa: 0.3, inkLineId: 'a' },
        { time: '2026-03-02T01:00:00.000Z', pressureHpa: 1001, flag: 'suspect', uncertaintyHpa: 0.4, inkLineId: 'a' },
      ],
    };

    const points = toPlotPoints(series);

    expect(points.map((point) => [point.flag, point.flaggedShare, point.minHpa, point.count])).toEqual([
      ['ok', 0, 1000, 1],
      ['suspect', 1, 1001, 1],
    ]);
    expect(points[1].timeMs).toBe(Date.UTC(2026, 2, 2, 1));
  });

  it('when the answer is buckets, then each is plotted at its value with its range and flagged share', () => {
    const series: StationSeries = {
      ...STATION,
      points: [{ time: '2026-03-02T00:00:00.000Z', pressureHpa: 1001, meanHpa: 1001, minHpa: 998, maxHpa: 1004, count: 24, flaggedShare: 0.25, uncertaintyHpa: 0.5 }],
    };

    const [point] = toPlotPoints(series);

    expect(point).toMatchObject({ pressureHpa: 1001, flag: 'ok', minHpa: 998, maxHpa: 1004, flaggedShare: 0.25, count: 24, uncertaintyHpa: 0.5 });
  });
});

describe('nearestPointIndex', () => {
  const points = [{ timeMs: 0 }, { timeMs: 10 }, { timeMs: 20 }];

  it.each([
    [-5, 0],
    [4, 0],
    [6, 1],
    [15, 1],
    [16, 2],
    [99, 2],
  ])('when the time is %d, then the nearest is index %d', (timeMs, expected) => {
    expect(nearestPointIndex(points, timeMs)).toBe(expected);
  });

  it('when there are no points, then it is -1', () => {
    expect(nearestPointIndex([], 3)).toBe(-1);
  });
});

describe('pointsInView', () => {
  const points = [0, 10, 20, 30, 40].map((timeMs) => ({ timeMs }));

  it('when the view is inside, then its points and one neighbour each side are kept', () => {
    expect(pointsInView(points, 12, 28).map((point) => point.timeMs)).toEqual([10, 20, 30]);
  });

  it('when the view is after every point, then the last one is kept so the line can reach in', () => {
    expect(pointsInView(points, 50, 60).map((point) => point.timeMs)).toEqual([40]);
  });
});

describe('rangeBandPath', () => {
  const day = (timeMs: number, minHpa: number, maxHpa: number) => ({ time: '', timeMs, pressureHpa: 0, flag: 'ok' as const, uncertaintyHpa: null, inkLineId: '', flaggedShare: 0, minHpa, maxHpa, count: 24 });

  it('when days run without a gap, then one closed shape goes along the maxima and back along the minima', () => {
    const path = rangeBandPath([day(0, 990, 1000), day(1, 992, 1004)], (t) => t * 10, (hPa) => hPa - 900, 1.5);

    expect(path).toBe('M0,100L10,104L10,92L0,90Z');
  });

  it('when days are further apart than the step allows, then the band is split in two', () => {
    const path = rangeBandPath([day(0, 990, 1000), day(1, 992, 1004), day(5, 995, 996), day(6, 994, 999)], (t) => t, (hPa) => hPa, 1.5);

    expect(path.match(/M/g)).toHaveLength(2);
  });
});
