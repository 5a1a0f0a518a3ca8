import { FEWEST_PINS } from '../domain/registration-model';
import { readInstant } from './parse-instant';
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

/** What the Bench sends when a volunteer hands in a trace. */
export interface InkLineDraft {
  pins: PinInput[];
  knots: KnotInput[];
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
  seriesPointCount: number;
  firstPoint: { time: string; pressureHpa: number; flag: SeriesFlag } | null;
}

const MAX_PINS = 200;
const MAX_KNOTS = 100000;

export function isFiniteNumber(x: unknown): x is number {
  return typeof x === 'number' && Number.isFinite(x);
}

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
 * Checks an ink-line draft from the wire. Used by the server route and by the Bench before sending,
 * so both report the same problems with the same paths.
 */
export function parseInkLineDraft(
  x: unknown,
): { ok: true; value: InkLineDraft } | { ok: false; details: Record<string, string> } {
  const details: Record<string, string> = {};
  if (typeof x !== 'object' || x === null) return { ok: false, details: { '': 'body must be an object' } };
  const body = x as Record<string, unknown>;
  const pins = readPins(body['pins'], details);
  const knots: KnotInput[] = [];
  if (!Array.isArray(body['knots'])) details['knots'] = 'knots must be a list';
  else if (body['knots'].length < 2) details['knots'] = 'at least two knots are needed along the pen line';
  else if (body['knots'].length > MAX_KNOTS) details['knots'] = `at most ${MAX_KNOTS} knots`;
  else {
    body['knots'].forEach((raw: unknown, i: number) => {
      const k = (raw ?? {}) as Record<string, unknown>;
      if (!isFiniteNumber(k['xPx']) || !isFiniteNumber(k['yPx'])) details[`knots.${i}`] = 'xPx and yPx must be numbers';
      knots.push({ xPx: k['xPx'] as number, yPx: k['yPx'] as number });
    });
  }
  if (Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value: { pins, knots } };
}
