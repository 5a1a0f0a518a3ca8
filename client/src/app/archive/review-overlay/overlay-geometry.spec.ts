import { readingToPixel, type RegistrationFit } from '@shared/domain/registration';
import { TEST_WEEKLY_FORM } from '@shared/domain/testing/test-weekly-form';

import { overlayGeometry, type OverlayInput } from './overlay-geometry';

const form = TEST_WEEKLY_FORM;
// 150 dpi, paper v up → pixel y down: the weekly form fills about 1650 × 560 px.
const pxPerMm = 150 / 25.4;
const placement: RegistrationFit = {
  model: 'affine',
  paperToPixel: [pxPerMm, 0, 120, 0, -pxPerMm, 40 + 90 * pxPerMm, 0, 0, 1],
  penArmRadiusMm: form.penArmRadiusMm,
  isRadiusFitted: false,
  residuals: [],
  rmsHpa: 0,
  rmsMinutes: 0,
};
const readings = [
  { hours: 24, pressure: 1040 },
  { hours: 144, pressure: 1040 },
  { hours: 144, pressure: 960 },
  { hours: 24, pressure: 960 },
];
const pinTime = (hours: number) => new Date(Date.UTC(2026, 2, 2) + hours * 3_600_000).toISOString();

function input(change: Partial<OverlayInput> = {}): OverlayInput {
  const pins = readings.map((reading) => ({ ...readingToPixel(form, placement, reading), time: pinTime(reading.hours), pressure: reading.pressure }));
  return {
    widthPx: 1800,
    heightPx: 700,
    chartForm: form,
    registration: placement,
    pins,
    // The last pin's residual is beyond the 0.3 hPa limit below; the others are well within it.
    residuals: [
      { index: 0, pressureHpa: 0.04, minutes: -1.26 },
      { index: 1, pressureHpa: -0.02, minutes: 0.5 },
      { index: 2, pressureHpa: 0.001, minutes: -0.02 },
      { index: 3, pressureHpa: -0.81, minutes: 2 },
    ],
    limit: { hPa: 0.3, minutes: 10 },
    knots: [readingToPixel(form, placement, { hours: 2, pressure: 1000 }), readingToPixel(form, placement, { hours: 3, pressure: 1001 })],
    crossKnots: null,
    ...change,
  };
}

const subpaths = (path: string) => path.split('M').filter((part) => part !== '');

describe('overlayGeometry', () => {
  it('when the scan has a chart form, then the ghost grid has every printed line, the labelled ones apart', () => {
    const geometry = overlayGeometry(input());

    // TEST_WEEKLY_FORM: 11 labelled pressure lines (every 10 hPa) and 15 labelled time arcs (every 12 h) of 101 and 85.
    expect(subpaths(geometry.gridMajorPath)).toHaveLength(11 + 15);
    expect(subpaths(geometry.gridMinorPath)).toHaveLength(101 - 11 + 85 - 15);
  });

  it('when a time arc is drawn, then it is a curve of many points, not a straight segment', () => {
    const geometry = overlayGeometry(input());

    // Pressure lines have two points (one L); arcs are sampled (24 L each).
    const arcs = subpaths(geometry.gridMajorPath).filter((part) => part.split('L').length > 2);
    expect(arcs).toHaveLength(15);
    const xs = arcs[1].split('L').map((point) => Number(point.split(' ')[0]));
    expect(Math.max(...xs) - Math.min(...xs)).toBeGreaterThan(5);
  });

  it('when the pins have residuals, then each pin is labelled with its hPa and minutes, and a pin beyond the limit is marked', () => {
    const geometry = overlayGeometry(input());

    expect(geometry.pins).toHaveLength(4);
    expect(geometry.pins.map((pin) => pin.label)).toEqual(['1: +0.04 hPa, −1.3 min', '2: −0.02 hPa, +0.5 min', '3: 0.00 hPa, 0.0 min', '4: −0.81 hPa, +2.0 min']);
    expect(geometry.pins.map((pin) => pin.isOverLimit)).toEqual([false, false, false, true]);
    expect({ xPx: geometry.pins[3].xPx, yPx: geometry.pins[3].yPx }).toEqual(readingToPixel(form, placement, readings[3]));
  });

  it('when a pin sits near the right edge, then its label runs leftward so it stays on the scan', () => {
    const geometry = overlayGeometry(input());

    const right = geometry.pins[1];
    expect(right.xPx).toBeGreaterThan(1800 * 0.75);
    expect(right.anchor).toBe('end');
    expect(right.labelXPx).toBeLessThan(right.xPx);
    expect(geometry.pins[0].anchor).toBe('start');
  });

  it('when the scan has no chart form, then no ghost grid is drawn but the line and pins are', () => {
    const geometry = overlayGeometry(input({ chartForm: null, crossKnots: [{ xPx: 1, yPx: 2 }, { xPx: 3, yPx: 4 }] }));

    expect(geometry.gridMajorPath).toBe('');
    expect(geometry.gridMinorPath).toBe('');
    expect(geometry.inkPoints.split(' ')).toHaveLength(2);
    expect(geometry.crossPoints).toBe('1,2 3,4');
    expect(geometry.pins).toHaveLength(4);
  });
});
