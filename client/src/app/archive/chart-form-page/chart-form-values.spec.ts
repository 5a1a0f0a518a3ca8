import { checkChartForm } from '@shared/domain/chart-form';

import { chartFormOf, MAX_PREVIEW_LINES, NEW_FORM_VALUES, previewLineCount, valuesOfChartForm } from './chart-form-values';

describe('chart form values', () => {
  it('when the starting values are read, then they describe a usable weekly form', () => {
    const form = chartFormOf({ ...NEW_FORM_VALUES, name: 'Weekly 950–1050 hPa' });

    expect(checkChartForm(form)).toEqual({});
    expect(form.penArmRadiusMm).toBe(120);
    expect(form.pivotPressure).toBeNull();
  });

  it('when radius and pivot are left empty, then the form has straight lines and a pivot in the middle', () => {
    const form = chartFormOf({ ...NEW_FORM_VALUES, penArmRadiusMm: '', pivotPressure: '' });

    expect(form.penArmRadiusMm).toBeNull();
    expect(form.pivotPressure).toBeNull();
  });

  it('when a number is left empty, then the check names that field rather than drawing a grid of zeros', () => {
    const problems = checkChartForm(chartFormOf({ ...NEW_FORM_VALUES, mmPerHour: '' }));

    expect(Object.keys(problems)).toEqual(['mmPerHour']);
  });

  it('when a form goes to the editor and back, then nothing changes', () => {
    const form = chartFormOf({ ...NEW_FORM_VALUES, name: 'Daily 970–1040', arcSide: '-1', pivotPressure: '1000' });

    expect(chartFormOf(valuesOfChartForm(form))).toEqual(form);
  });

  it('when the grid step is a typo far too small, then the preview refuses to draw it', () => {
    const form = chartFormOf({ ...NEW_FORM_VALUES, gridPressureStep: '0.001' });

    expect(previewLineCount(form)).toBeGreaterThan(MAX_PREVIEW_LINES);
  });
});
