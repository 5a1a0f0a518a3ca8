import type { ChartForm } from '../chart-form';

/**
 * An invented weekly form for the domain specs: 950–1050 hPa over 90 mm, 168 h over 268.8 mm, a 120 mm pen
 * arm. Deliberately not the generator's geometry, so the specs do not only pass on the demo chart.
 */
export const TEST_WEEKLY_FORM: ChartForm = {
  name: 'Test weekly 950–1050',
  pressureUnit: 'hPa',
  pressureMin: 950,
  pressureMax: 1050,
  drumHours: 168,
  mmPerHour: 1.6,
  mmPerUnit: 0.9,
  penArmRadiusMm: 120,
  pivotPressure: null,
  arcSide: 1,
  gridPressureStep: 1,
  labelPressureStep: 10,
  gridHoursStep: 2,
  labelHoursStep: 12,
};
