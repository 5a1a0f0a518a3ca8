import type { InventoryMatch } from '@shared/api/intake';
import type { InventoryRow } from './inventory-csv';

/** A file of the batch refused as a duplicate, with the scans (every page) that already hold its bytes. */
export interface DuplicateFile {
  fileName: string;
  existingScanIds: string[];
  /** Said to the archivist when a row names this file (see duplicateNote). */
  note: string;
}

/** Where the scan holding a duplicate's bytes was stored, as the archivist knows it. */
export interface ExistingScan {
  id: string;
  originalName: string;
  batchId: string | null;
  batchLabel: string | null;
}

/** The note on a row naming a duplicate: which scan holds the bytes, where it came in, and that nothing was filled. */
export function duplicateNote(fileName: string, existing: ExistingScan, batchId: string): string {
  const where =
    existing.batchId === batchId ? 'stored in this batch' : existing.batchLabel !== null ? `stored in the batch "${existing.batchLabel}"` : 'uploaded outside any batch';
  return (
    `${fileName} was refused as a duplicate of scan ${existing.id} (${existing.originalName}, ${where}); ` +
    'the row was applied to no scan: open that scan and edit it if the row describes it.'
  );
}

/** A file name compared without case and, as a fallback, without its extension ("KRO-1931-w10" matches "kro-1931-w10.tif"). */
function nameKeys(fileName: string): { exact: string; stem: string } {
  const exact = fileName.trim().toLowerCase();
  return { exact, stem: exact.replace(/\.[a-z0-9]{1,5}$/, '') };
}

/** File names looked up by exact name, then by stem (either side may lack the extension). */
class FileNames<T> {
  private readonly byExact = new Map<string, { key: string; value: T }>();
  private readonly byStem = new Map<string, { key: string; value: T }>();

  add(fileName: string, value: T): void {
    const { exact, stem } = nameKeys(fileName);
    if (!this.byExact.has(exact)) this.byExact.set(exact, { key: exact, value });
    if (!this.byStem.has(stem)) this.byStem.set(stem, { key: exact, value });
  }

  find(fileName: string): { key: string; value: T } | undefined {
    const { exact, stem } = nameKeys(fileName);
    return this.byExact.get(exact) ?? this.byStem.get(stem) ?? this.byStem.get(exact);
  }
}

/**
 * Pairs inventory rows with the batch's files. A row matches every scan (page) of the stored file of that
 * name; failing that, a file of that name refused as a duplicate, listed with the scans holding its bytes,
 * its note, and no metadata applied. The first row naming a file wins; later rows for it count as rows
 * without a file.
 */
export function matchInventory(rows: InventoryRow[], scans: { id: string; originalName: string }[], duplicates: DuplicateFile[] = []): InventoryMatch {
  const stored = new FileNames<{ fileName: string; scanIds: string[] }>();
  const storedFiles = new Map<string, { fileName: string; scanIds: string[] }>();
  for (const scan of scans) {
    const { exact } = nameKeys(scan.originalName);
    const file = storedFiles.get(exact) ?? { fileName: scan.originalName, scanIds: [] };
    file.scanIds.push(scan.id);
    storedFiles.set(exact, file);
    stored.add(scan.originalName, file);
  }
  const refused = new FileNames<DuplicateFile>();
  for (const duplicate of duplicates) if (duplicate.existingScanIds.length > 0) refused.add(duplicate.fileName, duplicate);

  const matchedStored = new Set<string>();
  const matchedDuplicates = new Set<string>();
  const match: InventoryMatch = { matched: [], rowsWithoutFile: [], filesWithoutRow: [] };
  for (const row of rows) {
    const file = stored.find(row.fileName);
    if (file) {
      if (matchedStored.has(file.key)) match.rowsWithoutFile.push({ line: row.line, fileName: row.fileName });
      else {
        matchedStored.add(file.key);
        match.matched.push({ line: row.line, fileName: row.fileName, scanIds: file.value.scanIds });
      }
      continue;
    }
    const duplicate = refused.find(row.fileName);
    if (!duplicate || matchedDuplicates.has(duplicate.key)) {
      match.rowsWithoutFile.push({ line: row.line, fileName: row.fileName });
      continue;
    }
    matchedDuplicates.add(duplicate.key);
    const { existingScanIds, note } = duplicate.value;
    match.matched.push({ line: row.line, fileName: row.fileName, scanIds: existingScanIds, duplicateOf: existingScanIds[0], note });
  }
  for (const [exact, file] of storedFiles) if (!matchedStored.has(exact)) match.filesWithoutRow.push(file);
  return match;
}
