import type { RegularPoint } from '@shared/domain/resample';

/** CSV header of a digitized series, in order. */
export const DIGITIZED_CSV_HEADER = ['time', 'pressure_hpa', 'flag', 'uncertainty_hpa'] as const;

function iso(ms: number): string {
  return new Date(ms).toISOString().replace('.000Z', 'Z');
}

/** One line per point; gaps leave pressure and uncertainty empty. Flags as in SERIES_FLAGS. */
export function formatSeriesCsv(points: RegularPoint[]): string {
  const lines = [DIGITIZED_CSV_HEADER.join(',')];
  for (const p of points) {
    const pressure = p.pressureHpa === null ? '' : p.pressureHpa.toFixed(2);
    const uncertainty = p.uncertaintyHpa === null ? '' : p.uncertaintyHpa.toFixed(2);
    lines.push(`${iso(p.timeMs)},${pressure},${p.flag},${uncertainty}`);
  }
  return lines.join('\n') + '\n';
}
