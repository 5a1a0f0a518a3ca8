import { clockInWords, correctionsAppliedInWords, instrumentInWords } from './correction-words';

describe('correctionsAppliedInWords', () => {
  it.each([
    [{ clockMarkCount: 3, instrumentReadingCount: 2 }, 'clock (3 marks), instrument (2 readings)'],
    [{ clockMarkCount: 1, instrumentReadingCount: 0 }, 'clock (1 mark); no check readings'],
    [{ clockMarkCount: 0, instrumentReadingCount: 1 }, 'instrument (1 reading); no marks'],
    [{ clockMarkCount: 0, instrumentReadingCount: 0 }, 'none — no marks or check readings'],
  ])('when the hand-in used %o, then the row reads "%s"', (applied, words) => {
    expect(correctionsAppliedInWords(applied)).toBe(words);
  });
});

describe('clockInWords and instrumentInWords', () => {
  it('when the clock ran behind and loses time, then it is said slow and losing', () => {
    expect(clockInWords({ method: 'rate', firstOffsetMinutes: 12, rateMinutesPerDay: 2.5 })).toBe('clock 12 min slow at the first mark, losing 2.5 min a day');
    expect(clockInWords({ method: 'rate', firstOffsetMinutes: 0.1, rateMinutesPerDay: -0.01 })).toBe('clock keeps true time');
    expect(clockInWords({ method: 'rate', firstOffsetMinutes: 0.1, rateMinutesPerDay: -1 })).toBe('clock 0 min slow at the first mark, gaining 1.0 min a day');
  });

  it('when the barometer reads below the pen and the pen drifts up, then the instrument is said high and drifting +', () => {
    expect(instrumentInWords({ meanOffsetHpa: -0.8, penDriftHpaPerWeek: 0.4 })).toBe('instrument 0.8 hPa high, drifting +0.4 hPa a week');
    expect(instrumentInWords({ meanOffsetHpa: 0.3, penDriftHpaPerWeek: null })).toBe('instrument 0.3 hPa low');
    expect(instrumentInWords({ meanOffsetHpa: -0.01, penDriftHpaPerWeek: 0 })).toBe('instrument reads true, steady');
  });
});
