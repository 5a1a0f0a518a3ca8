import type { ChartForm } from './chart-form';
import { fitTransform, isPlausibleProjective, paperPoints } from './registration-model';

const form = { pressureMin: 950, pressureMax: 1050, mmPerUnit: 0.9, drumHours: 168, mmPerHour: 1.6, penArmRadiusMm: 120, pivotPressure: null, arcSide: 1 } as ChartForm;

describe('isPlausibleProjective', () => {
  it.each<[string, number[], boolean]>([
    ['an affine map', [11.8, 0.2, 150, 0.2, -11.8, 1250, 0, 0, 1], true],
    ['a slight perspective (w within ±1 %)', [11.8, 0.2, 150, 0.2, -11.8, 1250, 2e-5, -4e-5, 1], true],
    ['w growing 2.5 times over the sheet', [11.8, 0.2, 150, 0.2, -11.8, 1250, 0.004, 0, 1], false],
    ['a line at infinity across the sheet', [11.8, 0.2, 150, 0.2, -11.8, 1250, -0.01, 0, 1], false],
  ])('when the map is %s, then plausibility is %p', (_label, matrix, expected) => {
    const isPlausible = isPlausibleProjective(form, matrix);

    expect(isPlausible).toBe(expected);
  });
});

describe('paperPoints and fitTransform', () => {
  it('when pins sit on the pivot level, then their paper u is hours times the scale whatever the radius', () => {
    const pins = [{ xPx: 0, yPx: 0, hours: 10, pressure: 1000 }];

    const [withArc] = paperPoints(form, pins, 120);
    const [straight] = paperPoints(form, pins, null);

    expect(withArc.x).toBeCloseTo(16, 12);
    expect(straight.x).toBeCloseTo(16, 12);
  });

  it('when a projective fit would fold the chart, then fitTransform returns null', () => {
    const folding = [11.8, 0.2, 150, 0.2, -11.8, 1250, 0.004, 0, 1];
    const paper = [0, 60, 120, 168].flatMap((h) => [960, 1040].map((p) => ({ x: h * 1.6, y: (p - 950) * 0.9 })));
    const pixels = paper.map((q) => {
      const w = folding[6] * q.x + folding[7] * q.y + 1;
      return { x: (folding[0] * q.x + folding[1] * q.y + folding[2]) / w, y: (folding[3] * q.x + folding[4] * q.y + folding[5]) / w };
    });

    const matrix = fitTransform(form, 'projective', paper, pixels);

    expect(matrix).toBeNull();
  });
});
