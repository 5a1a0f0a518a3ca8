import { pixelToReading } from '../registration';
import { followInk } from './follow-ink';
import { slidingMax } from './local-strength';
import { MARGIN_PX, PAPER, SYNTHETIC_FORM, blankScan, drawStroke, paint, pixelOf, syntheticFit } from './synthetic-scan';

// Synthetic scans (synthetic-scan.ts): 40 px per hour, 8 px per hPa, pen 2.5 px wide.
const PX_PER_HOUR = 40;
const fit = syntheticFit();
const BLUE_GRID = [143, 179, 223];
const VIOLET_BLUE_INK = [74, 63, 176];
const GREEN_GRID = [140, 199, 154];
const GREEN_INK = [31, 107, 58];

function wave(hours: number): number {
  return 1000 + 6 * Math.sin((2 * Math.PI * hours) / 20);
}

/** Ink faded towards the paper by 30–70 % along the line, in stretches of half an hour. */
function drawFaded(image: ReturnType<typeof blankScan>, ink: readonly number[], fromHours: number, toHours: number): void {
  const hoursOf = (x: number) => (x - MARGIN_PX) / PX_PER_HOUR;
  for (let h = fromHours; h < toHours; h += 0.5) {
    const fade = 0.5 + 0.2 * Math.sin(h / 1.5);
    const colour = ink.map((v, i) => v * (1 - fade) + PAPER[i] * fade);
    drawStroke(image, (x) => pixelOf(hoursOf(x), wave(hoursOf(x))).yPx, pixelOf(h, 0).xPx, pixelOf(Math.min(toHours, h + 0.5), 0).xPx, 2.5, colour);
  }
}

function coverageAndRms(trace: ReturnType<typeof followInk>, fromHours: number, toHours: number): { coverage: number; rmsHpa: number } {
  const readings = Array.from(trace.xPx, (x, i) => pixelToReading(SYNTHETIC_FORM, fit, x, trace.yPx[i]));
  const columns = new Set(readings.map((r) => Math.floor(r.hours * PX_PER_HOUR)));
  const errors = readings.map((r) => r.pressure - wave(r.hours));
  return {
    coverage: columns.size / ((toHours - fromHours) * PX_PER_HOUR),
    rmsHpa: Math.sqrt(errors.reduce((s, e) => s + e * e, 0) / errors.length),
  };
}

jest.setTimeout(30_000);

describe('ink against grid by colour', () => {
  // Violet-blue keeps a third of its contrast across the blue grid: both models are tried and the linear one lets
  // through as little grid; green on green keeps less, so only CIELAB can tell them apart.
  it.each([
    ['violet-blue ink on a light-blue grid', BLUE_GRID, VIOLET_BLUE_INK, 'colour'],
    ['green ink on a green grid', GREEN_GRID, GREEN_INK, 'lab'],
  ])('when %s is faded 30–70 %% and its colour is given, then the model chosen by colour follows all of it', (_name, grid, ink, model) => {
    const image = blankScan(3, grid);
    drawFaded(image, ink, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, inkColour: { r: ink[0], g: ink[1], b: ink[2] } });
    const { coverage, rmsHpa } = coverageAndRms(trace, 1, 23);

    expect(trace.contrastMode).toBe(model);
    expect(trace.contrastReason).toMatch(/CIELAB/);
    expect(coverage).toBeGreaterThanOrEqual(0.99);
    expect(rmsHpa).toBeLessThan(0.05);
    expect(trace.spans.filter((s) => s.kind === 'gap')).toEqual([]);
  });

  // Other hues than the bench's (inks and grids invented here): the model is whichever fits, the line is all found.
  it.each([
    ['brown ink on a red grid', [226, 120, 110], [110, 62, 30]],
    ['violet ink on a blue grid', [150, 170, 230], [90, 40, 150]],
    ['black ink on a green grid', [120, 200, 140], [30, 30, 35]],
    ['blue ink on an orange grid', [240, 160, 80], [40, 60, 160]],
  ])('when %s is faded 30–70 %% and its colour is given, then all of it is followed', (_name, grid, ink) => {
    const image = blankScan(3, grid);
    drawFaded(image, ink, 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, inkColour: { r: ink[0], g: ink[1], b: ink[2] } });
    const { coverage, rmsHpa } = coverageAndRms(trace, 1, 23);

    expect(coverage).toBeGreaterThanOrEqual(0.99);
    expect(rmsHpa).toBeLessThan(0.1);
  });

  it('when faded like-coloured ink runs under a brown stain, then the stained stretch is followed too', () => {
    const image = blankScan(3, BLUE_GRID);
    drawFaded(image, VIOLET_BLUE_INK, 1, 23);
    // A tea stain laid over sheet and ink (alpha over, as a stain soaks in on top), hours 8–15 the whole height,
    // soaking in over its first and last hour and strongest between.
    const stain = [155, 107, 48];
    for (let x = Math.floor(pixelOf(8, 0).xPx); x < pixelOf(15, 0).xPx; x++) {
      const hours = (x - MARGIN_PX) / PX_PER_HOUR;
      const strength = 0.3 * Math.min(1, hours - 8, 15 - hours);
      for (let y = 0; y < image.height; y++) paint(image, x, y, stain, strength);
    }

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, inkColour: { r: VIOLET_BLUE_INK[0], g: VIOLET_BLUE_INK[1], b: VIOLET_BLUE_INK[2] } });
    const { coverage, rmsHpa } = coverageAndRms(trace, 1, 23);

    expect(trace.contrastMode).toBe('lab');
    expect(coverage).toBeGreaterThanOrEqual(0.99);
    expect(rmsHpa).toBeLessThan(0.1);
    expect(trace.spans.filter((s) => s.kind === 'gap')).toEqual([]);
  });

  it('when like-coloured ink is on a grey-scale scan, then "darker than the grid" is kept and said', () => {
    const image = blankScan(1, BLUE_GRID);
    drawFaded(image, [40, 30, 120], 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(trace.contrastMode).toBe('grey');
    expect(trace.contrastReason).toMatch(/grey-scale/);
  });

  it('when a grey-scale scan is stored as RGB and a coloured ink is given, then the scan, not the given colour, keeps "darker than the grid"', () => {
    const image = blankScan(3, BLUE_GRID);
    drawFaded(image, VIOLET_BLUE_INK, 1, 23);
    // Luma in all three channels (ITU-R BT.601 weights, common practice): a grey scan saved as colour.
    for (let k = 0; k < image.data.length; k += 3) {
      const luma = Math.round(0.299 * image.data[k] + 0.587 * image.data[k + 1] + 0.114 * image.data[k + 2]);
      image.data[k] = image.data[k + 1] = image.data[k + 2] = luma;
    }

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, inkColour: { r: VIOLET_BLUE_INK[0], g: VIOLET_BLUE_INK[1], b: VIOLET_BLUE_INK[2] } });

    expect(trace.contrastMode).toBe('grey');
    expect(trace.contrastReason).not.toMatch(/CIELAB/);
  });

  it('when ink far from the grid in hue is given, then the linear colour model is kept', () => {
    const image = blankScan(3);
    drawFaded(image, [59, 44, 134], 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23, inkColour: { r: 59, g: 44, b: 134 } });

    expect(trace.contrastMode).toBe('colour');
  });
});

describe('slidingMax', () => {
  it('when a window slides over values, then each output is the largest within reach', () => {
    expect(Array.from(slidingMax(Float32Array.from([1, 3, 2, 0, 0, 5]), 1))).toEqual([3, 3, 3, 2, 5, 5]);
  });
});

describe('no silent failure', () => {
  it('when the chart holds no pen line, then Follow ink says so and reports no coverage', () => {
    const image = blankScan(3);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(trace.coverage).toBeLessThan(0.5);
    expect(trace.problem).toMatch(/pen line was found over only|No pen line was found/);
  });

  it('when the line is drawn over the whole span, then there is no problem to report', () => {
    const image = blankScan(3);
    drawFaded(image, [59, 44, 134], 1, 23);

    const trace = followInk(image, SYNTHETIC_FORM, fit, { startHours: 1, endHours: 23 });

    expect(trace.coverage).toBeGreaterThan(0.95);
    expect(trace.problem).toBeNull();
  });
});
