import { isCalendarDate, isId, normalizeInstant, parseInstantMs, parseUtcDateMs, readInstant } from './parse-instant';

describe('readInstant', () => {
  it.each([
    ['2026-03-03T00:00Z', Date.UTC(2026, 2, 3)],
    ['2026-03-03 00:00', Date.UTC(2026, 2, 3)],
    ['2026-03-03T00:00', Date.UTC(2026, 2, 3)],
    ['2026-03-03 00:00 UTC', Date.UTC(2026, 2, 3)],
    ['2026-03-03t00:00z', Date.UTC(2026, 2, 3)],
    ['  2026-03-03T12:30:15Z ', Date.UTC(2026, 2, 3, 12, 30, 15)],
    ['2026-03-02T00:00:00.250Z', Date.UTC(2026, 2, 2, 0, 0, 0, 250)],
    ['2026-03-02T01:00:00+01:00', Date.UTC(2026, 2, 2)],
    ['2026-03-02 01:00+0100', Date.UTC(2026, 2, 2)],
    ['2026-03-01T19:00-05', Date.UTC(2026, 2, 2)],
    ['1931-03-02T08:00Z', Date.UTC(1931, 2, 2, 8)],
    ['2024-02-29 12:00', Date.UTC(2024, 1, 29, 12)],
  ])('when given %j, then it is that UTC instant', (text, expectedMs) => {
    expect(readInstant(text)).toEqual({ ok: true, ms: expectedMs });
  });

  it.each([
    ['03/04/2026 00:00', /day and month either way round/],
    ['3.4.26 08:00', /day and month either way round/],
    ['2026-03-03', /needs a time of day/],
    ['2026-02-30 00:00', /not a real date and time/],
    ['2026-13-01T00:00Z', /not a real date and time/],
    ['2026-03-03T24:00Z', /not a real date and time/],
    ['2026-03-03T00:00+19:00', /not a real date and time/],
    ['2026-3-3 0:00', /must be a date and time/],
    ['noon on Tuesday', /must be a date and time/],
    ['', /must be a date and time/],
  ])('when given %j, then it is refused saying why', (text, problem) => {
    const reading = readInstant(text);

    expect(reading.ok).toBe(false);
    expect(reading.ok ? '' : reading.problem).toMatch(problem);
  });

  it('when a bare date is allowed, then it is 00:00 UTC of that day', () => {
    expect(readInstant('1931-03-02', { allowDate: true })).toEqual({ ok: true, ms: Date.UTC(1931, 2, 2) });
    expect(readInstant('1931-02-29', { allowDate: true }).ok).toBe(false);
  });

  it.each([42, null, undefined, {}])('when given %p (not text), then it is refused', (value) => {
    expect(readInstant(value).ok).toBe(false);
    expect(parseInstantMs(value)).toBeNull();
  });
});

describe('normalizeInstant', () => {
  it('when an instant has an offset, then it becomes the full UTC string', () => {
    expect(normalizeInstant('2026-03-03T13:00+01:00')).toBe('2026-03-03T12:00:00.000Z');
  });
});

describe('days and ids', () => {
  it('when given a real date, then it is 00:00 UTC of that day', () => {
    expect(parseUtcDateMs('2024-02-29')).toBe(Date.UTC(2024, 1, 29));
  });

  it.each(['2026-02-30', '2026-13-01', '2026-3-2', '2026-03-02T00:00Z', 7])('when given %p, then it is not a day', (value) => {
    expect(parseUtcDateMs(value)).toBeNull();
    expect(isCalendarDate(value)).toBe(false);
  });

  it('when given a UUID in either case, then it is an id; anything else is not', () => {
    expect(isId('0b1f6d1c-8d2e-4c4b-9a55-3f0e2a7d9c10')).toBe(true);
    expect(isId('0B1F6D1C-8D2E-4C4B-9A55-3F0E2A7D9C10')).toBe(true);
    expect(isId('0b1f6d1c8d2e4c4b9a553f0e2a7d9c10')).toBe(false);
    expect(isId(42)).toBe(false);
  });
});
