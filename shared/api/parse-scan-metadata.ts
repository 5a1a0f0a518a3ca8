import { FieldReader, MAX_LINE_LENGTH, MAX_TEXT_LENGTH, type Parsed } from './field-reader';
import type { ScanMetadataInput, ScanStatusChange } from './scans';
import { SCAN_STATUSES } from './scans';

/** Tags are kept lower case, so "Storm" and "storm" are one tag. */
export function normalizeTags(tags: string[]): string[] {
  return [...new Set(tags.map((tag) => tag.trim().toLowerCase()).filter((tag) => tag !== ''))];
}

/** Checks a PATCH /api/scans/:id body: only the fields present change; `version` is required. */
export function parseScanMetadataInput(body: unknown): Parsed<ScanMetadataInput> {
  const reader = new FieldReader(body);
  const version = reader.integer('version', 1);
  if (version === undefined) reader.problem('version', 'version (the one you last read) is required');
  const value: ScanMetadataInput = { version: version ?? 0 };
  const ids = ['stationId', 'instrumentId', 'chartFormId'] as const;
  for (const key of ids) {
    const id = reader.nullableId(key);
    if (id !== undefined) value[key] = id;
  }
  for (const key of ['chartStart', 'chartOn', 'chartOff'] as const) {
    const instant = reader.nullableInstant(key);
    if (instant !== undefined) value[key] = instant;
  }
  for (const key of ['observer', 'collection', 'box', 'folder', 'item'] as const) {
    const text = reader.text(key, { maxLength: MAX_LINE_LENGTH });
    if (text !== undefined) value[key] = text;
  }
  for (const key of ['conditionNotes', 'notes', 'transcription'] as const) {
    const text = reader.text(key, { maxLength: MAX_TEXT_LENGTH });
    if (text !== undefined) value[key] = text;
  }
  const tags = reader.textList('tags');
  if (tags !== undefined) value.tags = normalizeTags(tags);
  const dpi = reader.nullableNumber('dpi', { isPositive: true, max: 10_000 });
  if (dpi !== undefined) value.dpi = dpi;
  if (value.chartOn && value.chartOff && value.chartOff < value.chartOn) reader.problem('chartOff', 'chartOff must not be before chartOn');
  reader.refuseUnreadKeys();
  return reader.isValid ? { ok: true, value } : { ok: false, details: reader.details };
}

/** Checks a POST /api/scans/:id/status body; withdrawing needs a reason. */
export function parseScanStatusChange(body: unknown): Parsed<ScanStatusChange> {
  const reader = new FieldReader(body);
  const status = reader.oneOf('status', SCAN_STATUSES);
  if (status === undefined) reader.problem('status', `status must be one of: ${SCAN_STATUSES.join(', ')}`);
  const reason = reader.text('reason', { maxLength: MAX_TEXT_LENGTH });
  if (status === 'withdrawn' && !reason) reader.problem('reason', 'a reason is required to withdraw a scan');
  reader.refuseUnreadKeys();
  if (!reader.isValid) return { ok: false, details: reader.details };
  return { ok: true, value: reason ? { status: status!, reason } : { status: status! } };
}
