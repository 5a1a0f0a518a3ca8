import type { ChartFormSummary } from '@shared/api/chart-forms';
import type { ChartForm } from '@shared/domain/chart-form';
import type { PressureUnit } from '@shared/domain/pressure-units';

/** The chart form editor's values: numbers as typed, so a half-typed value is not lost to NaN. */
export interface ChartFormValues {
  name: string;
  pressureUnit: PressureUnit;
  pressureMin: string;
  pressureMax: string;
  drumHours: string;
  mmPerHour: string;
  mmPerUnit: string;
  penArmRadiusMm: string;
  pivotPressure: string;
  arcSide: '1' | '-1';
  gridPressureStep: string;
  labelPressureStep: string;
  gridHoursStep: string;
  labelHoursStep: string;
}

/** A weekly 950–1050 hPa form as a starting point (common practice for a weekly barograph drum). */
export const NEW_FORM_VALUES: ChartFormValues = {
  name: '',
  pressureUnit: 'hPa',
  pressureMin: '950',
  pressureMax: '1050',
  drumHours: '168',
  mmPerHour: '1.6',
  mmPerUnit: '0.9',
  penArmRadiusMm: '120',
  pivotPressure: '',
  arcSide: '1',
  gridPressureStep: '1',
  labelPressureStep: '10',
  gridHoursStep: '2',
  labelHoursStep: '12',
};

export function valuesOfChartForm(form: ChartForm | ChartFormSummary): ChartFormValues {
  return {
    name: form.name,
    pressureUnit: form.pressureUnit,
    pressureMin: String(form.pressureMin),
    pressureMax: String(form.pressureMax),
    drumHours: String(form.drumHours),
    mmPerHour: String(form.mmPerHour),
    mmPerUnit: String(form.mmPerUnit),
    penArmRadiusMm: form.penArmRadiusMm === null ? '' : String(form.penArmRadiusMm),
    pivotPressure: form.pivotPressure === null ? '' : String(form.pivotPressure),
    arcSide: form.arcSide === -1 ? '-1' : '1',
    gridPressureStep: String(form.gridPressureStep),
    labelPressureStep: String(form.labelPressureStep),
    gridHoursStep: String(form.gridHoursStep),
    labelHoursStep: String(form.labelHoursStep),
  };
}

function num(text: string): number {
  return text.trim() === '' ? Number.NaN : Number(text);
}

/** The ChartForm the values describe; an empty radius or pivot means none (straight lines, middle of the range). */
export function chartFormOf(values: ChartFormValues): ChartForm {
  return {
    name: values.name.trim(),
    pressureUnit: values.pressureUnit,
    pressureMin: num(values.pressureMin),
    pressureMax: num(values.pressureMax),
    drumHours: num(values.drumHours),
    mmPerHour: num(values.mmPerHour),
    mmPerUnit: num(values.mmPerUnit),
    penArmRadiusMm: values.penArmRadiusMm.trim() === '' ? null : num(values.penArmRadiusMm),
    pivotPressure: values.pivotPressure.trim() === '' ? null : num(values.pivotPressure),
    arcSide: values.arcSide === '-1' ? -1 : 1,
    gridPressureStep: num(values.gridPressureStep),
    labelPressureStep: num(values.labelPressureStep),
    gridHoursStep: num(values.gridHoursStep),
    labelHoursStep: num(values.labelHoursStep),
  };
}

/** Grid lines the preview would draw; beyond this the numbers are surely a typo and the drawing would stall. */
export const MAX_PREVIEW_LINES = 4000;

export function previewLineCount(form: ChartForm): number {
  return (form.pressureMax - form.pressureMin) / form.gridPressureStep + form.drumHours / form.gridHoursStep;
}
