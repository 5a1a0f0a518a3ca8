import { AppError } from '../errors/app-error';
import { parseCsvRecords, parseInventoryCsv } from './inventory-csv';
import { duplicateNote, matchInventory } from './match-inventory';

describe('parseCsvRecords', () => {
  it('when fields are quoted with commas, doubled quotes and line breaks, then they come back whole with their first line', () => {
    // RFC 4180 §2: quoted fields may hold commas, CRLF and doubled double quotes.
    const records = parseCsvRecords('a,b\r\n"x, y","say ""hi"""\r\n"two\nlines",z\n');

    expect(records).toEqual([
      { line: 1, cells: ['a', 'b'] },
      { line: 2, cells: ['x, y', 'say "hi"'] },
      { line: 3, cells: ['two\nlines', 'z'] },
    ]);
  });
});

describe('parseInventoryCsv', () => {
  it('when the header has columns in any order and case, then rows are read by name and extras ignored', () => {
    const rows = parseInventoryCsv('\uFEFFBox;x,FILE_NAME,Chart On,shelf\n14,kro-w10.tif,1931-03-02 08:00,B2\n');

    expect(rows).toEqual([
      expect.objectContaining({ line: 2, fileName: 'kro-w10.tif', chartOn: '1931-03-02 08:00', box: '', station: '' }),
    ]);
  });

  it('when a row has no file name, then it is a 400 naming its line and column', () => {
    let error: unknown;

    try {
      parseInventoryCsv('file name,box\nkro.tif,1\n,2\n');
    } catch (caught) {
      error = caught;
    }

    expect((error as AppError).details).toEqual({ 'line 3, file name': 'the file name is empty' });
  });
});

describe('matchInventory', () => {
  it('when rows name files with other case or without extension, then they match all the file\'s pages once', () => {
    const rows = parseInventoryCsv('file name\nKRO-W10\nkro-w10.tif\nmissing.png\n');
    const scans = [
      { id: 'p0', originalName: 'kro-w10.tif' },
      { id: 'p1', originalName: 'kro-w10.tif' },
      { id: 'other', originalName: 'other.png' },
    ];

    const match = matchInventory(rows, scans);

    expect(match).toEqual({
      matched: [{ line: 2, fileName: 'KRO-W10', scanIds: ['p0', 'p1'] }],
      rowsWithoutFile: [
        { line: 3, fileName: 'kro-w10.tif' },
        { line: 4, fileName: 'missing.png' },
      ],
      filesWithoutRow: [{ fileName: 'other.png', scanIds: ['other'] }],
    });
  });
});

describe('matchInventory with duplicates', () => {
  const scans = [{ id: 'w10', originalName: 'kro-w10.png' }];
  const copy = { fileName: 'kro-w10-copy.png', existingScanIds: ['w10'], note: 'refused as a duplicate of scan w10' };

  it('when a row names a file refused as a duplicate, then it matches the scans holding the bytes with the note', () => {
    const rows = parseInventoryCsv('file name\nKRO-W10-COPY\n');

    const match = matchInventory(rows, scans, [copy]);

    expect(match.matched).toEqual([{ line: 2, fileName: 'KRO-W10-COPY', scanIds: ['w10'], duplicateOf: 'w10', note: copy.note }]);
    expect(match.rowsWithoutFile).toEqual([]);
    expect(match.filesWithoutRow).toEqual([{ fileName: 'kro-w10.png', scanIds: ['w10'] }]);
  });

  it('when a stored file and a duplicate share a name, then the row matches the stored file', () => {
    const rows = parseInventoryCsv('file name\nkro-w10.png\n');

    const match = matchInventory(rows, scans, [{ ...copy, fileName: 'kro-w10.png' }]);

    expect(match.matched).toEqual([{ line: 2, fileName: 'kro-w10.png', scanIds: ['w10'] }]);
  });

  it('when the duplicate names no existing scan, then its row is a row without a file', () => {
    const rows = parseInventoryCsv('file name\nkro-w10-copy.png\n');

    const match = matchInventory(rows, scans, [{ ...copy, existingScanIds: [] }]);

    expect(match.rowsWithoutFile).toEqual([{ line: 2, fileName: 'kro-w10-copy.png' }]);
  });

  it('when two files share a stem, then a row without extension matches only the first, not both', () => {
    const rows = parseInventoryCsv('file name\nkro-w11\n');

    const match = matchInventory(rows, [{ id: 'tif', originalName: 'kro-w11.tif' }, { id: 'png', originalName: 'kro-w11.png' }]);

    expect(match.matched).toEqual([{ line: 2, fileName: 'kro-w11', scanIds: ['tif'] }]);
    expect(match.filesWithoutRow).toEqual([{ fileName: 'kro-w11.png', scanIds: ['png'] }]);
  });
});

describe('duplicateNote', () => {
  it.each([
    ['the same batch', { batchId: 'b1', batchLabel: 'Box 14' }, 'stored in this batch'],
    ['another batch', { batchId: 'b0', batchLabel: 'Box 9' }, 'stored in the batch "Box 9"'],
    ['no batch', { batchId: null, batchLabel: null }, 'uploaded outside any batch'],
  ])('when the existing scan came in by %s, then the note says where and that nothing was applied', (_case, where, expected) => {
    const note = duplicateNote('copy.png', { id: 's1', originalName: 'kro-w10.png', ...where }, 'b1');

    expect(note).toContain('duplicate of scan s1 (kro-w10.png, ' + expected + ')');
    expect(note).toContain('applied to no scan');
  });
});
