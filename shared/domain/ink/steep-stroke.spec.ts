import { pixelToReading } from '../registration';
import { followInk } from './follow-ink';
import { monotoneBetween } from './steep-stroke';
import { MARGIN_PX, SYNTHETIC_FORM, blankScan, drawStroke, drawVertical, pixelOf, syntheticFit } from './synthetic-scan';

// Synthetic scans (synthetic-scan.ts): 40 px per hour, 8 px per hPa, pen 2.5 px wide.
const PX_PER_HOUR = 40;
const fit = syntheticFit();

/** A front's jump as a raised-cosine ramp of `hpa` over `minutes`, centred on hour 12, on a level 1000 hPa. */
function ramp(hpa: number, minutes: number): (hours: number) => number {
  return (hours) => {
    const x = (hours - 12) / (minutes / 60) + 0.5;
    return 1000 + hpa * (x <= 0 ? 0 : x >= 1 ? 1 : 0.5 - 0.5 * Math.cos(Math.PI * x));
  };
}

function drawPressure(image: ReturnType<typeof blankScan>, pressure: (hours: number) => number): void {
  const hoursOf = (x: number) => (x - MARGIN_PX) / PX_PER_HOUR;
  drawStroke(image, (x) => pixelOf(hoursOf(x), pressure(hoursOf(x))).yPx, pixelOf(2, 0).xPx, pixelOf(22, 0).xPx, 2.5);
}

function readingsOf(trace: ReturnType<typeof followInk>) {
  return Array.from(trace.xPx, (x, i) => pixelToReading(SYNTHETIC_FORM, fit, x, trace.yPx[i]));
}

jest.setTimeout(30_000);

describe('steep strokes', () => {
  it.each([
    ['a rise of 5 hPa in 12 minutes', 5, 12],
    ['a fall of 4 hPa in 8 minutes', -4, 8],
    ['a rise of 6 hPa in 20 minutes', 6, 20],
  ])('when the pen draws %s, then the line keeps its shape: forward in time, no dip, the middle crossed on time', (_name, hpa, minutes) => {
    const image = blankScan(3);
    const truth = ramp(hpa, minutes);
    drawPressure(image, truth);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 2, endHours: 22 });
    const readings = readingsOf(trace);

    // Forward in time, always (the drum only turns one way); within a hundredth of a pixel column.
    for (let i = 1; i < readings.length; i++) expect(readings[i].hours).toBeGreaterThanOrEqual(readings[i - 1].hours - 0.01 / PX_PER_HOUR);
    // Between the foot and the top the series only moves the jump's way (allowing 0.1 hPa of centring noise).
    const sign = Math.sign(hpa);
    const inside = readings.filter((r) => Math.abs(r.hours - 12) <= minutes / 120 + 0.05);
    let furthest = -Infinity;
    for (const r of inside) {
      furthest = Math.max(furthest, sign * (r.pressure - 1000));
      expect(sign * (r.pressure - 1000)).toBeGreaterThan(furthest - 0.1);
    }
    // The middle of the jump is crossed within one pixel column (1.5 min) of the truth.
    const middle = 1000 + hpa / 2;
    const k = readings.findIndex((r, i) => i > 0 && sign * (r.pressure - middle) >= 0 && sign * (readings[i - 1].pressure - middle) < 0);
    expect(k).toBeGreaterThan(0);
    expect(Math.abs(readings[k].hours - 12) * 60).toBeLessThanOrEqual(1.5);
    expect(trace.spans.filter((s) => s.kind === 'jump')).toHaveLength(1);
  });

  it('when a time mark stands on the line and a jump comes an hour later, then one is a time mark span and the other a jump span', () => {
    const image = blankScan(3);
    drawPressure(image, ramp(5, 6));
    const foot = pixelOf(11, 1000);
    drawVertical(image, foot.xPx, foot.yPx, foot.yPx - 20, 2);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 2, endHours: 22 });

    const kinds = trace.spans.map((s) => s.kind);
    expect(kinds.filter((k) => k === 'time_mark')).toHaveLength(1);
    expect(kinds.filter((k) => k === 'jump')).toHaveLength(1);
    const mark = trace.spans.find((s) => s.kind === 'time_mark');
    const jump = trace.spans.find((s) => s.kind === 'jump');
    expect(Math.abs(((mark?.startXPx ?? 0) + (mark?.endXPx ?? 0)) / 2 - foot.xPx)).toBeLessThan(3);
    expect(pixelToReading(SYNTHETIC_FORM, fit, jump?.startXPx ?? 0, 0).hours).toBeGreaterThan(11.5);
  });
});

describe('monotoneBetween', () => {
  it('when values run backwards, then they are pooled to their mean and held within the bounds', () => {
    // Pool adjacent violators by hand: [3, 1] → 2, 2; then 5 stands; 9 is held to the upper bound 6.
    expect(monotoneBetween([3, 1, 5, 9], 0, 6)).toEqual([2, 2, 5, 6]);
  });
});
