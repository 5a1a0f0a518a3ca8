import { parseUtcDay, rangeInstantsMs, seriesCsvFileName } from './series-range';

describe('seriesCsvFileName', () => {
  it('when a station code and days are given, then the name is isallo-CODE-from-to.csv', () => {
    const name = seriesCsvFileName('KRO', '2026-03-02', '2026-03-09');

    expect(name).toBe('isallo-KRO-2026-03-02-2026-03-09.csv');
  });

  it('when the code holds characters unsafe in file names, then they become underscores', () => {
    const name = seriesCsvFileName('K/R O', '2026-03-02', '2026-03-02');

    expect(name).toBe('isallo-K_R_O-2026-03-02-2026-03-02.csv');
  });
});

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

describe('rangeInstantsMs', () => {
  it('when from and to are the same day, then the range covers that whole UTC day', () => {
    const [fromMs, toMs] = rangeInstantsMs({ stationId: 's', fromDay: '2026-03-02', toDay: '2026-03-02' });

    expect(new Date(fromMs).toISOString()).toBe('2026-03-02T00:00:00.000Z');
    expect(new Date(toMs).toISOString()).toBe('2026-03-03T00:00:00.000Z');
  });
});
