import { offsetLabel, standardOffsetMinutes, stationDayHour, zoneOffsetMinutes } from './station-time';

const MAY_5_2026_MS = Date.parse('2026-05-05T00:00:00Z');

describe('standardOffsetMinutes', () => {
  it.each([
    // Offsets from the IANA time zone database (common practice: the tz data every browser and Node ship).
    ['London in May keeps GMT, not summer time', 'Europe/London', 'local_standard', 0],
    ['Oslo in May keeps CET', 'Europe/Oslo', 'local_standard', 60],
    ['Sydney (summer time in January) keeps AEST', 'Australia/Sydney', 'local_standard', 600],
    ['St John’s keeps its half hour', 'America/St_Johns', 'local_standard', -210],
    ['a UTC station is UTC wherever it is', 'Australia/Sydney', 'utc', 0],
  ] as const)('when %s, then the offset is %s min', (_case, zone, standard, expected) => {
    expect(standardOffsetMinutes(zone, standard, MAY_5_2026_MS)).toBe(expected);
  });

  it('when the zone keeps summer time, then its offset at the instant differs from its standard offset', () => {
    expect(zoneOffsetMinutes('Europe/London', MAY_5_2026_MS)).toBe(60);
  });
});

describe('offsetLabel and stationDayHour', () => {
  it.each([
    [0, 'UTC'],
    [60, 'UTC+1'],
    [-210, 'UTC−3:30'],
  ])('when the offset is %s min, then it reads %s', (minutes, label) => {
    expect(offsetLabel(minutes)).toBe(label);
  });

  it('when 00:00 UTC is shown on a clock one hour ahead, then it reads as the day and hour there', () => {
    expect(stationDayHour(Date.parse('2026-05-04T23:00:00Z'), 60)).toBe('Tue 5 May 00:00');
  });
});
