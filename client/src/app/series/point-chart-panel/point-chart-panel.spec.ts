import { TestBed } from '@angular/core/testing';
import type { PointChart } from '@shared/api/series-point-chart';

import { PointChartPanel } from './point-chart-panel';

jest.setTimeout(30_000);

const CHART: PointChart = {
  stationId: '11111111-1111-4111-8111-111111111111',
  time: '2026-03-04T14:00:00.000Z',
  pressureHpa: 984.2,
  flag: 'interpolated',
  uncertaintyHpa: 0.3,
  inkLineId: '22222222-2222-4222-8222-222222222222',
  scanId: '33333333-3333-4333-8333-333333333333',
  chartFormId: null,
  chartFormName: 'Weekly 950–1050 hPa',
  chartStart: '2026-03-02T00:00:00.000Z',
  region: { xPx: 100, yPx: 50, widthPx: 400, heightPx: 200 },
  inkLine: [
    { xPx: 110, yPx: 120 },
    { xPx: 300, yPx: 140 },
    { xPx: 490, yPx: 100 },
  ],
  pointPx: { xPx: 300, yPx: 140 },
  regionFrom: '2026-03-04T08:00:00.000Z',
  regionTo: '2026-03-04T20:00:00.000Z',
  imagePath: '/iiif/3/33333333-3333-4333-8333-333333333333/100,50,400,200/400,/0/default.jpg',
};

describe('PointChartPanel', () => {
  it('when a point chart is shown in inHg, then it names the point, form and line, draws the ink line and rings the point', async () => {
    const fixture = TestBed.createComponent(PointChartPanel);
    fixture.componentRef.setInput('chart', CHART);
    fixture.componentRef.setInput('imageUrl', 'blob:region');
    fixture.componentRef.setInput('unit', 'inHg');

    await fixture.whenStable();

    const element = fixture.nativeElement as HTMLElement;
    const text = element.textContent ?? '';
    expect(text).toContain('The chart at 2026-03-04 14:00 UTC');
    // 984.2 hPa / 33.86389 hPa per inHg (docs/references.md §2) = 29.06 inHg.
    expect(text).toContain('29.06 inHg');
    expect(text).toContain('(interpolated)');
    expect(text).toContain('Weekly 950–1050 hPa');
    expect(text).toContain(CHART.inkLineId);
    expect(element.querySelector('[data-testid="chart-region-image"]')?.getAttribute('src')).toBe('blob:region');
    expect(element.querySelector('polyline.ink')?.getAttribute('points')).toBe('110,120 300,140 490,100');
    expect(element.querySelector('svg.overlay')?.getAttribute('viewBox')).toBe('100 50 400 200');
    expect(element.querySelectorAll('[data-testid="chart-mark"]')).toHaveLength(1);
  });

  it('when the line cannot be placed on its chart, then the panel says so and shows no image', async () => {
    const fixture = TestBed.createComponent(PointChartPanel);
    fixture.componentRef.setInput('chart', { ...CHART, region: null, inkLine: [], pointPx: null, imagePath: null });

    await fixture.whenStable();

    const element = fixture.nativeElement as HTMLElement;
    expect(element.textContent).toContain('cannot be placed on its chart');
    expect(element.querySelector('[data-testid="chart-region-image"]')).toBeNull();
  });
});
