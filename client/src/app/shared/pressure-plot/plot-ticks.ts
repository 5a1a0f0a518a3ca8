import { formatUtcTick, type PlotBox, type PlotScales } from './plot-scales';

/** Ticks closer to the plot's side than this lean inwards, so their labels are not cut off. */
const EDGE_PX = 40;

/** Time ticks with their labels and text anchors, about `count` of them. */
export function timeTicks(scales: PlotScales, box: PlotBox, count: number): { at: number; label: string; anchor: 'start' | 'middle' | 'end' }[] {
  const ticks = scales.x.ticks(count);
  const stepMs = ticks.length > 1 ? ticks[1].getTime() - ticks[0].getTime() : 0;
  return ticks.map((tick) => {
    const at = scales.x(tick);
    const anchor = at > box.width - box.marginRight - EDGE_PX ? 'end' : at < box.marginLeft + EDGE_PX ? 'start' : 'middle';
    return { at, label: formatUtcTick(tick, stepMs), anchor };
  });
}

/** Pressure ticks, about `count` of them. */
export function pressureTicks(scales: PlotScales, count: number): { at: number; label: string }[] {
  return scales.y.ticks(count).map((tick) => ({ at: scales.y(tick), label: String(tick) }));
}
