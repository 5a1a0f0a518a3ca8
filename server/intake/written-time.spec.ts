import { readWrittenTime, standardOffsetMinutes } from './written-time';

describe('readWrittenTime', () => {
  it.each([
    // Europe/Oslo keeps CET (UTC+1) as standard time and CEST (+2) in summer (IANA tz database, from memory).
    ['1931-07-06 08:00', { timeZone: 'Europe/Oslo', timeStandard: 'local_standard' as const }, '1931-07-06T07:00:00.000Z'],
    ['1931-01-05 08:00', { timeZone: 'Europe/Oslo', timeStandard: 'local_standard' as const }, '1931-01-05T07:00:00.000Z'],
    // A chart kept in UTC is read as UTC whatever the zone.
    ['1931-07-06 08:00', { timeZone: 'Europe/Oslo', timeStandard: 'utc' as const }, '1931-07-06T08:00:00.000Z'],
    // A written zone wins over the station's standard.
    ['1931-07-06T08:00-05:00', { timeZone: 'Europe/Oslo', timeStandard: 'local_standard' as const }, '1931-07-06T13:00:00.000Z'],
    // America/New_York standard time is UTC−5 (EST), summer UTC−4 (IANA tz database, from memory).
    ['2001-08-01', { timeZone: 'America/New_York', timeStandard: 'local_standard' as const }, '2001-08-01T05:00:00.000Z'],
  ])('when %s is written at a station in %j, then it is %s', (text, station, expected) => {
    const result = readWrittenTime(text, station);

    expect(result).toBe(expected);
  });

  it.each(['1931-02-30 08:00', '1931-07-06 25:00', 'next monday', ''])('when "%s" is not a time, then it is null', (text) => {
    const result = readWrittenTime(text, { timeZone: 'UTC', timeStandard: 'utc' });

    expect(result).toBeNull();
  });

  it('when a southern-hemisphere zone has summer time in January, then its standard offset is the July one', () => {
    // Australia/Sydney: AEST UTC+10 standard, AEDT UTC+11 in the southern summer (IANA tz database, from memory).
    const offset = standardOffsetMinutes('Australia/Sydney', 2020);

    expect(offset).toBe(600);
  });
});
