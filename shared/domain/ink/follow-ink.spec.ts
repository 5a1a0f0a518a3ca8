import { pixelToReading } from '../registration';
import { followInk } from './follow-ink';
import type { InkTrace } from './ink-trace';
import type { RawImage } from './raw-image';
import { INK, MARGIN_PX, PAPER, SYNTHETIC_FORM, blankScan, drawStroke, drawVertical, paint, pixelOf, syntheticFit } from './synthetic-scan';

// The specs draw their own scans (synthetic-scan.ts): 4 px per mm, 40 px per hour, 8 px per hPa.
const PX_PER_HOUR = 40;
const fit = syntheticFit();
const LINE_WIDTH_PX = 2.5;

function hoursOfX(x: number): number {
  return (x - MARGIN_PX) / PX_PER_HOUR;
}

function wave(hours: number): number {
  return 1000 + 6 * Math.sin((2 * Math.PI * hours) / 20);
}

function drawPressure(image: RawImage, pressure: (hours: number) => number, fromHours: number, toHours: number, colour: readonly number[] = INK): void {
  drawStroke(image, (x) => pixelOf(hoursOfX(x), pressure(hoursOfX(x))).yPx, pixelOf(fromHours, 0).xPx, pixelOf(toHours, 0).xPx, LINE_WIDTH_PX, colour);
}

function readings(trace: InkTrace): { hours: number; pressure: number }[] {
  return Array.from(trace.xPx, (x, i) => pixelToReading(SYNTHETIC_FORM, fit, x, trace.yPx[i]));
}

function rmsError(trace: InkTrace, truth: (hours: number) => number, skip: (hours: number) => boolean = () => false): number {
  const errors = readings(trace)
    .filter((r) => !skip(r.hours))
    .map((r) => r.pressure - truth(r.hours));
  return Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length);
}

function mix(a: readonly number[], b: readonly number[], t: number): number[] {
  return a.map((v, i) => v * (1 - t) + b[i] * t);
}

describe('followInk', () => {
  it('when a pen line crosses the printed grid on a colour scan, then the trace follows its centre within 0.03 hPa', () => {
    const image = blankScan(3);
    drawPressure(image, wave, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(trace.contrastMode).toBe('colour');
    expect(rmsError(trace, wave)).toBeLessThan(0.03);
    expect(trace.spans).toEqual([]);
  });

  it('when the scan is grey-scale, then ink darker than the grid is still followed within 0.05 hPa', () => {
    const image = blankScan(1);
    drawPressure(image, wave, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(trace.contrastMode).toBe('grey');
    expect(rmsError(trace, wave)).toBeLessThan(0.05);
  });

  it('when the pen skips for two hours, then a gap is flagged there and no point is drawn inside it', () => {
    const image = blankScan(3);
    drawPressure(image, wave, 1, 8);
    drawPressure(image, wave, 10, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    const gaps = trace.spans.filter((s) => s.kind === 'gap');
    expect(gaps).toHaveLength(1);
    expect(hoursOfX(gaps[0].startXPx)).toBeCloseTo(8, 0);
    expect(hoursOfX(gaps[0].endXPx)).toBeCloseTo(10, 0);
    expect(readings(trace).filter((r) => r.hours > 8.1 && r.hours < 9.9)).toEqual([]);
  });

  it('when the pen skips for less than the bridge limit, then no gap is flagged', () => {
    const image = blankScan(3);
    drawPressure(image, wave, 1, 8);
    drawPressure(image, wave, 8.04, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, maxBridgeMm: 0.5 });

    expect(trace.spans.filter((s) => s.kind === 'gap')).toEqual([]);
  });

  it('when a fainter second line runs nearby and crosses it, then the trace stays with the dark line', () => {
    const image = blankScan(3);
    const other = (hours: number) => 1002 + 0.5 * hours;
    drawPressure(image, other, 0.5, 23.5, mix(INK, PAPER, 0.65));
    drawPressure(image, wave, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    // Where the two lines cross, both are inked; judge the trace away from the crossings.
    const nearCrossing = (hours: number) => Math.abs(wave(hours) - other(hours)) < 1;
    expect(rmsError(trace, wave, nearCrossing)).toBeLessThan(0.05);
  });

  it('when the pen rides the bottom edge of the printed range, then that stretch is flagged off-scale', () => {
    const image = blankScan(3);
    const deep = (hours: number) => Math.max(980, 995 - 30 * Math.exp(-(((hours - 12) / 3) ** 2)));
    drawPressure(image, deep, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    const offScale = trace.spans.filter((s) => s.kind === 'off_scale');
    expect(offScale).toHaveLength(1);
    expect(hoursOfX(offScale[0].startXPx)).toBeLessThan(11);
    expect(hoursOfX(offScale[0].endXPx)).toBeGreaterThan(13);
  });

  it('when a time mark stands on the line, then the trace steps over it and reports its foot', () => {
    const image = blankScan(3);
    drawPressure(image, wave, 1, 23);
    const foot = pixelOf(6, wave(6));
    drawVertical(image, foot.xPx, foot.yPx, foot.yPx - 24, 2);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(rmsError(trace, wave)).toBeLessThan(0.05);
    expect(trace.timeMarks).toHaveLength(1);
    expect(hoursOfX(trace.timeMarks[0].xPx)).toBeCloseTo(6, 1);
  });

  it('when a squall line makes the pen jump straight up, then the trace climbs the jump in the right column', () => {
    const image = blankScan(3);
    const jumpHours = 14;
    const before = (hours: number) => 996 - 0.3 * (hours - jumpHours);
    const after = (hours: number) => 1004 + 0.2 * (hours - jumpHours);
    drawPressure(image, before, 1, jumpHours);
    drawPressure(image, after, jumpHours, 23);
    const x = pixelOf(jumpHours, 1000).xPx;
    drawVertical(image, x, pixelOf(jumpHours, before(jumpHours)).yPx, pixelOf(jumpHours, after(jumpHours)).yPx, LINE_WIDTH_PX);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    const points = readings(trace);
    const firstHigh = points.find((p) => p.pressure > 1000);
    expect(firstHigh?.hours).toBeCloseTo(jumpHours, 1);
    const truth = (hours: number) => (hours < jumpHours ? before(hours) : after(hours));
    expect(rmsError(trace, truth, (h) => Math.abs(h - jumpHours) < 0.1)).toBeLessThan(0.05);
  });

  it('when a brown stain and a grey fingerprint lie over the line, then the trace is not pulled off it', () => {
    const image = blankScan(3);
    drawPressure(image, wave, 1, 23);
    const stainAt = pixelOf(6, 1000);
    const printAt = pixelOf(16, 1000);
    for (let y = 0; y < image.height; y++) {
      for (let x = 0; x < image.width; x++) {
        const stain = Math.hypot(x - stainAt.xPx, (y - stainAt.yPx) * 1.5);
        if (stain < 60) paint(image, x, y, [155, 107, 48], 0.3);
        const ring = Math.hypot(x - printAt.xPx, y - printAt.yPx);
        if (ring < 40 && Math.floor(ring / 3) % 2 === 0) paint(image, x, y, [85, 80, 74], 0.25);
      }
    }

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(rmsError(trace, wave)).toBeLessThan(0.05);
    expect(trace.spans).toEqual([]);
  });

  it('when two equally dark lines are on the chart, then the seed pixel chooses which one is followed', () => {
    const image = blankScan(3);
    const low = (hours: number) => 992 + 0.2 * hours;
    const high = (hours: number) => 1010 - 0.2 * hours;
    drawPressure(image, low, 1, 23);
    drawPressure(image, high, 1, 23);

    const onLow = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, seed: pixelOf(12, low(12)) });
    const onHigh = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, seed: pixelOf(12, high(12)) });

    expect(rmsError(onLow, low)).toBeLessThan(0.05);
    expect(rmsError(onHigh, high)).toBeLessThan(0.05);
  });
});
