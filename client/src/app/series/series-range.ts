/** Reads a UTC day typed as YYYY-MM-DD; epoch ms of its midnight, or null for anything else. */
export function parseUtcDay(text: string): number | null {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text.trim());
  if (!match) return null;
  const ms = Date.UTC(Number(match[1]), Number(match[2]) - 1, Number(match[3]));
  // Date.UTC rolls 2026-02-30 over to March; a day that does not round-trip was not a real day.
  return new Date(ms).toISOString().slice(0, 10) === text.trim() ? ms : null;
}

const FILE_EXTENSIONS = { csv: 'csv', netcdf: 'nc', json: 'json' } as const;

/** File name for a download of the visible range, e.g. `isallo-KRO-SBS-20260302T0000Z-20260309T0000Z-hourly.csv`. */
export function seriesFileName(stationCodes: readonly string[], fromMs: number, toMs: number, step: string, format: keyof typeof FILE_EXTENSIONS): string {
  const stamp = (ms: number) => new Date(ms).toISOString().slice(0, 16).replace(/[-:]/g, '') + 'Z';
  const codes = stationCodes.map((code) => code.replace(/[^A-Za-z0-9_-]/g, '_')).join('-');
  return `isallo-${codes}-${stamp(fromMs)}-${stamp(toMs)}-${step}.${FILE_EXTENSIONS[format]}`;
}
