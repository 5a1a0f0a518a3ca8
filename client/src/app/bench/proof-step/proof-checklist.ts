import type { BenchWork } from '@shared/api/bench-work';
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

/** Says the clock correction in plain words: how far off at the first mark, and how fast it drifts. */
export function clockInWords(result: PipelineResult): string | null {
  const clock = result.clock;
  if (!clock || clock.method === 'none') return null;
  const first = clock.knots[0];
  const offsetMinutes = (first.trueTimeMs - first.chartTimeMs) / 60_000;
  // True time ahead of chart time: the drum has fallen behind, the clock is slow.
  const at = `clock ${Math.abs(offsetMinutes).toFixed(0)} min ${offsetMinutes >= 0 ? 'slow' : 'fast'} at the first mark`;
  if (clock.method === 'offset') return at;
  const rate = clock.rateMinutesPerDay;
  return `${at}, ${rate >= 0 ? 'losing' : 'gaining'} ${Math.abs(rate).toFixed(1)} min a day`;
}

/** Says the instrument correction in plain words: how far off on average, and the drift over the readings. */
export function instrumentInWords(result: PipelineResult): string | null {
  const instrument = result.instrument;
  if (!instrument || instrument.method === 'none' || instrument.knots.length === 0) return null;
  const mean = instrument.knots.reduce((sum, k) => sum + k.offsetHpa, 0) / instrument.knots.length;
  // The correction is barometer − chart: a negative offset means the pen reads high.
  const level = `instrument ${Math.abs(mean).toFixed(1)} hPa ${mean <= 0 ? 'high' : 'low'}`;
  if (instrument.knots.length < 2) return level;
  const first = instrument.knots[0];
  const last = instrument.knots[instrument.knots.length - 1];
  const weeks = (last.timeMs - first.timeMs) / (7 * 86_400_000);
  const drift = weeks > 0 ? -(last.offsetHpa - first.offsetHpa) / weeks : 0;
  if (Math.abs(drift) < 0.05) return `${level}, steady`;
  return `${level}, drifting ${drift >= 0 ? '+' : '−'}${Math.abs(drift).toFixed(1)} hPa a week`;
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
