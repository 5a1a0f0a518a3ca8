/**
 * The station's time standard: the clock its observers wrote times in. Local standard time is the zone's
 * offset without summer time, all year round (a barograph clock is not put forward in spring); UTC is UTC.
 */
export type StationTimeStandard = 'local_standard' | 'utc';

const MINUTE_MS = 60_000;
const DAY_NAMES = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];

/** The zone's offset from UTC at an instant, minutes east (Intl reads the IANA database; no DOM is needed). */
export function zoneOffsetMinutes(timeZone: string, atMs: number): number {
  const parts = new Intl.DateTimeFormat('en-GB', {
    timeZone,
    hourCycle: 'h23',
    year: 'numeric',
    month: 'numeric',
    day: 'numeric',
    hour: 'numeric',
    minute: 'numeric',
  }).formatToParts(new Date(atMs));
  const field = (type: string) => Number(parts.find((part) => part.type === type)?.value ?? 0);
  const wallMs = Date.UTC(field('year'), field('month') - 1, field('day'), field('hour'), field('minute'));
  return Math.round((wallMs - Math.floor(atMs / MINUTE_MS) * MINUTE_MS) / MINUTE_MS);
}

/**
 * Minutes east of UTC of the station's time standard in the year of `atMs`: 0 for UTC, else the zone's
 * standard offset, the smaller of its January and July offsets (summer time always adds, in either hemisphere).
 */
export function standardOffsetMinutes(timeZone: string, standard: StationTimeStandard, atMs: number): number {
  if (standard === 'utc') return 0;
  const year = new Date(atMs).getUTCFullYear();
  return Math.min(zoneOffsetMinutes(timeZone, Date.UTC(year, 0, 1)), zoneOffsetMinutes(timeZone, Date.UTC(year, 6, 1)));
}

/** "UTC", "UTC+1", "UTC−3:30": the name of an offset for a label. */
export function offsetLabel(offsetMinutes: number): string {
  if (offsetMinutes === 0) return 'UTC';
  const sign = offsetMinutes > 0 ? '+' : '−';
  const hours = Math.floor(Math.abs(offsetMinutes) / 60);
  const minutes = Math.abs(offsetMinutes) % 60;
  return `UTC${sign}${hours}${minutes === 0 ? '' : `:${String(minutes).padStart(2, '0')}`}`;
}

/** An instant as a day and hour on the station's clock: "Tue 5 May 01:00". */
export function stationDayHour(atMs: number, offsetMinutes: number): string {
  const wall = new Date(atMs + offsetMinutes * MINUTE_MS);
  const month = wall.toLocaleString('en-GB', { month: 'short', timeZone: 'UTC' });
  const time = `${String(wall.getUTCHours()).padStart(2, '0')}:${String(wall.getUTCMinutes()).padStart(2, '0')}`;
  return `${DAY_NAMES[wall.getUTCDay()]} ${wall.getUTCDate()} ${month} ${time}`;
}
