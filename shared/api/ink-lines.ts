import { refuseUnknownKeys } from './field-reader';
import { FEWEST_PINS } from '../domain/registration-model';
import { readInstant } from './parse-instant';
import { type BenchStep, isFiniteNumber, MAX_PINS, type BenchWork, parseBenchWork, type Parsed, type WorkCheckReading, type WorkKnot, type WorkTimeMark } from './bench-work';
import type { SeriesFlag } from './series';

/** A pin as the volunteer types it: a pixel on the scan and the printed time and pressure there. */
export interface PinInput {
  xPx: number;
  yPx: number;
  /** ISO 8601 UTC instant printed (or implied) at this grid crossing. */
  time: string;
  /** Pressure printed at this crossing, in the chart form's unit. */
  pressure: number;
}

export interface KnotInput {
  xPx: number;
  yPx: number;
}

/**
 * What the Bench sends when a volunteer hands in a trace: the work (pins and knots at least; time marks, chart
 * on / chart off and check readings when given) and the version of the volunteer's draft it hands in.
 */
export interface InkLineDraft {
  pins: PinInput[];
  knots: WorkKnot[];
  timeMarks?: WorkTimeMark[];
  chartOn?: string | null;
  chartOff?: string | null;
  checkReadings?: WorkCheckReading[];
  step?: BenchStep;
  /** The version of the caller's draft on this scan; required when the caller has one. */
  draftVersion?: number;
}

/** A parsed hand-in: the whole work, and the draft version it was made from (null: no draft). */
export interface HandInRequest {
  work: BenchWork;
  draftVersion: number | null;
}

export const INK_LINE_STATUSES = ['draft', 'handed_in', 'approved', 'returned'] as const;
export type InkLineStatus = (typeof INK_LINE_STATUSES)[number];

export interface PinResidualView {
  index: number;
  pressureHpa: number;
  minutes: number;
}

export interface InkLineSaved {
  inkLineId: string;
  scanId: string;
  status: InkLineStatus;
  version: number;
  registrationModel: string;
  registrationRmsHpa: number;
  registrationRmsMinutes: number;
  pinResiduals: PinResidualView[];
  /** Version of the shared pipeline that computed the points (shared/domain/pipeline/digitize-line.ts). */
  pipelineVersion: number;
  /** The clock correction applied; null when no time mark or chart on / chart off could be used. */
  clock: { method: string; rmsMinutes: number; rateMinutesPerDay: number; markCount: number } | null;
  /** The instrument correction applied; null when no check reading could be used. */
  instrument: { method: string; rmsHpa: number; meanOffsetHpa: number; readingCount: number } | null;
  seriesPointCount: number;
  firstPoint: { time: string; pressureHpa: number; flag: SeriesFlag } | null;
}

export { isFiniteNumber };

/**
 * Reads the `pins` of a request body, adding problems to `details` under paths like `pins.2.time`.
 * Shared by the ink-line draft and the Follow ink request, so both speak of pins alike.
 */
export function readPins(raw: unknown, details: Record<string, string>): PinInput[] {
  const pins: PinInput[] = [];
  if (!Array.isArray(raw)) details['pins'] = 'pins must be a list';
  else if (raw.length < FEWEST_PINS) details['pins'] = `at least ${FEWEST_PINS} pins are needed to register a chart`;
  else if (raw.length > MAX_PINS) details['pins'] = `at most ${MAX_PINS} pins`;
  else {
    raw.forEach((item: unknown, i: number) => {
      const p = (item ?? {}) as Record<string, unknown>;
      if (!isFiniteNumber(p['xPx'])) details[`pins.${i}.xPx`] = 'xPx must be a number';
      if (!isFiniteNumber(p['yPx'])) details[`pins.${i}.yPx`] = 'yPx must be a number';
      if (!isFiniteNumber(p['pressure'])) details[`pins.${i}.pressure`] = 'pressure must be a number';
      const time = readInstant(p['time']);
      if (!time.ok) details[`pins.${i}.time`] = `time ${time.problem}`;
      const utcTime = time.ok ? new Date(time.ms).toISOString() : '';
      pins.push({ xPx: p['xPx'] as number, yPx: p['yPx'] as number, time: utcTime, pressure: p['pressure'] as number });
    });
  }
  return pins;
}

/**
 * Checks a hand-in from the wire. Used by the server route and by the Bench before sending, so both report the
 * same problems with the same paths.
 */
export function parseInkLineDraft(x: unknown): Parsed<HandInRequest> {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) return { ok: false, details: { '': 'body must be an object' } };
  const body = x as Record<string, unknown>;
  const parsed = parseBenchWork(body, { forHandIn: true, otherKeys: ['draftVersion'] });
  const details = parsed.ok ? {} : { ...parsed.details };
  const version = body['draftVersion'];
  if (version !== undefined && !(Number.isInteger(version) && (version as number) >= 1)) details['draftVersion'] = 'draftVersion must be a whole number from 1';
  if (!parsed.ok || Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value: { work: parsed.value, draftVersion: (version as number | undefined) ?? null } };
}

/** What the Bench sends to autosave: the draft version it last saw (null: none yet) and the whole work. */
export interface DraftSaveRequest {
  version: number | null;
  work: BenchWork;
}

export function parseDraftSave(x: unknown): Parsed<DraftSaveRequest> {
  if (typeof x !== 'object' || x === null || Array.isArray(x)) return { ok: false, details: { '': 'body must be an object' } };
  const body = x as Record<string, unknown>;
  const details: Record<string, string> = {};
  refuseUnknownKeys(body, ['version', 'work'], details);
  const version = body['version'];
  if (version !== null && !(Number.isInteger(version) && (version as number) >= 1)) details['version'] = 'version must be null (a new draft) or a whole number from 1';
  const work = parseBenchWork(body['work']);
  if (!work.ok) for (const [key, value] of Object.entries(work.details)) details[key ? `work.${key}` : 'work'] = value;
  if (!work.ok || Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value: { version: version as number | null, work: work.value } };
}

export interface DraftSaved {
  inkLineId: string;
  scanId: string;
  version: number;
  /** When the server stored this version (ISO 8601). */
  updatedAt: string;
}

/** The caller's own ink line on one scan: the draft to resume, or the line handed in (read-only on the Bench). */
export interface MyInkLine {
  inkLineId: string;
  scanId: string;
  status: InkLineStatus;
  version: number;
  work: BenchWork;
  updatedAt: string;
  handedInAt: string | null;
  /** What the hand-in computed; null for a draft. */
  result: InkLineSaved | null;
}

/** A row of "My drafts" on the Desk. */
export interface MyInkLineSummary {
  inkLineId: string;
  scanId: string;
  stationName: string | null;
  chartStart: string | null;
  status: InkLineStatus;
  version: number;
  pinCount: number;
  knotCount: number;
  /** When the work was last saved (ISO 8601). */
  updatedAt: string;
}
