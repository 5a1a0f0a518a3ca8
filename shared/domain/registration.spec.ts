import type { ChartForm } from './chart-form';
import { paperFromReading } from './chart-geometry';
import { applyHomography } from './homography';
import {
  canFitRadius,
  chooseRegistrationModel,
  fitRegistration,
  pixelToReading,
  readingToPixel,
  RegistrationError,
  type RegistrationModel,
  type RegistrationPin,
} from './registration';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const weeklyForm = TEST_WEEKLY_FORM;

// 300 dpi scan (11.811 px/mm), rotated 1.5°, paper v up → pixel y down, shifted into the image.
const pxPerMm = 300 / 25.4;
const angle = (1.5 * Math.PI) / 180;
const trueAffine = [
  pxPerMm * Math.cos(angle), pxPerMm * Math.sin(angle), 150,
  pxPerMm * Math.sin(angle), -pxPerMm * Math.cos(angle), 1250,
  0, 0, 1,
];
const trueSkewedAffine = [11.9, 0.4, 150, 0.2, -11.6, 1250, 0, 0, 1];
const trueProjective = [11.7, 0.3, 150, 0.1, -11.9, 1250, 2e-5, -4e-5, 1];

function makePins(form: ChartForm, matrix: number[], readings: [number, number][], generatingRadiusMm = form.penArmRadiusMm): RegistrationPin[] {
  return readings.map(([hours, pressure]) => {
    const paper = paperFromReading(form, { hours, pressure }, generatingRadiusMm);
    const pixel = applyHomography(matrix, { x: paper.uMm, y: paper.vMm });
    return { xPx: pixel.x, yPx: pixel.y, hours, pressure };
  });
}

const gridReadings: [number, number][] = [
  [0, 960], [48, 960], [120, 960], [168, 960],
  [0, 1000], [72, 1000], [144, 1000],
  [24, 1040], [96, 1040], [168, 1040],
];

// The same crossings, ordered so that any first three are not on one line.
const spreadReadings: [number, number][] = [0, 7, 3, 5, 9, 1, 4, 8, 2, 6].map((i) => gridReadings[i]);

describe('fitRegistration', () => {
  it.each<[RegistrationModel, number[]]>([
    ['similarity', trueAffine],
    ['affine', trueSkewedAffine],
    ['projective', trueProjective],
  ])('when exact pins come from a known %s transform, then the fit recovers it', (model, matrix) => {
    const pins = makePins(weeklyForm, matrix, gridReadings);

    const fit = fitRegistration(weeklyForm, pins, { model });

    expect(fit.model).toBe(model);
    fit.paperToPixel.forEach((value, i) => expect(value).toBeCloseTo(matrix[i], 6));
    expect(fit.rmsHpa).toBeLessThan(1e-6);
    expect(fit.rmsMinutes).toBeLessThan(1e-6);
  });

  it.each<[number, RegistrationModel]>([
    [3, 'similarity'],
    [4, 'affine'],
    [9, 'affine'],
    [10, 'projective'],
  ])('when %i pins are given without a model, then the fit uses %s and reports it', (count, expected) => {
    const pins = makePins(weeklyForm, trueAffine, spreadReadings.slice(0, count));

    const fit = fitRegistration(weeklyForm, pins);

    expect(fit.model).toBe(expected);
    expect(chooseRegistrationModel(count)).toBe(expected);
  });

  // Time lines are arcs whose radius is the pen-arm length (Handbook of Meteorology, 1921, pp. 223–225; docs/references.md §6);
  // a point (u, v) lies on the arc whose foot is u₀ = u − s·(R − √(R² − (v − v_c)²)) (geometry of a circle).
  it('when pins come from 120 mm arcs, then the arc model fits them exactly and straight lines visibly do not', () => {
    const pins = makePins(weeklyForm, trueSkewedAffine, gridReadings);
    const straightForm: ChartForm = { ...weeklyForm, penArmRadiusMm: null };

    const arcFit = fitRegistration(weeklyForm, pins, { model: 'affine' });
    const straightFit = fitRegistration(straightForm, pins, { model: 'affine', fitRadius: false });

    expect(arcFit.rmsMinutes).toBeLessThan(1e-6);
    // The arc bows by R − √(R² − 40.5²) ≈ 7 mm at the range ends ≈ 4 h; straight lines must miss by tens of minutes.
    expect(straightFit.rmsMinutes).toBeGreaterThan(30);
    expect(straightFit.penArmRadiusMm).toBeNull();
  });

  it.each<[RegistrationModel, number]>([
    ['similarity', 120],
    ['affine', 120],
    ['affine', 250],
    ['projective', 90],
  ])('when the form gives no radius and pins on three levels come from %s with R = %i mm, then R is fitted', (model, radiusMm) => {
    const noRadiusForm: ChartForm = { ...weeklyForm, penArmRadiusMm: null };
    const matrix = model === 'projective' ? trueProjective : model === 'affine' ? trueSkewedAffine : trueAffine;
    const pins = makePins(noRadiusForm, matrix, gridReadings, radiusMm);

    const fit = fitRegistration(noRadiusForm, pins, { model });

    expect(fit.isRadiusFitted).toBe(true);
    expect(fit.penArmRadiusMm).toBeCloseTo(radiusMm, 1);
    expect(fit.rmsMinutes).toBeLessThan(0.01);
  });

  it('when the form gives no radius and all pins sit on two pressure levels, then straight lines are used', () => {
    const noRadiusForm: ChartForm = { ...weeklyForm, penArmRadiusMm: null };
    const readings = gridReadings.filter(([, p]) => p !== 1000);
    const pins = makePins(noRadiusForm, trueSkewedAffine, readings, null);

    const fit = fitRegistration(noRadiusForm, pins, { model: 'affine' });

    expect(canFitRadius(pins, 'affine')).toBe(false);
    expect(fit.isRadiusFitted).toBe(false);
    expect(fit.penArmRadiusMm).toBeNull();
  });

  it('when one pin is typed 3 hPa off, then only that pin is flagged and its residual shows the error', () => {
    const pins = makePins(weeklyForm, trueSkewedAffine, gridReadings);
    pins[5] = { ...pins[5], pressure: pins[5].pressure + 3 };

    const fit = fitRegistration(weeklyForm, pins, { model: 'affine' });

    expect(fit.residuals.filter((r) => r.isOutlier).map((r) => r.index)).toEqual([5]);
    expect(fit.residuals[5].pressureHpa).toBeLessThan(-2);
    expect(fit.rmsHpa).toBeGreaterThan(0.5);
  });

  it('when a pin typed 2 h late sits among 12 pins of a projective fit, then only that pin is flagged', () => {
    const readings: [number, number][] = [...gridReadings, [36, 980], [130, 1020]];
    const pins = makePins(weeklyForm, trueProjective, readings);
    pins[4] = { ...pins[4], hours: pins[4].hours + 2 };

    const fit = fitRegistration(weeklyForm, pins, { model: 'projective' });

    expect(fit.residuals.filter((r) => r.isOutlier).map((r) => r.index)).toEqual([4]);
    expect(fit.residuals[4].minutes).toBeLessThan(-60);
  });

  it('when pins are exact, then no pin is flagged', () => {
    const pins = makePins(weeklyForm, trueProjective, gridReadings);

    const fit = fitRegistration(weeklyForm, pins);

    expect(fit.residuals.some((r) => r.isOutlier)).toBe(false);
  });

  it('when the same crossing is pinned twice half a pixel apart, then the fit accepts it', () => {
    const pins = makePins(weeklyForm, trueAffine, gridReadings);
    pins.push({ ...pins[3], xPx: pins[3].xPx + 0.5 });

    const fit = fitRegistration(weeklyForm, pins);

    expect(fit.residuals).toHaveLength(11);
    expect(fit.rmsMinutes).toBeLessThan(1);
  });

  it('when the pins call for a perspective that would fold the chart, then the chosen model falls back to affine', () => {
    // w = 1 + 0.004·u varies by a factor ~2.5 over the sheet: no flat scan looks like that.
    const folding = [11.7, 0.3, 150, 0.1, -11.9, 1250, 0.004, 0, 1];
    const pins = makePins(weeklyForm, folding, [...gridReadings, [36, 980], [130, 1020]]);

    const chosen = fitRegistration(weeklyForm, pins);
    const asked = () => fitRegistration(weeklyForm, pins, { model: 'projective' });

    expect(chosen.model).toBe('affine');
    expect(asked).toThrow(expect.objectContaining({ code: 'collinear_pins' }));
  });

  it('when the form is printed in inHg, then residuals come in inHg and in hPa (NIST SP 811 B.8: 1 inHg = 33.86389 hPa)', () => {
    const inHgForm: ChartForm = { ...weeklyForm, pressureUnit: 'inHg', pressureMin: 28, pressureMax: 31, mmPerUnit: 30, gridPressureStep: 0.02, labelPressureStep: 0.1 };
    const readings: [number, number][] = [[0, 28.5], [84, 28.5], [168, 28.5], [0, 30.5], [84, 30.5], [168, 30.5], [40, 29.5]];
    const pins = makePins(inHgForm, trueSkewedAffine, readings);
    pins[6] = { ...pins[6], pressure: 29.6 };

    const fit = fitRegistration(inHgForm, pins, { model: 'affine' });

    const residual = fit.residuals[6];
    expect(residual.pressureHpa).toBeCloseTo(residual.pressure * 33.86389, 9);
    expect(residual.pressure).toBeLessThan(-0.05);
  });

  it.each<[string, RegistrationPin[], RegistrationModel | undefined, string]>([
    ['two pins', makePins(weeklyForm, trueAffine, gridReadings.slice(0, 2)), undefined, 'too_few_pins'],
    ['three pins for a projective fit', makePins(weeklyForm, trueAffine, gridReadings.slice(0, 3)), 'projective', 'too_few_pins'],
    ['pins all on the 960 hPa line', makePins(weeklyForm, trueAffine, gridReadings.slice(0, 4)), 'affine', 'collinear_pins'],
    [
      'five pins, four of them on one line, for a projective fit',
      makePins(weeklyForm, trueAffine, [...gridReadings.slice(0, 4), [72, 1000]]),
      'projective',
      'collinear_pins',
    ],
    [
      'two pins on the same pixel with different readings',
      [...makePins(weeklyForm, trueAffine, gridReadings.slice(0, 4)), { ...makePins(weeklyForm, trueAffine, gridReadings.slice(0, 1))[0], pressure: 1010 }],
      'affine',
      'contradictory_pins',
    ],
    [
      'two pins with the same reading far apart',
      [...makePins(weeklyForm, trueAffine, gridReadings.slice(3, 8)), { ...makePins(weeklyForm, trueAffine, gridReadings.slice(4, 5))[0], xPx: 2000 }],
      'affine',
      'contradictory_pins',
    ],
    [
      'readings typed against the wrong pins',
      makePins(weeklyForm, trueAffine, gridReadings).map((pin, i, all) => ({ ...pin, hours: all[(i * 3) % all.length].hours, pressure: all[(i * 7) % all.length].pressure })),
      'affine',
      'contradictory_pins',
    ],
    ['a pin without a pressure', [...makePins(weeklyForm, trueAffine, gridReadings.slice(0, 5)), { xPx: 10, yPx: 10, hours: 3, pressure: Number.NaN }], undefined, 'invalid_pin'],
  ])('when given %s, then it throws a RegistrationError whose code names the problem', (_label, pins, model, code) => {
    const act = () => fitRegistration(weeklyForm, pins, { model });

    expect(act).toThrow(RegistrationError);
    expect(act).toThrow(expect.objectContaining({ code }));
  });

  it.each<[string, string, Partial<ChartForm>]>([
    ['a pen-arm radius of 30 mm on a 90 mm high chart', 'radius_too_small', { penArmRadiusMm: 30 }],
    ['a drum period of 0 hours', 'invalid_chart_form', { drumHours: 0 }],
    ['an empty pressure range', 'invalid_chart_form', { pressureMax: 950 }],
  ])('when the form has %s, then it throws with code %s', (_label, code, change) => {
    const pins = makePins(weeklyForm, trueAffine, gridReadings);

    const act = () => fitRegistration({ ...weeklyForm, ...change }, pins);

    expect(act).toThrow(expect.objectContaining({ code }));
  });

  it('when the pins call for an arc tighter than half the chart height, then it throws radius_too_small', () => {
    const noRadiusForm: ChartForm = { ...weeklyForm, penArmRadiusMm: null };
    // Levels within ±36 mm of the pivot, drawn with R = 38 mm (< 45 mm, half of 90 mm).
    const readings: [number, number][] = [[0, 960], [80, 960], [160, 960], [20, 1000], [100, 1000], [40, 1040], [140, 1040]];
    const pins = makePins(noRadiusForm, trueSkewedAffine, readings, 38);

    const act = () => fitRegistration(noRadiusForm, pins, { model: 'affine' });

    expect(act).toThrow(expect.objectContaining({ code: 'radius_too_small' }));
  });

  it('when fitRadius is asked with pins on two levels only, then it throws too_few_pins', () => {
    const pins = makePins(weeklyForm, trueAffine, gridReadings.filter(([, p]) => p !== 1000));

    const act = () => fitRegistration(weeklyForm, pins, { model: 'affine', fitRadius: true });

    expect(act).toThrow(expect.objectContaining({ code: 'too_few_pins' }));
  });
});

describe('pixelToReading and readingToPixel', () => {
  const fit = fitRegistration(weeklyForm, makePins(weeklyForm, trueProjective, gridReadings), { model: 'projective' });

  it.each<[number, number]>([
    [0, 950],
    [12.5, 1013.25],
    [84, 1000],
    [167.9, 1049.9],
    [100.25, 987.6],
  ])('when a reading of %f h, %f hPa goes to a pixel and back, then it returns unchanged', (hours, pressure) => {
    const pixel = readingToPixel(weeklyForm, fit, { hours, pressure });
    const reading = pixelToReading(weeklyForm, fit, pixel.xPx, pixel.yPx);

    expect(reading.hours).toBeCloseTo(hours, 9);
    expect(reading.pressure).toBeCloseTo(pressure, 9);
  });

  it('when a reading goes to a pixel, then the pixel is where the true transform puts that reading on its arc', () => {
    const reading = { hours: 30, pressure: 1045 };

    const pixel = readingToPixel(weeklyForm, fit, reading);

    const paper = paperFromReading(weeklyForm, reading);
    const expected = applyHomography(trueProjective, { x: paper.uMm, y: paper.vMm });
    expect(pixel.xPx).toBeCloseTo(expected.x, 6);
    expect(pixel.yPx).toBeCloseTo(expected.y, 6);
  });
});
