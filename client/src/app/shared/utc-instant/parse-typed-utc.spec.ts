import { parseTypedUtc } from './parse-typed-utc';

describe('parseTypedUtc', () => {
  it.each([
    ['2026-03-03 00:00', '2026-03-03T00:00:00.000Z'],
    ['2026-03-03T6:30', '2026-03-03T06:30:00.000Z'],
    ['2026-03-03 12:00Z', '2026-03-03T12:00:00.000Z'],
    ['2026-03-03 12:00 UTC', '2026-03-03T12:00:00.000Z'],
    ['2026-03-03T12:00:30+01:00', '2026-03-03T11:00:30.000Z'],
    ['2026-03-03 12:00 -0130', '2026-03-03T13:30:00.000Z'],
  ])('when %s is typed, then it reads as %s', (typed, iso) => {
    expect(parseTypedUtc(typed)).toBe(iso);
  });

  it.each(['Tuesday', '2026-03-03', '03/03/2026 12:00', '2026-13-03 12:00'])('when %s is typed, then it is refused', (typed) => {
    expect(parseTypedUtc(typed)).toBeNull();
  });
});
