import { refuseUnknownKeys } from './field-reader';
import { isFiniteNumber, readPins, type PinInput } from './ink-lines';

/** What the Bench sends to let Follow ink find the pen line: the pins, and optionally a pixel on the line and its colour. */
export interface FollowInkRequest {
  pins: PinInput[];
  /** A pixel on the pen line (full-resolution scan pixels); the followed line is held to pass through it. */
  seed?: { xPx: number; yPx: number };
  /** Ink colour as '#rrggbb'. */
  inkColour?: string;
}

/** One followed knot in full-resolution scan pixels, with the finder's confidence (0–1). */
export interface FollowedKnot {
  xPx: number;
  yPx: number;
  confidence: number;
}

/**
 * A named span of the followed line, by knot index. Gap and time mark: the last knot before and the first after
 * (−1 / knot count when it runs off an end). Off-scale and jump: the first and last knot inside.
 */
export interface FollowedSpan {
  kind: 'gap' | 'off_scale' | 'jump' | 'time_mark';
  fromIndex: number;
  toIndex: number;
}

export interface FollowInkResult {
  knots: FollowedKnot[];
  spans: FollowedSpan[];
  /** Measured width of the pen line, full-resolution px. */
  lineWidthPx: number;
  /** Time the server took to follow the line, ms. */
  elapsedMs: number;
  /** How ink was told from grid and paper ('colour', 'lab' or 'grey') and why. */
  inkModel: string;
  inkModelReason: string;
  /** Share (0–1) of the chart span where the line was found. */
  coverage: number;
  /** Why the line should not be trusted (none found, or only a small share of the span); null when fine. */
  problem: string | null;
}

/** Checks a Follow ink request from the wire; pins are checked as for an ink-line draft, with the same field paths. */
export function parseFollowInkRequest(
  x: unknown,
): { ok: true; value: FollowInkRequest } | { ok: false; details: Record<string, string> } {
  const details: Record<string, string> = {};
  if (typeof x !== 'object' || x === null) return { ok: false, details: { '': 'body must be an object' } };
  const body = x as Record<string, unknown>;
  refuseUnknownKeys(body, ['pins', 'seed', 'inkColour'], details);
  const pins = readPins(body['pins'], details);
  const value: FollowInkRequest = { pins };
  const seed = body['seed'];
  if (seed !== undefined) {
    const s = (seed ?? {}) as Record<string, unknown>;
    if (!isFiniteNumber(s['xPx']) || !isFiniteNumber(s['yPx'])) details['seed'] = 'seed needs numbers xPx and yPx';
    else value.seed = { xPx: s['xPx'], yPx: s['yPx'] };
  }
  const inkColour = body['inkColour'];
  if (inkColour !== undefined) {
    if (typeof inkColour !== 'string' || !/^#[0-9a-f]{6}$/i.test(inkColour)) details['inkColour'] = "inkColour must look like '#rrggbb'";
    else value.inkColour = inkColour;
  }
  if (Object.keys(details).length > 0) return { ok: false, details };
  return { ok: true, value };
}
