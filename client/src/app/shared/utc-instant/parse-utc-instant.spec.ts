import { parseUtcInstant } from './parse-utc-instant';

describe('parseUtcInstant', () => {
  it.each([
    ['2026-03-03T12:00Z', '2026-03-03T12:00:00.000Z'],
    ['2026-03-03T12:00:30Z', '2026-03-03T12:00:30.000Z'],
    ['2026-03-03T13:00+01:00', '2026-03-03T12:00:00.000Z'],
    ['2026-03-03T12:00', null],
    ['2026-03-03', null],
    ['noon on Tuesday', null],
  ])('when given %j, then it reads %p', (text, expected) => {
    const iso = parseUtcInstant(text);

    expect(iso).toBe(expected);
  });
});
