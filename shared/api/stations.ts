/** The time standard a station's charts were kept in: local standard time (no summer time) or UTC. */
export const TIME_STANDARDS = ['local_standard', 'utc'] as const;
export type TimeStandard = (typeof TIME_STANDARDS)[number];

export interface StationSummary {
  id: string;
  /** Isallo's own short identifier, e.g. "KRV". Unique. */
  code: string;
  name: string;
  /** Decimal degrees, WGS 84, −90..90; null when unknown. */
  latitude: number | null;
  /** Decimal degrees, WGS 84, −180..180; null when unknown. */
  longitude: number | null;
  /** Station elevation above mean sea level, metres. */
  elevationM: number | null;
  /** IANA time zone name of the station, e.g. "Europe/Oslo". */
  timeZone: string;
  /** WIGOS station identifier, e.g. "0-20000-0-01492"; null when the station has none. */
  wigosId: string | null;
  /** Height of the barometer's cistern (or the barograph) above mean sea level, metres. */
  barometerHeightM: number | null;
  /** Time standard the station's charts were kept in. */
  timeStandard: TimeStandard;
  /** Free-text history: moves, instrument changes, observers. Empty string when none. */
  historyNotes: string;
  /** Optimistic-edit counter; send it back with a PATCH. */
  version: number;
}

/** Body of POST /api/stations. */
export interface StationInput {
  code: string;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  timeZone: string;
  wigosId: string | null;
  barometerHeightM: number | null;
  timeStandard: TimeStandard;
  historyNotes: string;
}

/** Body of PATCH /api/stations/:id: any StationInput fields plus the version last read (stale → 409 version_conflict). */
export type StationPatch = Partial<StationInput> & { version: number };

export const STATION_SORT_KEYS = ['name', 'code'] as const;
export type StationSortKey = (typeof STATION_SORT_KEYS)[number];
