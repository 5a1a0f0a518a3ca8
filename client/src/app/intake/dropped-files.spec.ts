import { filesFromDrop, sortSelection } from './dropped-files';

function file(name: string): File {
  return new File([name], name);
}

/** A dropped folder as Chromium's entries API presents it, answering readEntries in chunks. */
function folderEntry(name: string, children: FileSystemEntry[], chunkSize = 2): FileSystemEntry {
  return {
    name,
    isFile: false,
    isDirectory: true,
    createReader: () => {
      let offset = 0;
      return {
        readEntries: (resolve: (entries: FileSystemEntry[]) => void) => {
          const chunk = children.slice(offset, offset + chunkSize);
          offset += chunkSize;
          setTimeout(() => resolve(chunk), 0);
        },
      };
    },
  } as unknown as FileSystemEntry;
}

function fileEntry(f: File): FileSystemEntry {
  return { name: f.name, isFile: true, isDirectory: false, file: (resolve: (file: File) => void) => resolve(f) } as unknown as FileSystemEntry;
}

describe('filesFromDrop', () => {
  it('when a folder with a subfolder is dropped, then every file inside comes out, across chunked reads', async () => {
    const names = ['a.tif', 'b.tif', 'c.png', 'd.pdf', 'inventory.csv'];
    const sub = folderEntry('box-14b', [fileEntry(file('d.pdf')), fileEntry(file('inventory.csv'))]);
    const root = folderEntry('box-14', [fileEntry(file('a.tif')), fileEntry(file('b.tif')), fileEntry(file('c.png')), sub]);
    const dataTransfer = { items: [{ webkitGetAsEntry: () => root }], files: [] } as unknown as DataTransfer;

    const files = await filesFromDrop(dataTransfer);

    expect(files.map((f) => f.name).sort()).toEqual(names);
  });

  it('when the browser offers no entries, then the plain file list is used', async () => {
    const dataTransfer = { items: [], files: [file('a.png'), file('b.png')] } as unknown as DataTransfer;

    const files = await filesFromDrop(dataTransfer);

    expect(files.map((f) => f.name)).toEqual(['a.png', 'b.png']);
  });
});

describe('sortSelection', () => {
  it('when a selection mixes scans, an inventory and hidden files, then scans come in natural order and the CSV apart', () => {
    const { scans, inventories } = sortSelection([file('week-10.png'), file('.DS_Store'), file('week-9.png'), file('box.CSV'), file('week-11.tif')]);

    expect(scans.map((f) => f.name)).toEqual(['week-9.png', 'week-10.png', 'week-11.tif']);
    expect(inventories.map((f) => f.name)).toEqual(['box.CSV']);
  });
});
