import type { TimeStandard } from '@shared/api/stations';

const WRITTEN_PATTERN = /^(\d{4})-(\d{2})-(\d{2})(?:[T ](\d{2}):(\d{2})(?::(\d{2}))?)?\s*(Z|[+-]\d{2}:\d{2})?$/;

/** Offset of a zone from UTC at an instant, minutes east (Intl's longOffset, e.g. "GMT+01:00"). */
export function zoneOffsetMinutes(timeZone: string, epochMs: number): number {
  const name = new Intl.DateTimeFormat('en-US', { timeZone, timeZoneName: 'longOffset' })
    .formatToParts(new Date(epochMs))
    .find((part) => part.type === 'timeZoneName')?.value;
  const match = /GMT([+-])(\d{2}):(\d{2})/.exec(name ?? '');
  if (!match) return 0;
  return (match[1] === '-' ? -1 : 1) * (Number(match[2]) * 60 + Number(match[3]));
}

/**
 * The zone's standard (winter) offset in a year: the smaller of its January and July offsets, since summer
 * time only ever adds. Charts kept in local standard time never follow the summer change (common practice).
 */
export function standardOffsetMinutes(timeZone: string, year: number): number {
  return Math.min(zoneOffsetMinutes(timeZone, Date.UTC(year, 0, 1)), zoneOffsetMinutes(timeZone, Date.UTC(year, 6, 1)));
}

/**
 * A chart time as the observer wrote it, to ISO 8601 UTC: with a zone it is taken as is; without one it is
 * read in the station's time standard. A bare date means 00:00. Null when the text is not such a time.
 */
export function readWrittenTime(text: string, station: { timeZone: string; timeStandard: TimeStandard }): string | null {
  const match = WRITTEN_PATTERN.exec(text.trim());
  if (!match) return null;
  const [, year, month, day, hour = '00', minute = '00', second = '00', zone] = match;
  const asUtcMs = Date.UTC(Number(year), Number(month) - 1, Number(day), Number(hour), Number(minute), Number(second));
  const check = new Date(asUtcMs);
  if (check.getUTCDate() !== Number(day) || check.getUTCMonth() !== Number(month) - 1 || Number(hour) > 23 || Number(minute) > 59) return null;
  let offsetMinutes = 0;
  if (zone && zone !== 'Z') offsetMinutes = (zone.startsWith('-') ? -1 : 1) * (Number(zone.slice(1, 3)) * 60 + Number(zone.slice(4, 6)));
  else if (!zone && station.timeStandard === 'local_standard') offsetMinutes = standardOffsetMinutes(station.timeZone, Number(year));
  return new Date(asUtcMs - offsetMinutes * 60_000).toISOString();
}
