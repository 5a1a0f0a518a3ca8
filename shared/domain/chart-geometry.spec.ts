import { arcOffsetMm, paperFromReading, readingFromPaper } from './chart-geometry';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const weeklyForm = TEST_WEEKLY_FORM;

describe('arcOffsetMm', () => {
  // Circle of radius R about the pivot: offset = s·(R − √(R² − (v − vc)²)), vc = 45 mm here (geometry of a circle).
  it.each<[number, number | null, 1 | -1, number]>([
    [45, 120, 1, 0],
    [0, 120, 1, 120 - Math.sqrt(120 ** 2 - 45 ** 2)],
    [90, 120, 1, 120 - Math.sqrt(120 ** 2 - 45 ** 2)],
    [75, 120, 1, 120 - Math.sqrt(120 ** 2 - 30 ** 2)],
    [75, 120, -1, -(120 - Math.sqrt(120 ** 2 - 30 ** 2))],
    [0, 45, 1, 45],
    [10, null, 1, 0],
  ])('when v = %f mm, R = %p mm and side %i, then the arc sits %f mm from its foot', (vMm, radiusMm, arcSide, expected) => {
    const form = { ...weeklyForm, arcSide };

    const offset = arcOffsetMm(form, vMm, radiusMm);

    expect(offset).toBeCloseTo(expected, 9);
  });

  it('when the point lies beyond the arm’s reach, then the offset is clamped to the radius', () => {
    const offset = arcOffsetMm(weeklyForm, 45 + 130, 120);

    expect(offset).toBeCloseTo(120, 9);
  });
});

describe('paperFromReading and readingFromPaper', () => {
  it.each<[number, number]>([
    [0, 950],
    [24, 1000],
    [100.5, 1013.25],
    [168, 1050],
  ])('when %f h at %f hPa goes to paper and back, then the reading returns', (hours, pressure) => {
    const paper = paperFromReading(weeklyForm, { hours, pressure });
    const reading = readingFromPaper(weeklyForm, paper);

    expect(reading.hours).toBeCloseTo(hours, 9);
    expect(reading.pressure).toBeCloseTo(pressure, 9);
  });

  it('when a reading sits on the pivot level, then its u is the nominal time times the scale', () => {
    const paper = paperFromReading(weeklyForm, { hours: 24, pressure: 1000 });

    expect(paper.uMm).toBeCloseTo(38.4, 9);
    expect(paper.vMm).toBeCloseTo(45, 9);
  });

  it('when a reading sits at the top of the range, then its u is displaced along the arc', () => {
    const paper = paperFromReading(weeklyForm, { hours: 24, pressure: 1050 });

    expect(paper.uMm).toBeCloseTo(38.4 + 120 - Math.sqrt(120 ** 2 - 45 ** 2), 9);
    expect(paper.vMm).toBeCloseTo(90, 9);
  });
});
