import { paperFromReading } from './chart-geometry';
import { ghostGrid } from './ghost-grid';
import { applyHomography } from './homography';
import { fitRegistration, pixelToReading, type RegistrationPin } from './registration';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const form = TEST_WEEKLY_FORM;
// A 300 dpi scan turned 1.5° (paper v up → pixel y down), as in registration.spec.ts.
const pxPerMm = 300 / 25.4;
const angle = (1.5 * Math.PI) / 180;
const scanMatrix = [pxPerMm * Math.cos(angle), pxPerMm * Math.sin(angle), 150, pxPerMm * Math.sin(angle), -pxPerMm * Math.cos(angle), 1250, 0, 0, 1];

function pinAt(hours: number, pressure: number): RegistrationPin {
  const paper = paperFromReading(form, { hours, pressure });
  const pixel = applyHomography(scanMatrix, { x: paper.uMm, y: paper.vMm });
  return { xPx: pixel.x, yPx: pixel.y, hours, pressure };
}

const fit = fitRegistration(form, [pinAt(0, 960), pinAt(168, 960), pinAt(24, 1040), pinAt(144, 1040), pinAt(72, 1000)]);

describe('ghostGrid', () => {
  it('when a weekly form is carried onto a scan, then every printed line is there, labelled lines flagged', () => {
    const lines = ghostGrid(form, fit);

    // TEST_WEEKLY_FORM: a line per hPa from 950 to 1050 and an arc every 2 h over 168 h (see chart-grid.spec.ts).
    expect(lines.filter((line) => line.kind === 'pressure')).toHaveLength(101);
    expect(lines.filter((line) => line.kind === 'time')).toHaveLength(85);
    expect(lines.filter((line) => line.kind === 'pressure' && line.isLabelled).map((line) => line.value)).toEqual([950, 960, 970, 980, 990, 1000, 1010, 1020, 1030, 1040, 1050]);
  });

  it('when a time arc is drawn, then each of its points reads back as the arc\'s time, so the arc bends as the printed one', () => {
    const arc = ghostGrid(form, fit).find((line) => line.kind === 'time' && line.value === 36)!;

    for (const point of arc.points) expect(pixelToReading(form, fit, point.xPx, point.yPx).hours).toBeCloseTo(36, 6);
    // The arc is not a straight column: its ends and middle do not line up across the time direction.
    const xs = arc.points.map((point) => point.xPx);
    expect(Math.max(...xs) - Math.min(...xs)).toBeGreaterThan(10);
  });

  it('when a pressure line is drawn, then both its ends read back as its pressure, at the first and last time line', () => {
    const line = ghostGrid(form, fit).find((candidate) => candidate.kind === 'pressure' && candidate.value === 1030)!;

    const [start, end] = line.points.map((point) => pixelToReading(form, fit, point.xPx, point.yPx));

    expect(start.pressure).toBeCloseTo(1030, 6);
    expect(end.pressure).toBeCloseTo(1030, 6);
    expect(start.hours).toBeCloseTo(0, 6);
    expect(end.hours).toBeCloseTo(168, 6);
  });

  it('when the fit has straight time lines, then each time line is drawn straight', () => {
    const straight = ghostGrid({ ...form, penArmRadiusMm: null }, { ...fit, penArmRadiusMm: null });
    const arc = straight.find((line) => line.kind === 'time' && line.value === 36)!;

    // On a straight time line every point is on the chord between its ends.
    const [a, b] = [arc.points[0], arc.points[arc.points.length - 1]];
    for (const point of arc.points) {
      const cross = (b.xPx - a.xPx) * (point.yPx - a.yPx) - (b.yPx - a.yPx) * (point.xPx - a.xPx);
      expect(Math.abs(cross) / Math.hypot(b.xPx - a.xPx, b.yPx - a.yPx)).toBeLessThan(1e-6);
    }
  });
});
