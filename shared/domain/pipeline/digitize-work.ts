import type { BenchWork } from '../../api/bench-work';
import type { ChartForm } from '../chart-form';
import { digitizeLine, type PipelineLine, type PipelineResult } from './digitize-line';

/**
 * The Bench's knots as the pipeline's line: a knot's gapAfter (a pen gap or a lift) is a gap span to the next,
 * bridgeAfter a bridge; hand-placed knots have no confidence (NaN), followed ones the finder's.
 */
export function lineOfKnots(work: BenchWork): PipelineLine {
  return {
    xPx: work.knots.map((k) => k.xPx),
    yPx: work.knots.map((k) => k.yPx),
    confidence: work.knots.map((k) => k.confidence ?? Number.NaN),
    spans: work.knots.flatMap((k, i) => (k.gapAfter && i + 1 < work.knots.length ? [{ kind: 'gap' as const, startIndex: i, endIndex: i + 1 }] : [])),
    bridgesAfter: work.knots.flatMap((k, i) => (k.bridgeAfter ? [i] : [])),
    lineWidthPx: null,
    foundTimeMarks: [],
  };
}

/**
 * Reads the Bench's work through the shared pipeline: the server at hand-in (from the work alone, never the
 * client's numbers) and the Bench's Proof step call this, so both show the same series. Throws RegistrationError.
 */
export function digitizeWork(form: ChartForm, chartStartMs: number, work: BenchWork): PipelineResult {
  return digitizeLine({
    form,
    chartStartMs,
    pins: work.pins.map((p) => ({ xPx: p.xPx, yPx: p.yPx, timeMs: Date.parse(p.time), pressure: p.pressure })),
    ink: lineOfKnots(work),
    // A hand-in's marks all have their time (the parser insists); a draft's mark still without one is left out.
    timeMarks: work.timeMarks.flatMap((m) => (m.time === null ? [] : [{ trueTimeMs: Date.parse(m.time), xPx: m.xPx, yPx: m.yPx }])),
    chartOnMs: work.chartOn === null ? null : Date.parse(work.chartOn),
    chartOffMs: work.chartOff === null ? null : Date.parse(work.chartOff),
    checkReadings: work.checkReadings.map((c) => ({ timeMs: Date.parse(c.time), pressureHpa: c.pressureHpa })),
  });
}


/** The name the server's hand-in uses. */
export const computeHandIn = digitizeWork;
