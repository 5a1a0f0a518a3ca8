import type { InventoryMatch } from '@shared/api/intake';
import type { InventoryRow } from './inventory-csv';

/** A file name compared without case and, as a fallback, without its extension ("KRO-1931-w10" matches "kro-1931-w10.tif"). */
function nameKeys(fileName: string): { exact: string; stem: string } {
  const exact = fileName.trim().toLowerCase();
  return { exact, stem: exact.replace(/\.[a-z0-9]{1,5}$/, '') };
}

/**
 * Pairs inventory rows with the batch's files. A row matches every scan (page) of the file of that name;
 * the first row naming a file wins, later rows for it count as rows without a file.
 */
export function matchInventory(rows: InventoryRow[], scans: { id: string; originalName: string }[]): InventoryMatch {
  const byExact = new Map<string, string[]>();
  const byStem = new Map<string, string[]>();
  const fileNameOf = new Map<string, string>();
  for (const scan of scans) {
    const { exact, stem } = nameKeys(scan.originalName);
    byExact.set(exact, [...(byExact.get(exact) ?? []), scan.id]);
    byStem.set(stem, [...(byStem.get(stem) ?? []), scan.id]);
    fileNameOf.set(exact, scan.originalName);
  }
  const matchedFiles = new Set<string>();
  const match: InventoryMatch = { matched: [], rowsWithoutFile: [], filesWithoutRow: [] };
  for (const row of rows) {
    const { exact, stem } = nameKeys(row.fileName);
    const scanIds = byExact.get(exact) ?? byStem.get(stem) ?? byStem.get(exact);
    const fileKey = scanIds ? nameKeys(scans.find((scan) => scan.id === scanIds[0])!.originalName).exact : undefined;
    if (!scanIds || !fileKey || matchedFiles.has(fileKey)) {
      match.rowsWithoutFile.push({ line: row.line, fileName: row.fileName });
      continue;
    }
    matchedFiles.add(fileKey);
    match.matched.push({ line: row.line, fileName: row.fileName, scanIds });
  }
  for (const [exact, scanIds] of byExact) {
    if (!matchedFiles.has(exact)) match.filesWithoutRow.push({ fileName: fileNameOf.get(exact)!, scanIds });
  }
  return match;
}
