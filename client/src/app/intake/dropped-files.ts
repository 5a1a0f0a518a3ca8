/** Reads every file of a drop, walking into dropped folders (Chromium and Firefox expose them as entries). */
export async function filesFromDrop(dataTransfer: DataTransfer): Promise<File[]> {
  const items = Array.from(dataTransfer.items ?? []);
  const entries = items.map((item) => (typeof item.webkitGetAsEntry === 'function' ? item.webkitGetAsEntry() : null));
  if (entries.length === 0 || entries.some((entry) => entry === null)) return Array.from(dataTransfer.files);
  const files: File[] = [];
  for (const entry of entries as FileSystemEntry[]) files.push(...(await filesOfEntry(entry)));
  return files;
}

async function filesOfEntry(entry: FileSystemEntry): Promise<File[]> {
  if (entry.isFile) {
    return [await new Promise<File>((resolve, reject) => (entry as FileSystemFileEntry).file(resolve, reject))];
  }
  if (!entry.isDirectory) return [];
  const reader = (entry as FileSystemDirectoryEntry).createReader();
  const children: FileSystemEntry[] = [];
  // readEntries answers in chunks (100 in Chromium) until it answers an empty list.
  for (;;) {
    const chunk = await new Promise<FileSystemEntry[]>((resolve, reject) => reader.readEntries(resolve, reject));
    if (chunk.length === 0) break;
    children.push(...chunk);
  }
  const nested = await Promise.all(children.map((child) => filesOfEntry(child)));
  return nested.flat();
}

/** Splits a selection into scans to send and inventory CSVs to offer; hidden files (".DS_Store") are dropped. */
export function sortSelection(files: readonly File[]): { scans: File[]; inventories: File[] } {
  const visible = files.filter((file) => !file.name.startsWith('.'));
  const isCsv = (file: File) => /\.csv$/i.test(file.name) || file.type === 'text/csv';
  const byName = (a: File, b: File) => a.name.localeCompare(b.name, undefined, { numeric: true });
  return { scans: visible.filter((f) => !isCsv(f)).sort(byName), inventories: visible.filter(isCsv) };
}
