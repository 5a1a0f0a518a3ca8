import { followInk, type FollowInkOptions } from '@shared/domain/ink/follow-ink';
import type { InkTrace } from '@shared/domain/ink/ink-trace';
import { parseHexColour, type RawImage } from '@shared/domain/ink/raw-image';
import { digitizeLine, type PipelineResult } from '@shared/domain/pipeline/digitize-line';
import type { ChartFile } from './chart-file';

export interface DigitizeOptions {
  /** Series step, minutes (60: hourly). */
  stepMinutes?: number;
  follow?: Partial<FollowInkOptions>;
}

/** Everything one run produced, for the CLI, the spec and the bench: the pipeline's result and the followed trace. */
export interface DigitizeResult extends PipelineResult {
  trace: InkTrace;
}

const DEFAULT_MAX_BRIDGE_MM = 0.5;

/**
 * Digitizes one scan offline through the shared pipeline (shared/domain/pipeline/digitize-line.ts), the same
 * one the server runs at hand-in; here the ink step follows the pen line in the image.
 */
export function digitizeChart(image: RawImage, chart: ChartFile, options: DigitizeOptions = {}): DigitizeResult {
  const form = chart.form;
  let trace: InkTrace | null = null;
  const result = digitizeLine(
    {
      form,
      chartStartMs: Date.parse(chart.chartStart),
      pins: chart.pins.map((p) => ({ xPx: p.xPx, yPx: p.yPx, timeMs: Date.parse(p.time), pressure: p.pressure })),
      ink: (registration, hours) => {
        const followed = followInk(image, form, registration, {
          ...hours,
          inkColour: chart.ink.colour ? (parseHexColour(chart.ink.colour) ?? undefined) : undefined,
          seed: chart.ink.seed,
          maxBridgeMm: options.follow?.maxBridgeMm ?? DEFAULT_MAX_BRIDGE_MM,
          ...options.follow,
        });
        trace = followed;
        return {
          xPx: followed.xPx,
          yPx: followed.yPx,
          confidence: followed.confidence,
          spans: followed.spans,
          bridgesAfter: [],
          lineWidthPx: followed.lineWidthPx,
          foundTimeMarks: followed.timeMarks,
        };
      },
      timeMarks: chart.timeMarks.map((m) => ({ trueTimeMs: Date.parse(m.time), xPx: m.xPx, yPx: m.yPx })),
      chartOnMs: chart.chartOn ? Date.parse(chart.chartOn) : null,
      chartOffMs: chart.chartOff ? Date.parse(chart.chartOff) : null,
      checkReadings: chart.checkReadings.map((c) => ({ timeMs: Date.parse(c.time), pressureHpa: c.pressureHpa })),
    },
    { stepMinutes: options.stepMinutes },
  );
  if (trace === null) throw new Error('the pipeline did not follow the ink');
  return { ...result, trace };
}
