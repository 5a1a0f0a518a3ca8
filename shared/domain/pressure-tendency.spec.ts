import { type PressureAtTime, type TendencyCharacteristic, threeHourTendency } from './pressure-tendency';

const minuteMs = 60_000;
const observation = Date.UTC(2026, 2, 10, 12, 0);

/** Ten-minute samples over the 3 h, straight between p(t−3h) → p(t−1.5h) → p(t). */
function curve(start: number, middle: number, end: number): PressureAtTime[] {
  return Array.from({ length: 19 }, (_, k) => {
    const minutes = k * 10;
    const pressureHpa = minutes <= 90 ? start + ((middle - start) * minutes) / 90 : middle + ((end - middle) * (minutes - 90)) / 90;
    return { timeMs: observation - (180 - minutes) * minuteMs, pressureHpa };
  });
}

describe('threeHourTendency characteristic', () => {
  // WMO-No. 306, Manual on Codes, Vol. I.1, code table 0200 (docs/references.md §5), one case per code and per wording.
  it.each<[TendencyCharacteristic, string, number, number, number]>([
    [0, 'increasing, then decreasing; now higher', 1010, 1012, 1010.5],
    [0, 'increasing, then decreasing; now the same', 1010, 1011, 1010],
    [1, 'increasing, then steady', 1010, 1011.5, 1011.55],
    [1, 'increasing, then increasing more slowly', 1010, 1011.2, 1011.8],
    [2, 'increasing steadily', 1010, 1010.8, 1011.6],
    [3, 'steady, then increasing', 1010, 1010.05, 1011],
    [3, 'decreasing, then increasing; now higher', 1010, 1009.5, 1011],
    [3, 'increasing, then increasing more rapidly', 1010, 1010.3, 1011.5],
    [4, 'steady', 1010, 1010.02, 1010.01],
    [5, 'decreasing, then increasing; now the same', 1010, 1009, 1010],
    [5, 'decreasing, then increasing; now lower', 1010, 1008.5, 1009.5],
    [6, 'decreasing, then steady', 1012, 1010.5, 1010.45],
    [6, 'decreasing, then decreasing more slowly', 1012, 1011, 1010.4],
    [7, 'decreasing steadily', 1012, 1011.2, 1010.4],
    [8, 'steady, then decreasing', 1012, 1012, 1011],
    [8, 'increasing, then decreasing; now lower', 1010, 1011, 1009],
    [8, 'decreasing, then decreasing more rapidly', 1012, 1011.7, 1010.5],
  ])('when the curve is %i — %s (%f → %f → %f hPa), then the code is that', (code, _wording, start, middle, end) => {
    const tendency = threeHourTendency(curve(start, middle, end), observation);

    expect(tendency?.characteristic).toBe(code);
  });
});

describe('threeHourTendency amount', () => {
  it('when pressure falls 1012.0 → 1011.0 → 1010.4 hPa, then a = 6, ppp = 016 and the group is 56016', () => {
    // docs/references.md §5: constructed example (our construction, from code table 0200 and the ppp definition).
    const tendency = threeHourTendency(curve(1012, 1011, 1010.4), observation);

    expect(tendency).toMatchObject({ characteristic: 6, ppp: 16, group: '56016' });
    expect(tendency?.amountHpa).toBeCloseTo(-1.6, 9);
  });

  it('when pressure falls 0.3 hPa steadily, then the group is 57003', () => {
    // Unidata GEMPAK P03D note: a = 7 with a fall of 0.3 hPa is coded 7003 (docs/references.md §5).
    const tendency = threeHourTendency(curve(1010.3, 1010.15, 1010.0), observation);

    expect(tendency?.group).toBe('57003');
  });

  it('when pressure rises 0.04 hPa, then ppp is 000 and the change counts as the same', () => {
    // ppp in tenths of hPa (WMO-No. 306, Regulation 12.2.3.5; NOAA SEAS help): 0.04 rounds to 0.
    const tendency = threeHourTendency(curve(1010, 1010.02, 1010.04), observation);

    expect(tendency).toMatchObject({ ppp: 0, characteristic: 4, group: '54000' });
  });

  it('when only hourly points are given, then the tendency comes from them', () => {
    const hourly = [0, 1, 2, 3].map((h) => ({ timeMs: observation - (3 - h) * 3_600_000, pressureHpa: 1000 + 0.7 * h }));

    const tendency = threeHourTendency(hourly, observation);

    expect(tendency).toMatchObject({ ppp: 21, characteristic: 2 });
  });

  it.each<[string, PressureAtTime[]]>([
    ['no point at the start of the window', curve(1010, 1011, 1012).slice(3)],
    ['a gap across the middle', curve(1010, 1011, 1012).map((s, k) => (k > 3 && k < 15 ? { ...s, pressureHpa: null } : s))],
  ])('when there is %s, then the tendency is unknown', (_label, samples) => {
    const tendency = threeHourTendency(samples, observation);

    expect(tendency).toBeNull();
  });
});
