import { formatTimeTick, labelWidth, thinStackedLabels, thinTickLabels } from './tick-labels';

const DAY_MS = 86_400_000;

describe('formatTimeTick', () => {
  it.each([
    ['yearly ticks', Date.UTC(1890, 0, 1), 10 * 365 * DAY_MS, '1890'],
    ['monthly ticks', Date.UTC(1890, 2, 1), 31 * DAY_MS, 'Mar 1890'],
    ['daily ticks', Date.UTC(2026, 2, 2), DAY_MS, '2 Mar 2026'],
    ['hourly ticks at midnight', Date.UTC(2026, 2, 2), 6 * 3_600_000, '2 Mar 2026'],
    ['hourly ticks within the day', Date.UTC(2026, 2, 2, 6), 6 * 3_600_000, '06:00'],
    ['minute ticks', Date.UTC(2026, 2, 2, 6, 10), 600_000, '06:10'],
  ])('when the axis has %s, then the label reads as expected', (_name, ms, stepMs, expected) => {
    expect(formatTimeTick(new Date(ms), stepMs)).toBe(expected);
  });
});

describe('thinTickLabels', () => {
  it('when labels would overlap, then every other one is dropped and none of the kept ones touch', () => {
    const ticks = [0, 1, 2, 3, 4].map((k) => ({ at: 100 + k * 50, label: '2 Mar 2026' }));

    const kept = thinTickLabels(ticks, 0, 1000, 8);

    expect(kept.map((tick) => tick.at)).toEqual([100, 200, 300]);
    for (let k = 1; k < kept.length; k++) {
      expect(kept[k].at - labelWidth(kept[k].label) / 2).toBeGreaterThanOrEqual(kept[k - 1].at + labelWidth(kept[k - 1].label) / 2 + 8);
    }
  });

  it('when labels have room, then all are kept', () => {
    const ticks = [0, 1, 2].map((k) => ({ at: 100 + k * 100, label: '06:00' }));

    const kept = thinTickLabels(ticks, 0, 1000);

    expect(kept).toHaveLength(3);
  });

  it('when a label would run past the plot edge, then it is dropped', () => {
    const kept = thinTickLabels([{ at: 5, label: 'Mar 1890' }, { at: 500, label: 'Apr 1890' }], 0, 1000);

    expect(kept.map((tick) => tick.label)).toEqual(['Apr 1890']);
  });
});

describe('thinStackedLabels', () => {
  it('when pressure labels are closer than a line, then the later ones are dropped', () => {
    const kept = thinStackedLabels([{ at: 10, label: '1000' }, { at: 15, label: '1005' }, { at: 30, label: '1010' }], 12);

    expect(kept.map((tick) => tick.label)).toEqual(['1000', '1010']);
  });
});
