export interface StationSummary {
  id: string;
  /** Isallo's own short identifier, e.g. "KRV". */
  code: string;
  name: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  /** IANA time zone name of the station. */
  timeZone: string;
}

export const STATION_SORT_KEYS = ['name', 'code'] as const;
export type StationSortKey = (typeof STATION_SORT_KEYS)[number];
