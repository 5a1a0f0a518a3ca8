import type { SeriesFlag } from './series';

/**
 * What each series flag means, in the words the Series page legend, the CSV header and the NetCDF
 * flag_meanings use (one map, so the three never disagree). Glossary: "flag".
 */
export const SERIES_FLAG_MEANINGS: Record<SeriesFlag, string> = {
  ok: 'read from the pen line',
  interpolated: 'interpolated across a short stretch without knots',
  gap: 'no pen line: no value',
  off_scale: 'pen at the edge of the chart: the value is a bound, not a reading',
  suspect: 'overlapping charts disagree beyond their combined uncertainty',
};

/** Short legend labels of the flags. */
export const SERIES_FLAG_LABELS: Record<SeriesFlag, string> = {
  ok: 'OK',
  interpolated: 'Interpolated',
  gap: 'Gap',
  off_scale: 'Off scale',
  suspect: 'Suspect',
};

/** The licence the published station series carry, and how to cite them (CSV header, NetCDF attributes). */
export const SERIES_LICENCE = 'CC BY 4.0 (https://creativecommons.org/licenses/by/4.0/)';

/** A citation line for one station's series at one version. */
export function seriesCitation(stationName: string, stationCode: string, version: number, builtAt: string | null, accessedAt: string): string {
  return `Isallo barogram archive: station series of ${stationName} (${stationCode}), version ${version}` +
    `${builtAt ? ` built ${builtAt}` : ''}, digitized from paper barograph charts; accessed ${accessedAt}.`;
}
