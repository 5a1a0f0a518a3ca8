import type { ChartForm } from '../chart-form';

const HOUR_MS = 3_600_000;
/** The ink is followed a little beyond chart on / chart off: a drum clock error moves the line along the chart. */
export const SPAN_MARGIN_HOURS = 2;

/**
 * Hours after the chart start over which Follow ink looks for the pen line: chart on → chart off widened by the
 * margin, within the drum turn; the whole turn where either is not known. One rule for the Bench's Follow ink and
 * the offline pipeline, so both follow the same line on the same scan.
 */
export function followSpanHours(
  form: ChartForm,
  chartStartMs: number,
  chartOnMs: number | null,
  chartOffMs: number | null,
): { startHours: number; endHours: number } {
  const hoursOf = (ms: number) => (ms - chartStartMs) / HOUR_MS;
  return {
    startHours: Math.max(0, chartOnMs !== null ? hoursOf(chartOnMs) - SPAN_MARGIN_HOURS : 0),
    endHours: Math.min(form.drumHours, chartOffMs !== null ? hoursOf(chartOffMs) + SPAN_MARGIN_HOURS : form.drumHours),
  };
}
