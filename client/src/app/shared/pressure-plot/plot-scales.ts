import { scaleLinear, scaleUtc, type ScaleLinear, type ScaleTime } from 'd3-scale';
import type { SeriesPoint } from '@shared/api/series';

/** Inner drawing box of a plot, in SVG user units. */
export interface PlotBox {
  width: number;
  height: number;
  marginLeft: number;
  marginRight: number;
  marginTop: number;
  marginBottom: number;
}

export interface PlotScales {
  x: ScaleTime<number, number>;
  y: ScaleLinear<number, number>;
}

/** Smallest pressure span shown, hPa, so a calm week is not blown up into noise. */
const MIN_SPAN_HPA = 10;

/**
 * Time (UTC) → x and pressure (hPa) → y for the given points, with room for each point's uncertainty band.
 * Gap points carry no pressure and do not widen the pressure domain. With no usable points the domain is a neutral 1000–1020 hPa.
 */
export function createPlotScales(points: readonly SeriesPoint[], box: PlotBox, timeDomainMs?: [number, number]): PlotScales {
  const measured = points.filter((point) => point.flag !== 'gap' && Number.isFinite(point.pressureHpa));
  const timesMs = points.map((point) => Date.parse(point.time));
  const startMs = timeDomainMs?.[0] ?? (timesMs.length ? Math.min(...timesMs) : 0);
  const endMs = timeDomainMs?.[1] ?? (timesMs.length ? Math.max(...timesMs) : 1);
  // The axis holds the whole uncertainty band, not only the line.
  let lowHpa = measured.length ? Math.min(...measured.map((point) => point.pressureHpa - (point.uncertaintyHpa ?? 0))) : 1000;
  let highHpa = measured.length ? Math.max(...measured.map((point) => point.pressureHpa + (point.uncertaintyHpa ?? 0))) : 1020;
  if (highHpa - lowHpa < MIN_SPAN_HPA) {
    const middleHpa = (highHpa + lowHpa) / 2;
    lowHpa = middleHpa - MIN_SPAN_HPA / 2;
    highHpa = middleHpa + MIN_SPAN_HPA / 2;
  }
  const x = scaleUtc()
    .domain([new Date(startMs), new Date(endMs === startMs ? startMs + 1 : endMs)])
    .range([box.marginLeft, box.width - box.marginRight]);
  const y = scaleLinear()
    .domain([lowHpa, highHpa])
    .nice()
    .range([box.height - box.marginBottom, box.marginTop]);
  return { x, y };
}

/**
 * SVG path data for the pressure line, lifted at every gap point and wherever two neighbours are more
 * than maxStepMs apart, so missing data stays blank instead of being bridged by a straight line.
 */
export function buildLinePath(points: readonly SeriesPoint[], scales: PlotScales, maxStepMs: number): string {
  let path = '';
  let previousMs: number | null = null;
  for (const point of points) {
    const timeMs = Date.parse(point.time);
    if (point.flag === 'gap' || !Number.isFinite(point.pressureHpa)) {
      previousMs = null;
      continue;
    }
    const isLifted = previousMs === null || timeMs - previousMs > maxStepMs;
    path += `${isLifted ? 'M' : 'L'}${round(scales.x(new Date(timeMs)))},${round(scales.y(point.pressureHpa))}`;
    previousMs = timeMs;
  }
  return path;
}

/** Typical spacing of the series: the median step between neighbours, ms (0 for fewer than two points). */
export function medianStepMs(points: readonly SeriesPoint[]): number {
  const steps: number[] = [];
  for (let i = 1; i < points.length; i++) steps.push(Date.parse(points[i].time) - Date.parse(points[i - 1].time));
  if (steps.length === 0) return 0;
  steps.sort((a, b) => a - b);
  return steps[Math.floor(steps.length / 2)];
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}

const DAY_MS = 86_400_000;
const WEEKDAYS = ['Sun', 'Mon', 'Tue', 'Wed', 'Thu', 'Fri', 'Sat'];
const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'];

/**
 * Label of a UTC time tick, one style per axis (d3's default mixes "Mar 08" into a row of weekdays):
 * "Mon 2 Mar" on daily ticks, "Mar 2026" on monthly ones, "06:00" within a day with the day at midnight.
 */
export function formatUtcTick(tick: Date, stepMs: number): string {
  const day = `${WEEKDAYS[tick.getUTCDay()]} ${tick.getUTCDate()} ${MONTHS[tick.getUTCMonth()]}`;
  if (stepMs >= 28 * DAY_MS) return `${MONTHS[tick.getUTCMonth()]} ${tick.getUTCFullYear()}`;
  if (stepMs >= DAY_MS) return day;
  if (tick.getUTCHours() === 0 && tick.getUTCMinutes() === 0) return day;
  return `${String(tick.getUTCHours()).padStart(2, '0')}:${String(tick.getUTCMinutes()).padStart(2, '0')}`;
}
