import { TestBed } from '@angular/core/testing';
import type { SeriesFlag, SeriesPoint } from '@shared/api/series';

import { findGapEnds } from './plot-gaps';
import { createPlotScales, type PlotBox } from './plot-scales';
import { PressurePlot } from './pressure-plot';

const HOUR_MS = 3_600_000;
const BOX: PlotBox = { width: 1000, height: 500, marginLeft: 50, marginRight: 50, marginTop: 0, marginBottom: 100 };

function point(hour: number, pressureHpa: number, flag: SeriesFlag = 'ok'): SeriesPoint {
  return { time: new Date(Date.UTC(2026, 2, 2, hour)).toISOString(), pressureHpa, flag, uncertaintyHpa: null, inkLineId: 'ink-1' };
}

describe('findGapEnds', () => {
  it('when gap points sit between two drawn points, then one pair of ends borders them', () => {
    const points = [point(0, 1010), point(1, 1011), point(2, 0, 'gap'), point(3, 0, 'gap'), point(4, 1012)];
    const scales = createPlotScales(points, BOX);

    const ends = findGapEnds(points, scales, Number.POSITIVE_INFINITY);

    expect(ends).toHaveLength(1);
    expect(ends[0].before.x).toBeCloseTo(scales.x(new Date(Date.UTC(2026, 2, 2, 1))));
    expect(ends[0].after.x).toBeCloseTo(scales.x(new Date(Date.UTC(2026, 2, 2, 4))));
  });

  it('when two neighbours are further apart than the longest step, or a gap opens the series, then only the inner break is bracketed', () => {
    const points = [point(0, 0, 'gap'), point(1, 1010), point(2, 1011), point(8, 1012)];

    const ends = findGapEnds(points, createPlotScales(points, BOX), 2 * HOUR_MS);

    expect(ends).toHaveLength(1);
  });
});

describe('PressurePlot', () => {
  it('when points carry flags, then each is marked by its own shape with its words, gaps get brackets and the legend names them', async () => {
    const fixture = TestBed.createComponent(PressurePlot);
    fixture.componentRef.setInput('points', [point(0, 1010), point(1, 1011, 'off_scale'), point(2, 1012, 'suspect'), point(3, 0, 'gap'), point(4, 1011, 'interpolated'), point(5, 1010)]);
    fixture.detectChanges();
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;

    const titles = [...element.querySelectorAll('[data-flag] title')].map((title) => title.textContent);
    const shapes = new Set([...element.querySelectorAll<SVGPathElement>('path.flag')].map((path) => path.getAttribute('d')?.replace(/[-\d.,]/g, '')));
    const legend = [...element.querySelectorAll('[data-testid="flag-legend"] li')].map((item) => item.textContent?.trim());

    expect(titles).toEqual(['off scale', 'suspect', 'interpolated']);
    expect(element.textContent).not.toContain('off_scale');
    // Three flags, three different shapes (square, triangle, circle), so they read without colour.
    expect(shapes.size).toBe(3);
    expect(element.querySelectorAll('[data-testid="series-gap"]')).toHaveLength(1);
    expect(legend).toEqual(['station pressure', 'interpolated', 'suspect', 'off scale', 'gap']);
  });
});
