import { parseUtcDay, seriesFileName } from './series-range';

describe('parseUtcDay', () => {
  it.each([
    ['2026-03-02', Date.UTC(2026, 2, 2)],
    [' 2026-12-31 ', Date.UTC(2026, 11, 31)],
    ['2026-02-30', null],
    ['2026-3-2', null],
    ['02/03/2026', null],
  ])('when given %j, then it reads %p', (text, expectedMs) => {
    const ms = parseUtcDay(text);

    expect(ms).toBe(expectedMs);
  });
});

describe('seriesFileName', () => {
  it('when two stations are downloaded hourly as NetCDF, then the name holds both codes, the range in UTC and the step', () => {
    const name = seriesFileName(['KRO', 'S/B'], Date.UTC(2026, 2, 2), Date.UTC(2026, 2, 9, 6, 30), 'hourly', 'netcdf');

    expect(name).toBe('isallo-KRO-S_B-20260302T0000Z-20260309T0630Z-hourly.nc');
  });
});
