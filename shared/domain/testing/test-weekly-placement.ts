import type { RegistrationFit } from '../registration';
import { TEST_WEEKLY_FORM } from './test-weekly-form';

const PX_PER_MM = 150 / 25.4;

/**
 * The test weekly form on an invented 150 dpi scan, square to the image, exact by construction: the chart-start
 * line 120 px from the left, the top pressure line 40 px from the top. Specs place pins, knots and marks with it.
 */
export const TEST_WEEKLY_PLACEMENT: RegistrationFit = {
  model: 'affine',
  paperToPixel: [PX_PER_MM, 0, 120, 0, -PX_PER_MM, 40 + 100 * TEST_WEEKLY_FORM.mmPerUnit * PX_PER_MM, 0, 0, 1],
  penArmRadiusMm: TEST_WEEKLY_FORM.penArmRadiusMm,
  isRadiusFitted: false,
  residuals: [],
  rmsHpa: 0,
  rmsMinutes: 0,
};
