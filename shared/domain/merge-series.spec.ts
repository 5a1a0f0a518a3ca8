import { type ChartSeries, mergeChartSeries } from './merge-series';
import type { RegularPoint } from './resample';

const hourMs = 3_600_000;
const t0 = Date.UTC(2026, 2, 9, 0, 0);

function chart(sourceId: string, onHour: number, offHour: number, pressureAt: (hour: number) => number | null, extra: (hour: number) => Partial<RegularPoint> = () => ({})): ChartSeries {
  const points: RegularPoint[] = [];
  for (let hour = Math.ceil(onHour); hour <= offHour; hour++) {
    const pressureHpa = pressureAt(hour);
    points.push({ timeMs: t0 + hour * hourMs, pressureHpa, flag: pressureHpa === null ? 'gap' : 'ok', uncertaintyHpa: pressureHpa === null ? null : 0.3, ...extra(hour) });
  }
  return { sourceId, chartOnMs: t0 + onHour * hourMs, chartOffMs: t0 + offHour * hourMs, points };
}

describe('mergeChartSeries', () => {
  // Chart A runs 0–10 h, chart B 8–20 h: they overlap from 8 to 10 h.
  it.each<[number, string]>([
    [7, 'A'],
    [8, 'A'], // A: 2 h from its off; B: 0 h from its on
    [9, 'A'], // A: 1 h; B: 1 h → tie goes to the first listed
    [10, 'B'], // A: 0 h; B: 2 h
    [11, 'B'],
  ])('when the charts overlap, then at %i h the point comes from chart %s, the more interior one', (hour, expected) => {
    const a = chart('A', 0, 10, () => 1000);
    const b = chart('B', 8, 20, () => 1000.2);

    const merged = mergeChartSeries([a, b]);

    expect(merged.find((p) => p.timeMs === t0 + hour * hourMs)?.sourceId).toBe(expected);
  });

  it('when two lines of one chart tie on span, then the one with the smaller uncertainty wins (project merge rule)', () => {
    const first = chart('first', 0, 10, () => 1000, () => ({ uncertaintyHpa: 0.4 }));
    const second = chart('second', 0, 10, () => 1000.1, () => ({ uncertaintyHpa: 0.2 }));

    const merged = mergeChartSeries([first, second], { coverageFactor: 2 });

    expect(new Set(merged.map((p) => p.sourceId))).toEqual(new Set(['second']));
    expect(merged.every((p) => p.flag === 'ok')).toBe(true);
  });

  it('when the charts agree within the combined uncertainty, then overlap points keep their flags', () => {
    const merged = mergeChartSeries([chart('A', 0, 10, () => 1000), chart('B', 8, 20, () => 1000.4)]);

    // |Δ| = 0.4 < √(0.3² + 0.3²) = 0.424 hPa.
    expect(merged.filter((p) => p.flag === 'suspect')).toEqual([]);
    expect(merged.find((p) => p.timeMs === t0 + 9 * hourMs)?.disagreementHpa).toBeCloseTo(0.4, 9);
    expect(merged).toHaveLength(21);
  });

  it('when the charts disagree by more than the combined uncertainty, then overlap points are suspect', () => {
    const merged = mergeChartSeries([chart('A', 0, 10, () => 1000), chart('B', 8, 20, () => 1000.5)]);

    const suspectHours = merged.filter((p) => p.flag === 'suspect').map((p) => (p.timeMs - t0) / hourMs);
    expect(suspectHours).toEqual([8, 9, 10]);
  });

  it('when the coverage factor is 2, then a 0.5 hPa disagreement is accepted', () => {
    const merged = mergeChartSeries([chart('A', 0, 10, () => 1000), chart('B', 8, 20, () => 1000.5)], { coverageFactor: 2 });

    expect(merged.filter((p) => p.flag === 'suspect')).toEqual([]);
  });

  it('when the interior chart has a gap, then the other chart’s value fills it', () => {
    const a = chart('A', 0, 10, () => 1000);
    const b = chart('B', 6, 20, (hour) => (hour === 9 ? null : 1000.1));

    const merged = mergeChartSeries([a, b]);

    const at9 = merged.find((p) => p.timeMs === t0 + 9 * hourMs);
    expect(at9).toMatchObject({ sourceId: 'A', pressureHpa: 1000, flag: 'ok' });
  });

  it('when the interior chart is off scale, then the on-scale chart wins', () => {
    const a = chart('A', 0, 10, () => 1000);
    const b = chart('B', 6, 20, () => 1000, (hour) => (hour === 7 ? { flag: 'off_scale' } : {}));

    const merged = mergeChartSeries([a, b]);

    expect(merged.find((p) => p.timeMs === t0 + 7 * hourMs)?.sourceId).toBe('A');
  });

  it('when every chart has a gap at a time, then the merged point is a gap from no chart', () => {
    const merged = mergeChartSeries([chart('A', 0, 4, (h) => (h === 2 ? null : 1000))]);

    expect(merged[2]).toMatchObject({ flag: 'gap', pressureHpa: null, sourceId: null });
  });
});
