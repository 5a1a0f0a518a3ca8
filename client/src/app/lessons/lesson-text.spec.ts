import { derivedText, formatUtc, noteWhen, passageAltText, toMinuteIso } from './lesson-text';

describe('lesson text', () => {
  it('when an instant is shown, then it reads as a UTC weekday, day, month, year and time', () => {
    expect(formatUtc('2026-03-03T16:00:00.000Z')).toBe('Tue 3 Mar 2026 16:00 UTC');
    expect(toMinuteIso('2026-03-03T16:05:30.000Z')).toBe('2026-03-03T16:05Z');
  });

  it('when a note spans a time, then both ends are shown', () => {
    expect(noteWhen({ time: '2026-03-03T16:00:00Z', endTime: '2026-03-03T19:00:00Z' })).toBe('Tue 3 Mar 2026 16:00 UTC to Tue 3 Mar 2026 19:00 UTC');
  });

  it('when derived values are known, then the tendency, its characteristic and group and the rise are written out with signs', () => {
    const text = derivedText({
      tendency: { amountHpa: 1.8, ppp: 18, characteristic: 3, group: '53018' },
      change: { fromTime: '2026-03-03T16:00:00Z', toTime: '2026-03-03T19:00:00Z', changeHpa: 7.5, rateHpaPerHour: 2.5 },
    });

    expect(text).toBe('3-hour tendency +1.8 hPa, characteristic 3 (group 53018); rise 7.5 hPa in 3 h, +2.50 hPa/h');
  });

  it('when the pressure fell, then the change reads as a fall with a minus sign', () => {
    const text = derivedText({ tendency: null, change: { fromTime: '2026-03-03T13:00:00Z', toTime: '2026-03-03T16:00:00Z', changeHpa: -0.9, rateHpaPerHour: -0.3 } });

    expect(text).toBe('fall 0.9 hPa in 3 h, −0.30 hPa/h');
    expect(derivedText(null)).toBe('');
  });

  it('when the notes are given out of order, then the text alternative lists them in time order', () => {
    const text = passageAltText('Pressure at Kestrel Ridge', [
      { kind: 'ridge', time: '2026-03-04T06:00:00Z', endTime: null, text: '' },
      { kind: 'cold_front', time: '2026-03-03T16:00:00Z', endTime: null, text: 'Lowest point' },
    ]);

    expect(text).toBe('Pressure at Kestrel Ridge. Notes in time order: Cold front, Tue 3 Mar 2026 16:00 UTC: Lowest point. Ridge, Wed 4 Mar 2026 06:00 UTC.');
    expect(passageAltText('Pressure', [])).toBe('Pressure. No notes yet.');
  });
});
