import { arcOffsetMm } from './chart-geometry';
import { chartGrid, gridValues } from './chart-grid';
import { TEST_WEEKLY_FORM } from './testing/test-weekly-form';

const weeklyForm = TEST_WEEKLY_FORM;

describe('gridValues', () => {
  it('when the range is 950 to 1050 by 1, then both ends and every whole number between are listed', () => {
    const values = gridValues(950, 1050, 1);

    expect(values).toHaveLength(101);
    expect(values[0]).toBe(950);
    expect(values[100]).toBe(1050);
  });

  it('when the step is a decimal fraction, then the values are exact multiples without accumulated error', () => {
    const values = gridValues(0, 1, 0.1);

    expect(values).toHaveLength(11);
    expect(values[3]).toBe(0.3);
    expect(values[10]).toBe(1);
  });

  it('when the range does not start on a multiple of the step, then the first line is the next multiple', () => {
    const values = gridValues(951.5, 960, 2);

    expect(values).toEqual([952, 954, 956, 958, 960]);
  });

  it('when the step is not positive, then no lines are drawn', () => {
    const values = gridValues(0, 10, 0);

    expect(values).toEqual([]);
  });
});

describe('chartGrid', () => {
  it('when a weekly form is drawn, then it has a line per hPa and an arc per two hours, labelled every 10 hPa and 12 h', () => {
    const grid = chartGrid(weeklyForm);

    expect(grid.pressureLines).toHaveLength(101);
    expect(grid.pressureLines.filter((line) => line.isLabelled).map((line) => line.pressure)).toEqual([950, 960, 970, 980, 990, 1000, 1010, 1020, 1030, 1040, 1050]);
    expect(grid.timeArcs).toHaveLength(85);
    expect(grid.timeArcs.filter((arc) => arc.isLabelled).map((arc) => arc.hours)).toEqual([0, 12, 24, 36, 48, 60, 72, 84, 96, 108, 120, 132, 144, 156, 168]);
  });

  it('when an arc is sampled, then every point lies one pen-arm radius from its centre', () => {
    const grid = chartGrid(weeklyForm);
    const arc = grid.timeArcs[10];

    // Geometry of a circle: the time line is the pen tip's path about the pivot.
    for (const point of arc.points) {
      const distance = Math.hypot(point.uMm - arc.centre!.uMm, point.vMm - arc.centre!.vMm);
      expect(distance).toBeCloseTo(120, 9);
    }
    expect(arc.from.vMm).toBeCloseTo(0, 9);
    expect(arc.to.vMm).toBeCloseTo(90, 9);
  });

  it('when an arc crosses the pivot level, then it sits at its nominal time there', () => {
    const grid = chartGrid(weeklyForm);
    const arc = grid.timeArcs.find((a) => a.hours === 24)!;

    const atPivot = arc.points.find((p) => Math.abs(p.vMm - 45) < 1e-9);

    expect(atPivot?.uMm).toBeCloseTo(24 * 1.6, 9);
  });

  it('when a pressure line is drawn, then it runs from the first arc to the last arc at its own height', () => {
    const grid = chartGrid(weeklyForm);
    const line = grid.pressureLines.find((l) => l.pressure === 1030)!;

    expect(line.vMm).toBeCloseTo(72, 9);
    expect(line.fromUMm).toBeCloseTo(arcOffsetMm(weeklyForm, 72), 9);
    expect(line.toUMm).toBeCloseTo(168 * 1.6 + arcOffsetMm(weeklyForm, 72), 9);
  });

  it('when the form has straight time lines, then each arc is vertical and has no centre', () => {
    const grid = chartGrid({ ...weeklyForm, penArmRadiusMm: null });
    const arc = grid.timeArcs[5];

    expect(arc.centre).toBeNull();
    expect(arc.from.uMm).toBeCloseTo(10 * 1.6, 9);
    expect(arc.to.uMm).toBeCloseTo(10 * 1.6, 9);
  });

  it('when the bounds are read, then they hold the whole printed area including the arcs’ bulge', () => {
    const grid = chartGrid(weeklyForm);

    expect(grid.bounds.minVMm).toBe(0);
    expect(grid.bounds.maxVMm).toBeCloseTo(90, 9);
    expect(grid.bounds.minUMm).toBeCloseTo(0, 9);
    expect(grid.bounds.maxUMm).toBeCloseTo(168 * 1.6 + (120 - Math.sqrt(120 ** 2 - 45 ** 2)), 9);
  });
});
