import { type ChartForm, chartHeightMm, chartLengthMm, checkChartForm, pivotLevelMm } from './chart-form';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const weeklyForm = TEST_WEEKLY_FORM;

describe('chart form sizes', () => {
  it('when the form is weekly 950–1050 hPa, then its height, length and default pivot level follow from the scales', () => {
    const height = chartHeightMm(weeklyForm);
    const length = chartLengthMm(weeklyForm);
    const pivot = pivotLevelMm(weeklyForm);

    expect(height).toBeCloseTo(90, 9);
    expect(length).toBeCloseTo(268.8, 9);
    expect(pivot).toBeCloseTo(45, 9);
  });

  it('when the form names a pivot pressure, then the pivot level sits at that pressure line', () => {
    const form = { ...weeklyForm, pivotPressure: 980 };

    const pivot = pivotLevelMm(form);

    expect(pivot).toBeCloseTo(27, 9);
  });
});

describe('checkChartForm', () => {
  it('when the form is usable, then no problems are listed', () => {
    const problems = checkChartForm(weeklyForm);

    expect(problems).toEqual({});
  });

  it.each<[string, Partial<ChartForm>, string]>([
    ['the range is upside down', { pressureMax: 940 }, 'pressureMax'],
    ['the drum period is zero', { drumHours: 0 }, 'drumHours'],
    ['the time scale is negative', { mmPerHour: -1 }, 'mmPerHour'],
    ['the pressure scale is zero', { mmPerUnit: 0 }, 'mmPerUnit'],
    ['the pen arm is zero', { penArmRadiusMm: 0 }, 'penArmRadiusMm'],
    ['the pen arm is shorter than half the chart height (44.9 < 45 mm)', { penArmRadiusMm: 44.9 }, 'penArmRadiusMm'],
    ['the grid pressure step is zero', { gridPressureStep: 0 }, 'gridPressureStep'],
    ['the grid hours step is zero', { gridHoursStep: 0 }, 'gridHoursStep'],
  ])('when %s, then the problem is listed under its field', (_label, change, field) => {
    const problems = checkChartForm({ ...weeklyForm, ...change });

    expect(Object.keys(problems)).toEqual([field]);
  });

  it.each<[string, number | null]>([
    ['exactly half the chart height', 45],
    ['null (straight time lines)', null],
  ])('when the pen arm is %s, then it is accepted', (_label, penArmRadiusMm) => {
    const problems = checkChartForm({ ...weeklyForm, penArmRadiusMm });

    expect(problems).toEqual({});
  });
});
