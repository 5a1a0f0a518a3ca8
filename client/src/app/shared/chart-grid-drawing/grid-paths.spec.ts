import type { ChartForm } from '@shared/domain/chart-form';

import { gridPaths, LABEL_MARGIN_MM, timeLabel } from './grid-paths';

// An invented daily form: 970–1040 hPa at 1.2 mm/hPa (84 mm high), 26 h at 10 mm/h, straight time lines.
const dailyForm: ChartForm = {
  name: 'Test daily',
  pressureUnit: 'hPa',
  pressureMin: 970,
  pressureMax: 1040,
  drumHours: 26,
  mmPerHour: 10,
  mmPerUnit: 1.2,
  penArmRadiusMm: null,
  pivotPressure: null,
  arcSide: 1,
  gridPressureStep: 2,
  labelPressureStep: 10,
  gridHoursStep: 1,
  labelHoursStep: 6,
};

describe('timeLabel', () => {
  it.each<[number, string]>([
    [0, 'day 1'],
    [6, '6h'],
    [24, 'day 2'],
    [150, '6h'],
  ])('when a line sits %f h after the start, then it is labelled %s', (hours, label) => {
    expect(timeLabel(hours)).toBe(label);
  });
});

describe('gridPaths', () => {
  it('when a form is drawn with labels, then the view box holds the paper plus the label margin', () => {
    const paths = gridPaths(dailyForm);

    expect(paths.widthMm).toBeCloseTo(260 + 2 * LABEL_MARGIN_MM, 9);
    expect(paths.viewBox.split(' ').map(Number)[0]).toBeCloseTo(-LABEL_MARGIN_MM, 9);
    expect(paths.pressureLabels.map((l) => l.text)).toEqual(['970', '980', '990', '1000', '1010', '1020', '1030', '1040']);
    expect(paths.timeLabels.map((l) => l.text)).toEqual(['day 1', '6h', '12h', '18h', 'day 2']);
  });

  it('when the grid is drawn for an overlay, then it has no labels and its box is the printed area alone', () => {
    const paths = gridPaths(dailyForm, false);

    expect(paths.pressureLabels).toEqual([]);
    expect(paths.viewBox).toBe('0 0 260 84');
  });

  it('when pressure rises, then its line is drawn higher (smaller SVG y)', () => {
    const paths = gridPaths(dailyForm, false);

    // The top line (1040 hPa) is at SVG y 0, the bottom (970 hPa) at y 84: paper v grows upward, SVG y downward.
    expect(paths.majorPath).toContain('M0 0H260');
    expect(paths.majorPath).toContain('M0 84H260');
  });
});
