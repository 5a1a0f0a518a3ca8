import { clockWordsInput, instrumentWordsInput } from '@shared/api/correction-words';
import type { ClockCorrectionView, InstrumentCorrectionView, ReviewCorrections } from '@shared/api/review';
import type { ClockCorrection, ClockMark } from '@shared/domain/clock-correction';
import type { InstrumentCorrection } from '@shared/domain/instrument-correction';
import type { CheckReadingUse } from '@shared/domain/pipeline/robust-instrument';
import type { StoredInkLineResult } from '../ink-lines/ink-line.table';

const iso = (ms: number) => new Date(ms).toISOString();

/** The stored corrections as storedResultOf (ink-line-reading.ts) wrote them from the pipeline's result. */
interface StoredCorrections {
  clock: ClockCorrection | null;
  instrument: InstrumentCorrection | null;
  matchedMarks: ClockMark[];
  droppedMarkChartTimesMs: number[];
  checkReadingUses: CheckReadingUse[];
}

function clockView(clock: ClockCorrection | null, marks: ClockMark[], dropped: number[]): ClockCorrectionView | null {
  if (!clock || clock.method === 'none') return null;
  const residualAt = new Map(clock.residuals.map((residual) => [residual.chartTimeMs, residual]));
  const droppedAt = new Set(dropped);
  return {
    ...clockWordsInput(clock),
    method: clock.method,
    rmsMinutes: clock.rmsMinutes,
    marks: [...marks]
      .sort((a, b) => a.chartTimeMs - b.chartTimeMs)
      .map((mark) => ({
        kind: mark.kind,
        chartTime: iso(mark.chartTimeMs),
        trueTime: iso(mark.trueTimeMs),
        errorMinutes: (mark.trueTimeMs - mark.chartTimeMs) / 60_000,
        leaveOneOutMinutes: residualAt.get(mark.chartTimeMs)?.leaveOneOutMinutes ?? null,
        isDropped: droppedAt.has(mark.chartTimeMs),
      })),
  };
}

function instrumentView(instrument: InstrumentCorrection | null): InstrumentCorrectionView | null {
  if (!instrument || instrument.method === 'none' || instrument.knots.length === 0) return null;
  return {
    ...instrumentWordsInput(instrument),
    method: instrument.method,
    rmsHpa: instrument.rmsHpa,
    readings: instrument.residuals.map((residual) => ({ time: iso(residual.timeMs), offsetHpa: residual.offsetHpa, residualHpa: residual.residualHpa })),
  };
}

/** The review page's corrections of a line, from what its hand-in stored (a line stored before results existed: none). */
export function reviewCorrectionsOf(result: StoredInkLineResult | null): ReviewCorrections {
  if (!result) return { clock: null, instrument: null, checkReadingUses: [] };
  const stored = result.corrections as StoredCorrections;
  return {
    clock: clockView(stored.clock, stored.matchedMarks ?? [], stored.droppedMarkChartTimesMs ?? []),
    instrument: instrumentView(stored.instrument),
    checkReadingUses: stored.checkReadingUses ?? [],
  };
}
