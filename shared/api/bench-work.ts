import { refuseUnknownKeys } from './field-reader';
import type { PinInput } from './ink-lines';

export function isFiniteNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

/** The Bench's steps, in order. */
export const BENCH_STEPS = ['pin', 'ink', 'marks', 'proof'] as const;
export type BenchStep = (typeof BENCH_STEPS)[number];

/**
 * A knot of the work: full-resolution scan pixels. Knots found by Follow ink carry the finder's confidence
 * (0–1); gapAfter: no ink from this knot to the next (a pen gap or a lift); bridgeAfter: the stretch to the next
 * joins a short skip on purpose (its points are flagged interpolated).
 */
export interface WorkKnot {
  xPx: number;
  yPx: number;
  confidence?: number;
  gapAfter?: boolean;
  bridgeAfter?: boolean;
}

/** A time mark's foot on the line (scan px) and the true instant the observer made it (ISO 8601 UTC; null until given). */
export interface WorkTimeMark {
  xPx: number;
  yPx: number;
  time: string | null;
}

/** A check reading: the station barometer's pressure (station level, hPa) at a true instant (ISO 8601 UTC). */
export interface WorkCheckReading {
  time: string;
  pressureHpa: number;
}

/**
 * Everything a volunteer has done on one chart, as the Bench autosaves it and resumes it: the step, the pins,
 * the knots with their spans, the time marks, chart on / chart off and the check readings.
 */
export interface BenchWork {
  step: BenchStep;
  pins: PinInput[];
  knots: WorkKnot[];
  timeMarks: WorkTimeMark[];
  /** Chart on / chart off as written on the chart, converted to UTC (ISO 8601); null when not given. */
  chartOn: string | null;
  chartOff: string | null;
  checkReadings: WorkCheckReading[];
}

export const EMPTY_BENCH_WORK: BenchWork = { step: 'pin', pins: [], knots: [], timeMarks: [], chartOn: null, chartOff: null, checkReadings: [] };

export const MAX_PINS = 200;
export const MAX_KNOTS = 100000;
const MAX_TIME_MARKS = 200;
const MAX_CHECK_READINGS = 200;

export type Parsed<T> = { ok: true; value: T } | { ok: false; details: Record<string, string> };

function isInstant(x: unknown): x is string {
  return typeof x === 'string' && !Number.isNaN(Date.parse(x));
}

function readList<T>(
  raw: unknown,
  path: string,
  max: number,
  details: Record<string, string>,
  readItem: (item: Record<string, unknown>, itemPath: string) => T,
): T[] {
  if (raw === undefined) return [];
  if (!Array.isArray(raw)) {
    details[path] = `${path} must be a list`;
    return [];
  }
  if (raw.length > max) {
    details[path] = `at most ${max} ${path}`;
    return [];
  }
  return raw.map((item: unknown, i: number) => readItem((item ?? {}) as Record<string, unknown>, `${path}.${i}`));
}

function readPin(p: Record<string, unknown>, path: string, details: Record<string, string>): PinInput {
  if (!isFiniteNumber(p['xPx'])) details[`${path}.xPx`] = 'xPx must be a number';
  if (!isFiniteNumber(p['yPx'])) details[`${path}.yPx`] = 'yPx must be a number';
  if (!isFiniteNumber(p['pressure'])) details[`${path}.pressure`] = 'pressure must be a number';
  if (!isInstant(p['time'])) details[`${path}.time`] = 'time must be an ISO 8601 instant';
  return { xPx: p['xPx'] as number, yPx: p['yPx'] as number, time: p['time'] as string, pressure: p['pressure'] as number };
}

function readKnot(k: Record<string, unknown>, path: string, details: Record<string, string>): WorkKnot {
  if (!isFiniteNumber(k['xPx']) || !isFiniteNumber(k['yPx'])) details[path] = 'xPx and yPx must be numbers';
  const knot: WorkKnot = { xPx: k['xPx'] as number, yPx: k['yPx'] as number };
  if (k['confidence'] !== undefined) {
    if (!isFiniteNumber(k['confidence']) || k['confidence'] < 0 || k['confidence'] > 1) details[`${path}.confidence`] = 'confidence must be a number from 0 to 1';
    else knot.confidence = k['confidence'];
  }
  for (const flag of ['gapAfter', 'bridgeAfter'] as const) {
    if (k[flag] === undefined) continue;
    if (typeof k[flag] !== 'boolean') details[`${path}.${flag}`] = `${flag} must be true or false`;
    else if (k[flag]) knot[flag] = true;
  }
  if (knot.gapAfter && knot.bridgeAfter) details[path] = 'a knot cannot both lift and bridge to the next';
  return knot;
}

function readOptionalInstant(raw: unknown, path: string, details: Record<string, string>): string | null {
  if (raw === undefined || raw === null) return null;
  if (!isInstant(raw)) {
    details[path] = `${path} must be an ISO 8601 instant or null`;
    return null;
  }
  return new Date(raw).toISOString();
}

/**
 * Checks a BenchWork from the wire. A draft may be unfinished (any number of pins and knots, marks without
 * their time yet); `forHandIn` adds what a hand-in needs. Paths are dotted (`pins.2.time`), as everywhere.
 */
/** The fields of a Bench work object. */
export const BENCH_WORK_KEYS = ['step', 'pins', 'knots', 'timeMarks', 'chartOn', 'chartOff', 'checkReadings'] as const;

export function parseBenchWork(x: unknown, options: { forHandIn?: boolean; otherKeys?: readonly string[] } = {}): Parsed<BenchWork> {
  const details: Record<string, string> = {};
  if (typeof x !== 'object' || x === null || Array.isArray(x)) return { ok: false, details: { '': 'work must be an object' } };
  const body = x as Record<string, unknown>;
  // `otherKeys`: fields the caller reads beside the work in the same object (a hand-in's draftVersion).
  refuseUnknownKeys(body, [...BENCH_WORK_KEYS, ...(options.otherKeys ?? [])], details);
  let step: BenchStep = 'pin';
  if (body['step'] !== undefined) {
    if (typeof body['step'] === 'string' && (BENCH_STEPS as readonly string[]).includes(body['step'])) step = body['step'] as BenchStep;
    else details['step'] = `step must be one of: ${BENCH_STEPS.join(', ')}`;
  }
  const pins = readList(body['pins'], 'pins', MAX_PINS, details, (p, path) => readPin(p, path, details));
  const knots = readList(body['knots'], 'knots', MAX_KNOTS, details, (k, path) => readKnot(k, path, details));
  const timeMarks = readList(body['timeMarks'], 'timeMarks', MAX_TIME_MARKS, details, (m, path): WorkTimeMark => {
    if (!isFiniteNumber(m['xPx']) || !isFiniteNumber(m['yPx'])) details[path] = 'xPx and yPx must be numbers';
    const time = readOptionalInstant(m['time'], `${path}.time`, details);
    if (options.forHandIn && time === null && !details[`${path}.time`]) details[`${path}.time`] = 'give the true time of this time mark, or remove it';
    return { xPx: m['xPx'] as number, yPx: m['yPx'] as number, time };
  });
  const checkReadings = readList(body['checkReadings'], 'checkReadings', MAX_CHECK_READINGS, details, (c, path): WorkCheckReading => {
    if (!isInstant(c['time'])) details[`${path}.time`] = 'time must be an ISO 8601 instant';
    if (!isFiniteNumber(c['pressureHpa']) || c['pressureHpa'] < 500 || c['pressureHpa'] > 1100) {
      details[`${path}.pressureHpa`] = 'pressureHpa must be a station pressure from 500 to 1100 hPa';
    }
    return { time: isInstant(c['time']) ? new Date(c['time']).toISOString() : (c['time'] as string), pressureHpa: c['pressureHpa'] as number };
  });
  const chartOn = readOptionalInstant(body['chartOn'], 'chartOn', details);
  const chartOff = readOptionalInstant(body['chartOff'], 'chartOff', details);
  if (chartOn !== null && chartOff !== null && Date.parse(chartOff) <= Date.parse(chartOn)) details['chartOff'] = 'chart off must come after chart on';
  if (options.forHandIn) {
    if (!details['pins'] && pins.length < 3) details['pins'] = 'at least three pins are needed to register a chart';
    if (!details['knots'] && knots.length < 2) details['knots'] = 'at least two knots are needed along the pen line';
  }
  if (Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value: { step, pins, knots, timeMarks, chartOn, chartOff, checkReadings } };
}
