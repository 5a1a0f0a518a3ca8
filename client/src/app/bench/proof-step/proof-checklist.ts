import type { BenchWork } from '@shared/api/bench-work';
import { clockInWords as clockWords, clockWordsInput, instrumentInWords as instrumentWords, instrumentWordsInput } from '@shared/api/correction-words';
import type { PipelineResult } from '@shared/domain/pipeline/digitize-line';

/** One line of the Proof checklist: fine, or a specific warning. */
export interface ProofItem {
  isWarning: boolean;
  text: string;
}

/** A pin this far from the fitted grid is worth a second look (common practice: a quarter of a grid step). */
const PIN_WARN_MINUTES = 5;
const PIN_WARN_HPA = 0.5;

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/** Says the clock correction in plain words (shared with Review), or null when the clock was not corrected. */
export function clockInWords(result: PipelineResult): string | null {
  const clock = result.clock;
  return clock && clock.method !== 'none' ? clockWords(clockWordsInput(clock)) : null;
}

/** Says the instrument correction in plain words (shared with Review), or null when it was not corrected. */
export function instrumentInWords(result: PipelineResult): string | null {
  const instrument = result.instrument;
  return instrument && instrument.method !== 'none' && instrument.knots.length > 0 ? instrumentWords(instrumentWordsInput(instrument)) : null;
}

/** The checklist from the numbers of the pipeline's result: pins, line, gaps, suspect stretches, corrections. */
export function proofChecklist(work: BenchWork, result: PipelineResult): ProofItem[] {
  const items: ProofItem[] = [];
  const fit = result.registration;
  items.push({ isWarning: false, text: `${plural(work.pins.length, 'pin')}: RMS ${fit.rmsHpa.toFixed(2)} hPa, ${fit.rmsMinutes.toFixed(1)} min (${fit.model})` });
  for (const residual of fit.residuals) {
    if (Math.abs(residual.minutes) > PIN_WARN_MINUTES || Math.abs(residual.pressureHpa) > PIN_WARN_HPA) {
      items.push({
        isWarning: true,
        text: `pin ${residual.index + 1} is ${Math.abs(residual.minutes).toFixed(0)} min and ${Math.abs(residual.pressureHpa).toFixed(2)} hPa off the others`,
      });
    }
  }
  const valued = result.series.filter((p) => p.pressureHpa !== null);
  const gaps = result.series.filter((p) => p.flag === 'gap').length;
  const suspect = result.series.filter((p) => p.flag === 'suspect').length;
  const interpolated = result.series.filter((p) => p.flag === 'interpolated').length;
  items.push({ isWarning: valued.length === 0, text: `${plural(valued.length, 'hourly point')} from ${plural(work.knots.length, 'knot')}` });
  if (gaps > 0) items.push({ isWarning: false, text: `${plural(gaps, 'hour')} left as gaps` });
  if (suspect > 0) items.push({ isWarning: true, text: `${plural(suspect, 'hour')} on doubtful ink (flagged suspect): check the line there` });
  if (interpolated > 0) items.push({ isWarning: false, text: `${plural(interpolated, 'hour')} interpolated between knots` });
  const clock = clockInWords(result);
  items.push(
    clock
      ? { isWarning: false, text: `${clock} (from ${plural(result.matchedMarks.length, 'mark')})` }
      : { isWarning: true, text: 'clock not corrected: no time marks and no chart on / chart off' },
  );
  if (result.droppedMarkChartTimesMs.length > 0) {
    items.push({ isWarning: true, text: `${plural(result.droppedMarkChartTimesMs.length, 'mark')} left out: contradicts the others` });
  }
  const instrument = instrumentInWords(result);
  items.push(instrument ? { isWarning: false, text: instrument } : { isWarning: true, text: 'instrument not corrected: no check readings on the line' });
  result.checkReadingUses.forEach((use, i) => {
    if (use === 'outlier') items.push({ isWarning: true, text: `check reading ${i + 1} left out: contradicts the others` });
    if (use === 'no_line') items.push({ isWarning: true, text: `check reading ${i + 1} is not on traced ink` });
  });
  return items;
}
