import { paperFromReading } from './chart-geometry';
import { applyHomography } from './homography';
import { findOutlierPins } from './pin-outliers';
import type { RegistrationModel } from './registration-model';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const form = TEST_WEEKLY_FORM;
// A true map of each family: mirrored similarity at 300 dpi, a skewed affine, a slight perspective.
const maps: Record<RegistrationModel, number[]> = {
  similarity: [11.8, 0.3, 150, 0.3, -11.8, 1250, 0, 0, 1],
  affine: [11.9, 0.4, 150, 0.2, -11.6, 1250, 0, 0, 1],
  projective: [11.7, 0.3, 150, 0.1, -11.9, 1250, 2e-5, -4e-5, 1],
};
const readings: [number, number][] = [
  [0, 960], [48, 960], [120, 960], [168, 960], [0, 1000], [72, 1000],
  [144, 1000], [24, 1040], [96, 1040], [168, 1040], [36, 980], [130, 1020],
];

/** Pins with a fixed ±1.5 px pattern of scan noise (deterministic, no random seed). */
function pins(model: RegistrationModel, count: number) {
  return readings.slice(0, count).map(([hours, pressure], i) => {
    const paper = paperFromReading(form, { hours, pressure });
    const pixel = applyHomography(maps[model], { x: paper.uMm, y: paper.vMm });
    return { xPx: pixel.x + 1.5 * Math.sin(7 * i), yPx: pixel.y + 1.5 * Math.cos(5 * i), hours, pressure };
  });
}

describe('findOutlierPins', () => {
  it.each<[RegistrationModel, number, number, number]>([
    ['similarity', 6, 0, 1],
    ['affine', 8, 0, 1],
    ['affine', 8, 2, 0],
    ['projective', 12, 0, 1],
    ['projective', 12, 2, 0],
  ])('when a %s fit of %i pins has pin 2 off by %f h and %f hPa, then pin 2 alone is flagged', (model, count, hoursOff, pressureOff) => {
    const set = pins(model, count);
    set[2] = { ...set[2], hours: set[2].hours + hoursOff, pressure: set[2].pressure + pressureOff };

    const flagged = findOutlierPins(form, model, 120, set);

    expect([...flagged]).toEqual([2]);
  });

  it.each<[RegistrationModel, number]>([
    ['similarity', 6],
    ['affine', 8],
    ['projective', 12],
  ])('when a %s fit of %i pins has only scan noise, then nothing is flagged', (model, count) => {
    const flagged = findOutlierPins(form, model, 120, pins(model, count));

    expect(flagged.size).toBe(0);
  });

  it.each<[RegistrationModel, number]>([
    ['affine', 6],
    ['projective', 8],
  ])('when a %s fit has only %i pins, then too few remain to judge and nothing is flagged', (model, count) => {
    const set = pins(model, count);
    set[2] = { ...set[2], pressure: set[2].pressure + 3 };

    const flagged = findOutlierPins(form, model, 120, set);

    expect(flagged.size).toBe(0);
  });
});
