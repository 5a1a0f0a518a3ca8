import type { ChartRegion, FrontCandidateView, NoteDerivedValues } from '@shared/api/lessons';
import type { SeriesPoint } from '@shared/api/series';
import type { ChartForm } from '@shared/domain/chart-form';
import { findFrontCandidates } from '@shared/domain/front-candidates';
import { pressureChange } from '@shared/domain/pressure-change';
import { type PressureAtTime, threeHourTendency } from '@shared/domain/pressure-tendency';
import { pixelToReading } from '@shared/domain/registration';
import type { StoredFrontNote } from './lesson.table';
import type { ChartSource } from './lessons.repository';

const HOUR_MS = 3_600_000;
/** At most this many chart regions in a lesson (a fortnight of daily charts). */
export const MAX_CHART_REGIONS = 16;
/** Knots sent per region for drawing the ink line; more adds bytes, not detail, at handout size. */
const MAX_DRAWN_KNOTS = 600;

/** The series as the domain functions read it. */
export function toPressureSamples(points: readonly SeriesPoint[]): PressureAtTime[] {
  return points.map((point) => ({ timeMs: Date.parse(point.time), pressureHpa: point.flag === 'gap' ? null : point.pressureHpa }));
}

/** The front candidates of the passage, each keyed by kind and time (stable while the series is). */
export function frontCandidatesOf(points: readonly SeriesPoint[]): FrontCandidateView[] {
  return findFrontCandidates(toPressureSamples(points)).map((candidate) => {
    const time = new Date(candidate.timeMs).toISOString();
    return { key: `${candidate.kind}@${time}`, kind: candidate.kind, time, depthHpa: candidate.depthHpa, rateHpaPerHour: candidate.rateHpaPerHour };
  });
}

/**
 * The derived values beside a note: the three-hour tendency ending at its time (at its end for a span), and
 * the change over its span, or over the three hours before a note at one time.
 */
export function derivedValuesOf(samples: PressureAtTime[], note: Pick<StoredFrontNote, 'time' | 'endTime'>): NoteDerivedValues {
  const startMs = Date.parse(note.time);
  const endMs = note.endTime === null ? startMs : Date.parse(note.endTime);
  const tendency = threeHourTendency(samples, endMs);
  const change = endMs > startMs ? pressureChange(samples, startMs, endMs) : pressureChange(samples, endMs - 3 * HOUR_MS, endMs);
  return {
    tendency: tendency && { amountHpa: tendency.amountHpa, ppp: tendency.ppp, characteristic: tendency.characteristic, group: tendency.group },
    change: change && {
      fromTime: new Date(change.fromMs).toISOString(),
      toTime: new Date(change.toMs).toISOString(),
      changeHpa: change.changeHpa,
      rateHpaPerHour: change.rateHpaPerHour,
    },
  };
}

/** Every n-th knot so that at most `limit` remain, keeping the last. */
function thin<T>(items: T[], limit: number): T[] {
  if (items.length <= limit) return items;
  const step = items.length / (limit - 1);
  const kept = Array.from({ length: limit - 1 }, (_, k) => items[Math.floor(k * step)]);
  kept.push(items[items.length - 1]);
  return kept;
}

/**
 * The region of each scan that holds the passage's part of its ink line: the knots read (through the stored fit)
 * inside fromMs–toMs, boxed with room above and below for the grid around the line, cut at the image's edges.
 * Regions are in time order; `imagePath(index)` says where each one's image is served.
 */
export function chartRegionsOf(
  sources: readonly ChartSource[],
  forms: ReadonlyMap<string, ChartForm>,
  fromMs: number,
  toMs: number,
  imagePath: (index: number) => string,
): ChartRegion[] {
  const regions: Omit<ChartRegion, 'index' | 'imagePath'>[] = [];
  for (const source of sources) {
    const form = forms.get(source.chartFormId);
    if (!form) continue;
    const inside = source.knots
      .map((knot) => ({ knot, timeMs: source.chartStartMs + pixelToReading(form, source.fit, knot.xPx, knot.yPx).hours * HOUR_MS }))
      .filter((entry) => entry.timeMs >= fromMs && entry.timeMs <= toMs)
      .sort((a, b) => a.timeMs - b.timeMs);
    if (inside.length < 2) continue;
    const xs = inside.map((entry) => entry.knot.xPx);
    const ys = inside.map((entry) => entry.knot.yPx);
    const lineHeight = Math.max(...ys) - Math.min(...ys);
    const padX = Math.max(12, 0.02 * source.widthPx);
    const padY = Math.max(40, 0.3 * lineHeight);
    const x0 = Math.max(0, Math.floor(Math.min(...xs) - padX));
    const y0 = Math.max(0, Math.floor(Math.min(...ys) - padY));
    const x1 = Math.min(source.widthPx, Math.ceil(Math.max(...xs) + padX));
    const y1 = Math.min(source.heightPx, Math.ceil(Math.max(...ys) + padY));
    regions.push({
      scanId: source.scanId,
      region: { xPx: x0, yPx: y0, widthPx: x1 - x0, heightPx: y1 - y0 },
      inkLine: thin(inside, MAX_DRAWN_KNOTS).map((entry) => ({ xPx: entry.knot.xPx, yPx: entry.knot.yPx })),
      from: new Date(inside[0].timeMs).toISOString(),
      to: new Date(inside[inside.length - 1].timeMs).toISOString(),
    });
  }
  regions.sort((a, b) => Date.parse(a.from) - Date.parse(b.from) || (a.scanId ?? '').localeCompare(b.scanId ?? ''));
  return regions.slice(0, MAX_CHART_REGIONS).map((region, index) => ({ ...region, index, imagePath: imagePath(index) }));
}

/** The IIIF size parameter of a region's image: its own width, or at most maxWidthPx wide. */
export function regionImageSize(region: ChartRegion['region'], maxWidthPx = 1600): string {
  return `${Math.min(region.widthPx, maxWidthPx)},`;
}
