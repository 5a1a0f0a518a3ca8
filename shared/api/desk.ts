import type { InkLineStatus } from './ink-lines';
import { FieldReader, type Parsed } from './field-reader';

/** Sections of the volunteer's Desk that list the volunteer's own ink lines. */
export const DESK_SECTIONS = ['drafts', 'returned', 'waiting'] as const;
export type DeskSection = (typeof DESK_SECTIONS)[number];

/** One of the volunteer's own ink lines on the Desk; rows tell charts apart by station, chart start, file and box. */
export interface DeskLine {
  inkLineId: string;
  scanId: string;
  stationName: string | null;
  chartStart: string | null;
  originalName: string;
  box: string;
  status: InkLineStatus;
  version: number;
  /** ISO 8601 UTC of the line's last change. */
  updatedAt: string;
  /** The archivist's note of the last return; null unless the line was returned. */
  returnNote: string | null;
}

/** A chart the volunteer has claimed from the queue. */
export interface DeskClaim {
  scanId: string;
  stationName: string | null;
  chartStart: string | null;
  originalName: string;
  box: string;
  /** ISO 8601 UTC: after this the chart goes back to the queue. */
  expiresAt: string;
}

/** GET /api/desk/summary: counts for the Desk's sections and the open claim. */
export interface DeskSummary {
  draftCount: number;
  returnedCount: number;
  waitingCount: number;
  approvedCount: number;
  /** Charts waiting in the queue for this volunteer. */
  queueCount: number;
  claim: DeskClaim | null;
}

/** POST /api/desk/next: the claimed chart, or null when the queue is empty. */
export interface NextChartResult {
  claim: DeskClaim | null;
}

/** Counts of charts by where they stand, for a station or one of its boxes. */
export interface TracingProgressRow {
  stationId: string;
  stationName: string;
  /** Null in the per-station view. */
  collection: string | null;
  box: string | null;
  received: number;
  ready: number;
  claimed: number;
  traced: number;
  approved: number;
}

export const PROGRESS_GROUPS = ['station', 'box'] as const;
export type ProgressGroup = (typeof PROGRESS_GROUPS)[number];

/** A station's tracing setting: how many independent ink lines each chart needs. */
export interface StationTracing {
  stationId: string;
  inkLinesRequired: 1 | 2;
}

export const TRACE_PRIORITY_SCOPES = ['station', 'box', 'scan'] as const;
export type TracePriorityScope = (typeof TRACE_PRIORITY_SCOPES)[number];

/** PUT /api/tracing/priorities: a priority (higher first) for a station, a box (collection + box) or a scan. */
export interface TracePriorityInput {
  scope: TracePriorityScope;
  stationId?: string;
  collection?: string;
  box?: string;
  scanId?: string;
  /** −100 … 100; 0 is the default, higher charts are handed out first. */
  priority: number;
}

export interface TracePriority {
  scope: TracePriorityScope;
  /** The station id, `collection/box`, or the scan id. */
  key: string;
  priority: number;
  updatedAt: string;
}

export const MAX_TRACE_PRIORITY = 100;

export function parseStationTracing(body: unknown): Parsed<{ inkLinesRequired: 1 | 2 }> {
  const reader = new FieldReader(body);
  const required = reader.integer('inkLinesRequired', 1);
  if (required === undefined || (required !== 1 && required !== 2)) reader.problem('inkLinesRequired', 'inkLinesRequired must be 1 or 2');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { inkLinesRequired: required as 1 | 2 } };
}

/** The scope key of a priority: what the queue matches a scan against. */
export function tracePriorityKey(input: Pick<TracePriorityInput, 'scope' | 'stationId' | 'collection' | 'box' | 'scanId'>): string {
  if (input.scope === 'station') return input.stationId ?? '';
  if (input.scope === 'scan') return input.scanId ?? '';
  return `${input.collection ?? ''}/${input.box ?? ''}`;
}

export function parseTracePriorityInput(body: unknown): Parsed<TracePriorityInput> {
  const reader = new FieldReader(body);
  const scope = reader.oneOf('scope', TRACE_PRIORITY_SCOPES);
  if (scope === undefined) reader.problem('scope', `scope must be one of: ${TRACE_PRIORITY_SCOPES.join(', ')}`);
  const stationId = reader.nullableId('stationId') ?? undefined;
  const scanId = reader.nullableId('scanId') ?? undefined;
  const collection = reader.text('collection');
  const box = reader.text('box');
  const raw = reader.raw('priority');
  const priority = typeof raw === 'number' && Number.isInteger(raw) && Math.abs(raw) <= MAX_TRACE_PRIORITY ? raw : undefined;
  if (priority === undefined) reader.problem('priority', `priority must be a whole number from -${MAX_TRACE_PRIORITY} to ${MAX_TRACE_PRIORITY}`);
  if (scope === 'station' && !stationId) reader.problem('stationId', 'a station priority needs stationId');
  if (scope === 'scan' && !scanId) reader.problem('scanId', 'a scan priority needs scanId');
  if (scope === 'box' && !box) reader.problem('box', 'a box priority needs box (and collection, when the box has one)');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: { scope: scope!, stationId, scanId, collection: collection ?? '', box, priority: priority as number } };
}
