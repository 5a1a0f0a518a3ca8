import { parseInstantMs, parseUtcDateMs } from './parse-time';

describe('parseInstantMs', () => {
  it.each([
    ['2026-03-02T00:00Z', Date.UTC(2026, 2, 2)],
    ['2026-03-02T00:00:00.250Z', Date.UTC(2026, 2, 2, 0, 0, 0, 250)],
    ['2026-03-02T01:00:00+01:00', Date.UTC(2026, 2, 2)],
  ])('when given %s, then it is that UTC instant', (text, expectedMs) => {
    const ms = parseInstantMs(text);

    expect(ms).toBe(expectedMs);
  });

  it.each(['2026-03-02T00:00', '2026-03-02', 'Monday', '', 42])('when given %p (no zone or not an instant), then it is null', (value) => {
    const ms = parseInstantMs(value);

    expect(ms).toBeNull();
  });
});

describe('parseUtcDateMs', () => {
  it('when given a real date, then it is 00:00 UTC of that day', () => {
    const ms = parseUtcDateMs('2024-02-29');

    expect(ms).toBe(Date.UTC(2024, 1, 29));
  });

  it.each(['2026-02-30', '2026-13-01', '2026-3-2', '2026-03-02T00:00Z'])('when given %s, then it is null', (value) => {
    const ms = parseUtcDateMs(value);

    expect(ms).toBeNull();
  });
});
