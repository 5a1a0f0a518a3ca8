import type { SeriesFlag, SeriesPoint } from '@shared/api/series';

import { createPlotScales, type PlotBox } from './plot-scales';
import { buildUncertaintyBandPath } from './uncertainty-band';

// 900 px of plot over 24 h from x = 50; 400 px of plot height.
const BOX: PlotBox = { width: 1000, height: 500, marginLeft: 50, marginRight: 50, marginTop: 0, marginBottom: 100 };
const HOUR_MS = 3_600_000;

function point(hour: number, pressureHpa: number, uncertaintyHpa: number | null, flag: SeriesFlag = 'ok'): SeriesPoint {
  return { time: new Date(Date.UTC(2026, 2, 2, hour)).toISOString(), pressureHpa, flag, uncertaintyHpa, inkLineId: 'ink-1' };
}

function scalesFor(points: SeriesPoint[]) {
  return createPlotScales(points, BOX, [Date.UTC(2026, 2, 2), Date.UTC(2026, 2, 3)]);
}

describe('buildUncertaintyBandPath', () => {
  it('when points carry an uncertainty, then the band runs along p + u and back along p − u and closes', () => {
    const points = [point(0, 1000, 1), point(24, 1020, 1)];
    const scales = scalesFor(points);

    const path = buildUncertaintyBandPath(points, scales, Number.POSITIVE_INFINITY);

    // The axis holds 999–1021 hPa, made nice to 998–1022: 400 px / 24 hPa = 16.67 px per hPa from the top.
    expect(scales.y.domain()).toEqual([998, 1022]);
    // Top edge left to right (1001 hPa → 350, 1021 hPa → 16.7 at x = 950), then back along 1019 → 50 and 999 → 383.3.
    expect(path).toBe('M50,350L950,16.7L950,50L50,383.3Z');
  });

  it('when a gap point or a point without uncertainty sits inside, then the band is split there', () => {
    const points = [point(0, 1010, 0.5), point(1, 1010, 0.5), point(2, 0, null, 'gap'), point(3, 1010, 0.5), point(4, 1010, 0.5), point(5, 1010, null), point(6, 1010, 0.5), point(7, 1010, 0.5)];

    const path = buildUncertaintyBandPath(points, scalesFor(points), Number.POSITIVE_INFINITY);

    expect(path.match(/M/g)).toHaveLength(3);
    expect(path.match(/Z/g)).toHaveLength(3);
  });

  it('when two neighbours are further apart than the longest step, then the band is split between them', () => {
    const points = [point(0, 1010, 0.5), point(1, 1010, 0.5), point(9, 1010, 0.5), point(10, 1010, 0.5)];

    const path = buildUncertaintyBandPath(points, scalesFor(points), 3 * HOUR_MS);

    expect(path.match(/M/g)).toHaveLength(2);
  });

  it('when no point has an uncertainty, or a run is a single point, then there is no band', () => {
    const without = [point(0, 1010, null), point(1, 1010, null)];
    const single = [point(0, 1010, 0.5), point(1, 1010, null), point(2, 1010, 0.5)];

    const pathWithout = buildUncertaintyBandPath(without, scalesFor(without), Number.POSITIVE_INFINITY);
    const pathSingle = buildUncertaintyBandPath(single, scalesFor(single), Number.POSITIVE_INFINITY);

    expect(pathWithout).toBe('');
    expect(pathSingle).toBe('');
  });
});
