import type { PlotBox } from '../../shared/pressure-plot/plot-scales';
import { labelWidth } from '../plot-math/tick-labels';
import type { PlotPoint } from '../plot-math/plot-points';
import { detailTicks, drawLines, type StationLine } from './detail-lines';

const BOX: PlotBox = { width: 960, height: 392, marginLeft: 60, marginRight: 16, marginTop: 24, marginBottom: 40 };
const HOUR_MS = 3_600_000;

function point(timeMs: number, pressureHpa: number, extra: Partial<PlotPoint> = {}): PlotPoint {
  return { time: new Date(timeMs).toISOString(), timeMs, pressureHpa, flag: 'ok', uncertaintyHpa: 0.3, inkLineId: 'a', flaggedShare: 0, minHpa: pressureHpa, maxHpa: pressureHpa, count: 1, ...extra };
}

function line(points: PlotPoint[], slot = 0): StationLine {
  return { stationId: `s${slot}`, label: `Station ${slot}`, slot, points };
}

describe('drawLines', () => {
  it('when a station has a gap longer than the step allows, then its line is lifted and the gap gets its brackets', () => {
    const points = [0, 1, 2, 8, 9].map((hour) => point(hour * HOUR_MS, 1000 + hour));

    const { drawn } = drawLines([line(points)], [0, 9 * HOUR_MS], BOX, 3 * HOUR_MS);

    expect(drawn[0].line.match(/M/g)).toHaveLength(2);
    expect(drawn[0].gaps).toHaveLength(1);
    expect(drawn[0].band).not.toBe('');
  });

  it('when raw points carry flags, then each marked flag gets its mark and ok points none', () => {
    const points = [point(0, 1000), point(HOUR_MS, 1001, { flag: 'suspect' }), point(2 * HOUR_MS, 1002, { flag: 'interpolated' })];

    const { drawn } = drawLines([line(points)], [0, 2 * HOUR_MS], BOX, 3 * HOUR_MS);

    expect(drawn[0].marks.map((mark) => mark.flag)).toEqual(['suspect', 'interpolated']);
  });

  it('when means hold flagged points, then bars along the foot grow with their share', () => {
    const day = 24 * HOUR_MS;
    const points = [point(0, 1000, { count: 24, flaggedShare: 0 }), point(day, 1001, { count: 24, flaggedShare: 0.5 }), point(2 * day, 1002, { count: 24, flaggedShare: 1 })];

    const { drawn } = drawLines([line(points)], [0, 2 * day], BOX, 3 * day);

    expect(drawn[0].flaggedBars.map((bar) => bar.share)).toEqual([0.5, 1]);
    expect(drawn[0].flaggedBars[1].height).toBeGreaterThan(drawn[0].flaggedBars[0].height);
  });

  it('when two stations are overlaid, then the pressure axis holds both', () => {
    const { scales } = drawLines([line([point(0, 990), point(HOUR_MS, 991)]), line([point(0, 1020), point(HOUR_MS, 1021)], 1)], [0, HOUR_MS], BOX, 3 * HOUR_MS);

    const [low, high] = scales.y.domain();
    expect(low).toBeLessThanOrEqual(990 - 0.3);
    expect(high).toBeGreaterThanOrEqual(1021 + 0.3);
  });
});

describe('detailTicks', () => {
  it.each([
    ['a century', Date.UTC(1900, 0, 1), Date.UTC(2000, 0, 1)],
    ['a month', Date.UTC(2026, 2, 1), Date.UTC(2026, 3, 1)],
    ['a day', Date.UTC(2026, 2, 3), Date.UTC(2026, 2, 4)],
    ['forty minutes', Date.UTC(2026, 2, 3, 12), Date.UTC(2026, 2, 3, 12, 40)],
  ])('when the view spans %s, then the time labels never touch and stay inside the plot', (_name, fromMs, toMs) => {
    const { scales } = drawLines([line([point(fromMs, 1000), point(toMs, 1010)])], [fromMs, toMs], BOX, Number.POSITIVE_INFINITY);

    const { x } = detailTicks(scales, BOX, 'hPa');

    expect(x.length).toBeGreaterThanOrEqual(3);
    for (let k = 1; k < x.length; k++) expect(x[k].at - labelWidth(x[k].label) / 2).toBeGreaterThan(x[k - 1].at + labelWidth(x[k - 1].label) / 2);
    for (const tick of x) expect(tick.at + labelWidth(tick.label) / 2).toBeLessThanOrEqual(BOX.width);
  });

  it('when the unit is mmHg, then the pressure labels are mmHg, at least a line apart, and below the unit name', () => {
    const { scales } = drawLines([line([point(0, 990), point(HOUR_MS, 1030)])], [0, HOUR_MS], BOX, 3 * HOUR_MS);

    const { y } = detailTicks(scales, BOX, 'mmHg');

    // 990–1030 hPa is about 742.6–772.6 mmHg (docs/references.md §2).
    expect(Number(y[0].label)).toBeGreaterThan(740);
    expect(Number(y[y.length - 1].label)).toBeLessThan(775);
    const sorted = [...y].sort((a, b) => a.at - b.at);
    for (let k = 1; k < sorted.length; k++) expect(sorted[k].at - sorted[k - 1].at).toBeGreaterThanOrEqual(12);
    for (const tick of y) expect(tick.at).toBeGreaterThanOrEqual(BOX.marginTop - 0.5);
  });
});
