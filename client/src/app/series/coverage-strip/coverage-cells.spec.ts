import type { CoverageMonth } from '@shared/api/series-query';

import { coverageCells, monthStartMs, nextMonthStartMs } from './coverage-cells';

const month = (name: string, pointCount: number, chartCount: number): CoverageMonth => ({ month: name, pointCount, flaggedShare: 0, minHpa: null, maxHpa: null, chartCount, chartStates: {} });

describe('coverageCells', () => {
  it('when months have points or only charts, then each is placed by time and says which', () => {
    const cells = coverageCells([month('2026-01', 100, 4), month('2026-03', 0, 2)], 0, 90);

    expect(cells.map((cell) => [cell.month, cell.kind, cell.fullness])).toEqual([
      ['2026-01', 'data', 1],
      ['2026-03', 'charts', 0],
    ]);
    // January to March is 31 + 28 of the 90 days.
    expect(cells[1].x).toBeCloseTo(59, 6);
    expect(cells[0].title).toBe('2026-01: 100 points from 4 charts');
    expect(cells[1].toMs).toBe(Date.UTC(2026, 3, 1) - 1);
  });

  it('when one month sits in a long record, then it is still at least the minimum width', () => {
    const cells = coverageCells([month('1900-01', 5, 1), month('1999-12', 5, 1)], 0, 100, 2);

    expect(cells[0].width).toBe(2);
  });

  it('when there are no months, then there are no cells', () => {
    expect(coverageCells([], 0, 100)).toEqual([]);
  });
});

describe('monthStartMs / nextMonthStartMs', () => {
  it('when the month is December, then the next month starts the next year', () => {
    expect(monthStartMs('1890-12')).toBe(Date.UTC(1890, 11, 1));
    expect(nextMonthStartMs('1890-12')).toBe(Date.UTC(1891, 0, 1));
  });
});
