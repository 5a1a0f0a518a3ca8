import type { ClockCorrection } from '../domain/clock-correction';
import type { InstrumentCorrection } from '../domain/instrument-correction';

/** A clock correction as plain words need it. */
export interface ClockWordsInput {
  method: string;
  /** True minus chart time at the first mark, minutes (positive: the drum had fallen behind, the clock slow). */
  firstOffsetMinutes: number;
  /** The drum's mean gain (+) or loss (−), minutes a day; unused for a single mark. */
  rateMinutesPerDay: number;
}

/** An instrument correction as plain words need it. */
export interface InstrumentWordsInput {
  /** Mean barometer − chart offset over the readings, hPa (negative: the pen reads high). */
  meanOffsetHpa: number;
  /** How fast the pen's error changes, hPa a week (positive: it reads ever higher); null with one reading. */
  penDriftHpaPerWeek: number | null;
}

const MS_PER_WEEK = 7 * 86_400_000;

/** The figures of a fitted clock correction that its words use. */
export function clockWordsInput(clock: ClockCorrection): ClockWordsInput {
  const first = clock.knots[0];
  return { method: clock.method, firstOffsetMinutes: first ? (first.trueTimeMs - first.chartTimeMs) / 60_000 : 0, rateMinutesPerDay: clock.rateMinutesPerDay };
}

/** The figures of a fitted instrument correction that its words use. */
export function instrumentWordsInput(instrument: InstrumentCorrection): InstrumentWordsInput {
  const knots = instrument.knots;
  const meanOffsetHpa = knots.reduce((sum, k) => sum + k.offsetHpa, 0) / Math.max(1, knots.length);
  if (knots.length < 2) return { meanOffsetHpa, penDriftHpaPerWeek: null };
  const first = knots[0];
  const last = knots[knots.length - 1];
  const weeks = (last.timeMs - first.timeMs) / MS_PER_WEEK;
  // The correction is barometer − chart, so the pen's own drift has the opposite sign.
  return { meanOffsetHpa, penDriftHpaPerWeek: weeks > 0 ? -(last.offsetHpa - first.offsetHpa) / weeks : 0 };
}

/** The clock correction in plain words: how far off at the first mark, and how fast it drifts. */
export function clockInWords(clock: ClockWordsInput): string {
  const offset = clock.firstOffsetMinutes;
  const rate = clock.rateMinutesPerDay;
  // Under half a minute off and a twentieth of a minute a day, "0 min slow, losing 0.0 min a day" says nothing.
  if (Math.abs(offset) < 0.5 && (clock.method === 'offset' || Math.abs(rate) < 0.05)) return 'clock keeps true time';
  // True time ahead of chart time: the drum has fallen behind, the clock is slow.
  const at = `clock ${Math.abs(offset).toFixed(0)} min ${offset >= 0 ? 'slow' : 'fast'} at the first mark`;
  if (clock.method === 'offset') return at;
  return `${at}, ${rate >= 0 ? 'losing' : 'gaining'} ${Math.abs(rate).toFixed(1)} min a day`;
}

/** The instrument correction in plain words: how far off on average, and the drift over the readings. */
export function instrumentInWords(instrument: InstrumentWordsInput): string {
  const mean = instrument.meanOffsetHpa;
  // Under 0.05 hPa the words would read "0.0 hPa high": say plainly that it reads true.
  const level = Math.abs(mean) < 0.05 ? 'instrument reads true' : `instrument ${Math.abs(mean).toFixed(1)} hPa ${mean <= 0 ? 'high' : 'low'}`;
  const drift = instrument.penDriftHpaPerWeek;
  if (drift === null) return level;
  if (Math.abs(drift) < 0.05) return `${level}, steady`;
  return `${level}, drifting ${drift >= 0 ? '+' : '−'}${Math.abs(drift).toFixed(1)} hPa a week`;
}

/** Which corrections a handed-in line had applied: marks and check readings its fits used (0: not corrected). */
export interface CorrectionsApplied {
  clockMarkCount: number;
  instrumentReadingCount: number;
}

const plural = (n: number, one: string) => `${n} ${one}${n === 1 ? '' : 's'}`;

/** The review list's words for the corrections applied: "clock (3 marks), instrument (2 readings)", or why none. */
export function correctionsAppliedInWords(applied: CorrectionsApplied): string {
  const parts: string[] = [];
  if (applied.clockMarkCount > 0) parts.push(`clock (${plural(applied.clockMarkCount, 'mark')})`);
  if (applied.instrumentReadingCount > 0) parts.push(`instrument (${plural(applied.instrumentReadingCount, 'reading')})`);
  if (parts.length === 2) return parts.join(', ');
  if (parts.length === 1) return `${parts[0]}; ${applied.clockMarkCount > 0 ? 'no check readings' : 'no marks'}`;
  return 'none — no marks or check readings';
}
