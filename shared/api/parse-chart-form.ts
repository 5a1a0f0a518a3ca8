import { checkChartForm, type ChartForm } from '../domain/chart-form';
import { PRESSURE_UNITS } from '../domain/pressure-units';
import { FieldReader, type Parsed } from './field-reader';
import type { ChartFormPatch } from './chart-forms';

const NUMBER_FIELDS = [
  'pressureMin',
  'pressureMax',
  'drumHours',
  'mmPerHour',
  'mmPerUnit',
  'gridPressureStep',
  'labelPressureStep',
  'gridHoursStep',
  'labelHoursStep',
] as const;

function readChartFormFields(reader: FieldReader): Partial<ChartForm> {
  const fields: Partial<ChartForm> = {};
  const name = reader.text('name', { isRequired: true });
  if (name !== undefined) fields.name = name;
  const unit = reader.oneOf('pressureUnit', PRESSURE_UNITS);
  if (unit !== undefined) fields.pressureUnit = unit;
  for (const key of NUMBER_FIELDS) {
    const value = reader.nullableNumber(key);
    if (value === null) reader.problem(key, `${key} must be a number`);
    else if (value !== undefined) fields[key] = value;
  }
  const penArmRadiusMm = reader.nullableNumber('penArmRadiusMm');
  if (penArmRadiusMm !== undefined) fields.penArmRadiusMm = penArmRadiusMm;
  const pivotPressure = reader.nullableNumber('pivotPressure');
  if (pivotPressure !== undefined) fields.pivotPressure = pivotPressure;
  const arcSide = reader.nullableNumber('arcSide');
  if (arcSide !== undefined) {
    if (arcSide === 1 || arcSide === -1) fields.arcSide = arcSide;
    else reader.problem('arcSide', 'arcSide must be 1 or -1');
  }
  return fields;
}

const REQUIRED: (keyof ChartForm)[] = ['name', 'pressureUnit', ...NUMBER_FIELDS];

/** Checks a POST /api/chart-forms body; field messages come from checkChartForm. */
export function parseChartFormInput(body: unknown): Parsed<ChartForm> {
  const reader = new FieldReader(body);
  const fields = readChartFormFields(reader);
  for (const key of REQUIRED) if (!reader.has(key)) reader.problem(key, `${key} is required`);
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  const form: ChartForm = { penArmRadiusMm: null, pivotPressure: null, arcSide: 1, ...fields } as ChartForm;
  const problems = checkChartForm(form);
  return Object.keys(problems).length > 0 ? { ok: false, details: problems } : { ok: true, value: form };
}

/** Checks a PATCH /api/chart-forms/:id body (the merged form is checked again by the server). */
export function parseChartFormPatch(body: unknown): Parsed<ChartFormPatch> {
  const reader = new FieldReader(body);
  const fields = readChartFormFields(reader);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version (the one you last read) is required');
  reader.refuseUnreadKeys();
  return reader.isValid ? { ok: true, value: { ...fields, version: version as number } } : { ok: false, details: reader.details };
}
