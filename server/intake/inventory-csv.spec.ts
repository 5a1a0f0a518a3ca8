import { AppError } from '../errors/app-error';
import { parseCsvRecords, parseInventoryCsv } from './inventory-csv';
import { matchInventory } from './match-inventory';

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
