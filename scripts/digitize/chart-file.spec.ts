import { GENERATED_WEEKLY_FORM } from '../../fixtures/generator/weekly-form';
import { parseChartFile } from './chart-file';

function validChart(): Record<string, unknown> {
  return {
    form: { ...GENERATED_WEEKLY_FORM, name: 'weekly' },
    chartStart: '2026-03-02T00:00:00Z',
    chartOn: '2026-03-02T01:00:00Z',
    chartOff: '2026-03-08T22:00:00Z',
    pins: [
      { xPx: 10, yPx: 10, time: '2026-03-03T00:00:00Z', pressure: 1040 },
      { xPx: 900, yPx: 10, time: '2026-03-08T00:00:00Z', pressure: 1040 },
      { xPx: 900, yPx: 400, time: '2026-03-08T00:00:00Z', pressure: 960 },
    ],
    timeMarks: [{ time: '2026-03-02T08:00:00Z' }],
    checkReadings: [{ time: '2026-03-02T08:00:00Z', pressureHpa: 1001.4 }],
    ink: { colour: '#3b2c86' },
  };
}

function withChange(change: (chart: Record<string, any>) => void): Record<string, unknown> {
  const chart = validChart();
  change(chart);
  return chart;
}

describe('parseChartFile', () => {
  it('when the chart file is complete, then it is accepted with its lists', () => {
    const chart = validChart();

    const result = parseChartFile(chart);

    expect(result.ok).toBe(true);
    if (result.ok) {
      expect(result.value.pins).toHaveLength(3);
      expect(result.value.timeMarks).toEqual([{ time: '2026-03-02T08:00:00.000Z' }]);
      expect(result.value.ink.colour).toBe('#3b2c86');
    }
  });

  it('when optional lists are left out, then they come back empty', () => {
    const chart = withChange((c) => {
      delete c.timeMarks;
      delete c.checkReadings;
      delete c.ink;
    });

    const result = parseChartFile(chart);

    expect(result).toEqual(expect.objectContaining({ ok: true, value: expect.objectContaining({ timeMarks: [], checkReadings: [], ink: {} }) }));
  });

  it.each([
    ['a pin time with day and month either way round', (c: Record<string, any>) => (c.pins[2].time = '08/03/2026 00:00'), 'pins[2].time: "08/03/2026 00:00" can be read with day and month either way round'],
    ['a pin without xPx', (c: Record<string, any>) => delete c.pins[1].xPx, 'pins[1].xPx: must be a number'],
    ['two pins only', (c: Record<string, any>) => c.pins.pop(), 'pins: needs at least 3 entries, has 2'],
    ['no chart start', (c: Record<string, any>) => delete c.chartStart, 'chartStart: must be a date and time'],
    ['an unknown unit', (c: Record<string, any>) => (c.form.pressureUnit = 'psi'), 'form.pressureUnit: pressureUnit must be one of: hPa, mbar, kPa, inHg, mmHg'],
    ['a range upside down', (c: Record<string, any>) => (c.form.pressureMax = 900), 'form.pressureMax: pressureMax must be above pressureMin'],
    ['a bad arc side', (c: Record<string, any>) => (c.form.arcSide = 0), 'form.arcSide: arcSide must be 1 or -1'],
    ['a check reading without pressure', (c: Record<string, any>) => delete c.checkReadings[0].pressureHpa, 'checkReadings[0].pressureHpa: must be a number'],
    ['a time mark with only xPx', (c: Record<string, any>) => (c.timeMarks[0].xPx = 3), 'timeMarks[0]: give both xPx and yPx, or neither'],
    ['an ink colour by name', (c: Record<string, any>) => (c.ink.colour = 'purple'), 'ink.colour: must be a colour like #3b2c86'],
    ['chart off before chart on', (c: Record<string, any>) => (c.chartOff = '2026-03-01T00:00:00Z'), 'chartOff: must be after chartOn'],
  ])('when the file has %s, then the problem names its field path', (_label, change, expected) => {
    const chart = withChange(change);

    const result = parseChartFile(chart);

    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.problems.some((p) => p.startsWith(expected))).toBe(true);
  });

  it('when instants are written without a zone or with an offset, then they come back as UTC', () => {
    const chart = withChange((c) => {
      c.chartStart = '2026-03-02 00:00';
      c.timeMarks[0].time = '2026-03-02T09:00+01:00';
    });

    const result = parseChartFile(chart);

    expect(result.ok && result.value.chartStart).toBe('2026-03-02T00:00:00.000Z');
    expect(result.ok && result.value.timeMarks[0]?.time).toBe('2026-03-02T08:00:00.000Z');
  });

  it('when the file is not an object, then the root is named', () => {
    const notAnObject = [1, 2];

    const result = parseChartFile(notAnObject);

    expect(result).toEqual({ ok: false, problems: ['(root): must be a JSON object'] });
  });
});
