import type { SeriesFlag, SeriesPoint } from '@shared/api/series';

import { buildLinePath, createPlotScales, formatUtcTick, medianStepMs, type PlotBox } from './plot-scales';

const BOX: PlotBox = { width: 1000, height: 500, marginLeft: 50, marginRight: 50, marginTop: 0, marginBottom: 100 };

function point(time: string, pressureHpa: number, flag: SeriesFlag = 'ok', uncertaintyHpa: number | null = null): SeriesPoint {
  return { time, pressureHpa, flag, uncertaintyHpa, inkLineId: 'ink-1' };
}

describe('createPlotScales', () => {
  it('when given a range, then the first instant maps to the left edge and the last to the right', () => {
    const points = [point('2026-03-02T00:00:00Z', 1000), point('2026-03-03T00:00:00Z', 1020)];

    const { x } = createPlotScales(points, BOX);

    expect(x(new Date('2026-03-02T00:00:00Z'))).toBe(50);
    expect(x(new Date('2026-03-02T12:00:00Z'))).toBe(500);
    expect(x(new Date('2026-03-03T00:00:00Z'))).toBe(950);
  });

  it('when pressures span 1000 to 1020 hPa, then higher pressure is higher on screen and the ends are on the range', () => {
    const points = [point('2026-03-02T00:00:00Z', 1000), point('2026-03-03T00:00:00Z', 1020)];

    const { y } = createPlotScales(points, BOX);

    expect(y(1000)).toBe(400);
    expect(y(1020)).toBe(0);
    expect(y(1010)).toBe(200);
    expect(y.invert(100)).toBe(1015);
  });

  it('when a gap point has no real pressure, then it does not stretch the pressure axis', () => {
    const points = [point('2026-03-02T00:00:00Z', 1000), point('2026-03-02T01:00:00Z', 0, 'gap'), point('2026-03-03T00:00:00Z', 1020)];

    const { y } = createPlotScales(points, BOX);

    expect(y.domain()).toEqual([1000, 1020]);
  });

  it('when points carry an uncertainty, then the pressure axis holds the whole band', () => {
    const points = [point('2026-03-02T00:00:00Z', 1000, 'ok', 3), point('2026-03-03T00:00:00Z', 1020, 'ok', 3)];

    const { y } = createPlotScales(points, BOX);

    const [lowHpa, highHpa] = y.domain();
    expect(lowHpa).toBeLessThanOrEqual(997);
    expect(highHpa).toBeGreaterThanOrEqual(1023);
  });

  it('when the week is calm, then at least 10 hPa are shown around it', () => {
    const points = [point('2026-03-02T00:00:00Z', 1013), point('2026-03-03T00:00:00Z', 1014)];

    const { y } = createPlotScales(points, BOX);

    const [lowHpa, highHpa] = y.domain();
    expect(highHpa - lowHpa).toBeGreaterThanOrEqual(10);
    expect(lowHpa).toBeLessThanOrEqual(1013);
    expect(highHpa).toBeGreaterThanOrEqual(1014);
  });

  it('when a time domain is given, then it wins over the points', () => {
    const points = [point('2026-03-02T06:00:00Z', 1000)];
    const domainMs: [number, number] = [Date.parse('2026-03-02T00:00:00Z'), Date.parse('2026-03-03T00:00:00Z')];

    const { x } = createPlotScales(points, BOX, domainMs);

    expect(x(new Date('2026-03-02T06:00:00Z'))).toBe(275);
  });
});

describe('buildLinePath', () => {
  it('when a gap point sits between readings, then the line is lifted there and not bridged', () => {
    const points = [
      point('2026-03-02T00:00:00Z', 1000),
      point('2026-03-02T06:00:00Z', 1005),
      point('2026-03-02T12:00:00Z', 0, 'gap'),
      point('2026-03-02T18:00:00Z', 1015),
      point('2026-03-03T00:00:00Z', 1020),
    ];
    const scales = createPlotScales(points, BOX);

    const path = buildLinePath(points, scales, Number.POSITIVE_INFINITY);

    expect(path).toBe('M50,400L275,300M725,100L950,0');
  });

  it('when two readings are further apart than the longest step, then the line is lifted between them', () => {
    const points = [point('2026-03-02T00:00:00Z', 1000), point('2026-03-02T01:00:00Z', 1001), point('2026-03-02T09:00:00Z', 1010)];
    const scales = createPlotScales(points, BOX);

    const path = buildLinePath(points, scales, 3 * 3_600_000);

    expect(path.match(/M/g)).toHaveLength(2);
  });
});

describe('medianStepMs', () => {
  it('when readings are hourly with one long hole, then the typical step is an hour', () => {
    const points = ['00', '01', '02', '03', '09'].map((hour) => point(`2026-03-02T${hour}:00:00Z`, 1000));

    const stepMs = medianStepMs(points);

    expect(stepMs).toBe(3_600_000);
  });
});

describe('time tick labels', () => {
  const hourMs = 3_600_000;

  it.each([
    ['2026-03-08T00:00:00Z', 24 * hourMs, 'Sun 8 Mar'],
    ['2026-03-02T00:00:00Z', 24 * hourMs, 'Mon 2 Mar'],
    ['2026-03-02T06:00:00Z', 6 * hourMs, '06:00'],
    ['2026-03-03T00:00:00Z', 6 * hourMs, 'Tue 3 Mar'],
    ['2026-04-01T00:00:00Z', 30 * 24 * hourMs, 'Apr 2026'],
  ])('when the tick is %s with a step of %d ms, then its label is %s', (iso, stepMs, label) => {
    const text = formatUtcTick(new Date(iso), stepMs);

    expect(text).toBe(label);
  });
});
