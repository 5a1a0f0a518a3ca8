import type { PressureUnit } from '@shared/domain/pressure-units';
import { SERIES_FLAG_WORDS } from '@shared/api/series-flag-words';

import { flagMarkPath, isMarkedFlag } from '../../shared/plot-marks/flag-marks';
import { gapBracketPath } from '../../shared/plot-marks/gap-brackets';
import { findGapEnds } from '../../shared/pressure-plot/plot-gaps';
import { buildLinePath, createPlotScales, type PlotBox, type PlotScales } from '../../shared/pressure-plot/plot-scales';
import { buildUncertaintyBandPath } from '../../shared/pressure-plot/uncertainty-band';
import { type PlotPoint, pointsInView } from '../plot-math/plot-points';
import { formatTimeTick, thinStackedLabels, thinTickLabels } from '../plot-math/tick-labels';
import { unitTicks } from '../plot-math/unit-ticks';

/** One station's plotted points, with its name and its colour slot (0 is the first station). */
export interface StationLine {
  stationId: string;
  label: string;
  slot: number;
  points: readonly PlotPoint[];
}

/** What the detail plot draws for one station, as SVG path data. */
export interface DrawnLine {
  stationId: string;
  label: string;
  slot: number;
  line: string;
  band: string;
  gaps: string[];
  marks: { path: string; flag: string; word: string }[];
  /** Bars along the plot's foot: buckets holding flagged points, height by their share. */
  flaggedBars: { x: number; height: number; share: number }[];
}

const MARK_RADIUS = 3.5;
const BRACKET_UNIT = 0.75;
/** Bars at the foot are at most this tall, plot units. */
const FLAGGED_BAR_PX = 10;

/** The visible points of every line, the scales over them and the drawn shapes, for a view [fromMs, toMs]. */
export function drawLines(lines: readonly StationLine[], viewMs: readonly [number, number], box: PlotBox, maxStepMs: number): { scales: PlotScales; drawn: DrawnLine[] } {
  const visible = lines.map((line) => ({ ...line, points: pointsInView(line.points, viewMs[0], viewMs[1]) }));
  const scales = createPlotScales(
    visible.flatMap((line) => line.points.filter((point) => point.timeMs >= viewMs[0] && point.timeMs <= viewMs[1])),
    box,
    [viewMs[0], viewMs[1]],
  );
  const foot = box.height - box.marginBottom;
  const drawn = visible.map((line) => ({
    stationId: line.stationId,
    label: line.label,
    slot: line.slot,
    line: buildLinePath(line.points, scales, maxStepMs),
    band: buildUncertaintyBandPath(line.points, scales, maxStepMs),
    gaps: findGapEnds(line.points, scales, maxStepMs).map((ends) => gapBracketPath(ends.before, ends.after, BRACKET_UNIT)),
    marks: line.points.flatMap((point) =>
      isMarkedFlag(point.flag)
        ? [{ path: flagMarkPath(point.flag, scales.x(new Date(point.timeMs)), scales.y(point.pressureHpa), MARK_RADIUS), flag: point.flag, word: SERIES_FLAG_WORDS[point.flag] }]
        : [],
    ),
    flaggedBars: line.points
      .filter((point) => point.count > 1 && point.flaggedShare > 0)
      .map((point) => ({ x: scales.x(new Date(point.timeMs)), height: Math.max(1, point.flaggedShare * FLAGGED_BAR_PX), share: point.flaggedShare }))
      .map((bar) => ({ ...bar, height: Math.min(bar.height, foot - box.marginTop) })),
  }));
  return { scales, drawn };
}

/** Time ticks whose labels never collide, and pressure ticks in the chosen unit whose labels never overlap. */
export function detailTicks(scales: PlotScales, box: PlotBox, unit: PressureUnit): { x: { at: number; label: string }[]; y: { at: number; label: string }[] } {
  const ticks = scales.x.ticks(10);
  const stepMs = ticks.length > 1 ? ticks[1].getTime() - ticks[0].getTime() : 60_000;
  const x = thinTickLabels(
    ticks.map((tick) => ({ at: scales.x(tick), label: formatTimeTick(tick, stepMs) })),
    box.marginLeft - 30,
    box.width,
  );
  const domain = scales.y.domain() as [number, number];
  const y = thinStackedLabels(
    unitTicks(domain, unit, 6)
      .map((tick) => ({ at: scales.y(tick.valueHpa), label: tick.label }))
      .filter((tick) => tick.at >= box.marginTop - 0.5 && tick.at <= box.height - box.marginBottom + 0.5),
    12,
  );
  return { x, y };
}
