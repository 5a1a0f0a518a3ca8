import { SERIES_CSV_HEADER, type SeriesPoint } from '@shared/api/series';

/** The CSV header line, CRLF-free: one `\n` per line, which every spreadsheet and pandas read. */
export const SERIES_CSV_HEADER_LINE = `${SERIES_CSV_HEADER.join(',')}\n`;

/**
 * One CSV line per point: ISO 8601 UTC time, hPa to 2 decimals (0.01 hPa is finer than any barograph), flag,
 * uncertainty in hPa to 2 decimals (empty when none is known) and the ink line it came from.
 */
export function seriesCsvLines(points: SeriesPoint[]): string {
  return points
    .map((point) => {
      const uncertainty = point.uncertaintyHpa === null ? '' : point.uncertaintyHpa.toFixed(2);
      return `${point.time},${point.pressureHpa.toFixed(2)},${point.flag},${uncertainty},${point.inkLineId}\n`;
    })
    .join('');
}

/** A file name such as `KRO_2026-03-02_2026-03-08.csv`, safe for Content-Disposition. */
export function seriesCsvFileName(stationCode: string, fromMs: number, toMs: number): string {
  const safeCode = stationCode.replace(/[^A-Za-z0-9_-]/g, '_');
  return `${safeCode}_${new Date(fromMs).toISOString().slice(0, 10)}_${new Date(toMs).toISOString().slice(0, 10)}.csv`;
}
