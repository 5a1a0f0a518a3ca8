import { FieldReader, isId, refuseUnknownKeys, MAX_LINE_LENGTH, normalizeInstant, type Parsed } from './field-reader';
import { normalizeTags } from './parse-scan-metadata';
import { MAX_BULK_EDIT_SCANS, type ScanBulkEditInput } from './scans';

/** Reads one `scans[i]` item, reporting its problems as `scans[i].field`. */
function readScanItem(item: unknown, index: number, problem: (key: string, message: string) => void): ScanBulkEditInput['scans'][number] | null {
  const key = `scans[${index}]`;
  if (typeof item !== 'object' || item === null || Array.isArray(item)) {
    problem(key, 'each scan must be an object with id and version');
    return null;
  }
  const record = item as Record<string, unknown>;
  const unknown: Record<string, string> = {};
  refuseUnknownKeys(record, ['id', 'version', 'chartStart'], unknown, `${key}.`);
  for (const [field, message] of Object.entries(unknown)) problem(field, message);
  let isValid = Object.keys(unknown).length === 0;
  if (!isId(record['id'])) {
    problem(`${key}.id`, 'id must be a scan id');
    isValid = false;
  }
  if (typeof record['version'] !== 'number' || !Number.isInteger(record['version']) || record['version'] < 1) {
    problem(`${key}.version`, 'version (the one you last read) must be a whole number of 1 or more');
    isValid = false;
  }
  const scan: ScanBulkEditInput['scans'][number] = { id: record['id'] as string, version: record['version'] as number };
  if (record['chartStart'] !== undefined) {
    const instant = record['chartStart'] === null ? null : normalizeInstant(record['chartStart']);
    if (record['chartStart'] !== null && instant === null) {
      problem(`${key}.chartStart`, 'chartStart must be an ISO 8601 instant with a zone (2026-03-02T08:00Z) or null');
      isValid = false;
    }
    scan.chartStart = instant;
  }
  return isValid ? scan : null;
}

/** Checks a POST /api/scans/bulk-edit body: 1 to MAX_BULK_EDIT_SCANS distinct scans and at least one change. */
export function parseScanBulkEditInput(body: unknown): Parsed<ScanBulkEditInput> {
  const reader = new FieldReader(body);
  const record = typeof body === 'object' && body !== null ? (body as Record<string, unknown>) : {};
  reader.refuseOtherKeys(['scans', 'set']);
  const scansValue = record['scans'];
  const scans: ScanBulkEditInput['scans'] = [];
  if (!Array.isArray(scansValue) || scansValue.length === 0) reader.problem('scans', 'scans must list at least one scan');
  else if (scansValue.length > MAX_BULK_EDIT_SCANS) reader.problem('scans', `at most ${MAX_BULK_EDIT_SCANS} scans can be edited at once`);
  else {
    scansValue.forEach((item, index) => {
      const scan = readScanItem(item, index, (key, message) => reader.problem(key, message));
      if (scan) scans.push(scan);
    });
    if (new Set(scans.map((scan) => scan.id)).size !== scans.length) reader.problem('scans', 'each scan may be listed once');
  }

  const set = new FieldReader(record['set'] ?? {});
  const value: ScanBulkEditInput = { scans, set: {} };
  for (const key of ['stationId', 'instrumentId', 'chartFormId'] as const) {
    const id = set.nullableId(key);
    if (id !== undefined) value.set[key] = id;
  }
  const box = set.text('box', { maxLength: MAX_LINE_LENGTH });
  if (box !== undefined) value.set.box = box;
  const addTags = set.textList('addTags');
  if (addTags !== undefined) value.set.addTags = normalizeTags(addTags);
  set.refuseUnreadKeys();
  for (const [key, message] of Object.entries(set.details)) reader.problem(key === 'body' ? 'set' : `set.${key}`, key === 'body' ? 'set must be an object' : message);

  const setsSomething = Object.keys(value.set).length > 0 && !(Object.keys(value.set).length === 1 && value.set.addTags?.length === 0);
  if (reader.isValid && !setsSomething && !scans.some((scan) => scan.chartStart !== undefined)) {
    reader.problem('set', 'nothing to change: set a field or give chart starts');
  }
  return reader.isValid ? { ok: true, value } : { ok: false, details: reader.details };
}
