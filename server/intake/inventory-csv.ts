import { INVENTORY_COLUMNS, INVENTORY_OPTIONAL_COLUMNS } from '@shared/api/intake';
import { validationFailed } from '../errors/app-error';

/** One inventory row as read from the CSV; times stay as written until the station's time standard is known. */
export interface InventoryRow {
  /** Line of the CSV, from 1 at the header. */
  line: number;
  fileName: string;
  station: string;
  chartOn: string;
  chartOff: string;
  box: string;
  folder: string;
  notes: string;
  collection: string;
  item: string;
  observer: string;
  tags: string;
}

const FIELD_OF: Record<string, keyof Omit<InventoryRow, 'line'>> = {
  'file name': 'fileName',
  station: 'station',
  'chart on': 'chartOn',
  'chart off': 'chartOff',
  box: 'box',
  folder: 'folder',
  notes: 'notes',
  collection: 'collection',
  item: 'item',
  observer: 'observer',
  tags: 'tags',
};

/** Most rows one import takes (a box holds a few hundred charts). */
export const MAX_INVENTORY_ROWS = 20_000;

/** Splits CSV text into records (RFC 4180: quoted fields may hold commas, quotes doubled, line breaks), with each record's first line. */
export function parseCsvRecords(text: string): { line: number; cells: string[] }[] {
  const records: { line: number; cells: string[] }[] = [];
  let cells: string[] = [];
  let cell = '';
  let isQuoted = false;
  let line = 1;
  let recordLine = 1;
  const source = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  for (let i = 0; i < source.length; i++) {
    const char = source[i];
    if (isQuoted) {
      if (char === '"' && source[i + 1] === '"') {
        cell += '"';
        i++;
      } else if (char === '"') isQuoted = false;
      else {
        if (char === '\n') line++;
        cell += char;
      }
      continue;
    }
    if (char === '"' && cell === '') isQuoted = true;
    else if (char === ',') {
      cells.push(cell);
      cell = '';
    } else if (char === '\n' || char === '\r') {
      if (char === '\r' && source[i + 1] === '\n') i++;
      cells.push(cell);
      records.push({ line: recordLine, cells });
      cells = [];
      cell = '';
      line++;
      recordLine = line;
    } else cell += char;
  }
  if (isQuoted) throw validationFailed({ [`line ${recordLine}`]: 'a quoted field is not closed' }, `Inventory line ${recordLine}: a quoted field is not closed.`);
  if (cell !== '' || cells.length > 0) {
    cells.push(cell);
    records.push({ line: recordLine, cells });
  }
  return records.filter((record) => record.cells.some((value) => value.trim() !== ''));
}

/**
 * Reads an inventory CSV: a header row naming the columns (any order, any case; only `file name` is required),
 * then one row per file. A bad header or row is a 400 naming the line and column.
 */
export function parseInventoryCsv(text: string): InventoryRow[] {
  const records = parseCsvRecords(text);
  if (records.length === 0) throw validationFailed({ 'line 1': 'the inventory is empty; it needs a header row' }, 'The inventory is empty.');
  const [header, ...rows] = records;
  const known = new Set<string>([...INVENTORY_COLUMNS, ...INVENTORY_OPTIONAL_COLUMNS]);
  const indexOf = new Map<string, number>();
  header.cells.forEach((name, index) => {
    const normalized = name.trim().toLowerCase().replace(/[_-]+/g, ' ').replace(/\s+/g, ' ');
    if (known.has(normalized) && !indexOf.has(normalized)) indexOf.set(normalized, index);
  });
  if (!indexOf.has('file name')) {
    throw validationFailed(
      { 'line 1, file name': `the header row must name a "file name" column (columns: ${INVENTORY_COLUMNS.join(', ')})` },
      'Inventory line 1: the header row has no "file name" column.',
    );
  }
  if (rows.length > MAX_INVENTORY_ROWS) throw validationFailed({ rows: `at most ${MAX_INVENTORY_ROWS} rows` }, 'The inventory has too many rows.');
  return rows.map((record) => {
    const row = { line: record.line } as InventoryRow;
    for (const [column, field] of Object.entries(FIELD_OF)) {
      const index = indexOf.get(column);
      row[field] = index === undefined ? '' : (record.cells[index] ?? '').trim();
    }
    if (row.fileName === '') {
      throw validationFailed({ [`line ${record.line}, file name`]: 'the file name is empty' }, `Inventory line ${record.line}, column "file name": the file name is empty.`);
    }
    return row;
  });
}
