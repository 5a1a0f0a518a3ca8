import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { InventoryMatch } from '@shared/api/intake';

import { InventoryResult } from './inventory-result';

const MATCH: InventoryMatch = {
  matched: [
    { line: 2, fileName: 'kro-1931-07.tif', scanIds: ['s-7a', 's-7b'] },
    { line: 3, fileName: 'kro-1931-08.png', scanIds: ['s-8'] },
  ],
  rowsWithoutFile: [{ line: 4, fileName: 'kro-1931-09.png' }],
  filesWithoutRow: [{ fileName: 'loose-sheet.jpg', scanIds: ['s-loose'] }],
};

describe('InventoryResult', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideRouter([])] }));

  function render(match: InventoryMatch): HTMLElement {
    const fixture = TestBed.createComponent(InventoryResult);
    fixture.componentRef.setInput('match', match);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('when an inventory matched some rows, then the three groups list their rows with counts', () => {
    const element = render(MATCH);

    expect(element.querySelector('[data-testid="inventory-matched-count"]')?.textContent).toBe('2');
    expect(element.querySelectorAll('[data-testid="inventory-matched"]')).toHaveLength(2);
    expect(element.querySelector('[data-testid="inventory-row-without-file"]')?.textContent).toContain('line 4');
    expect(element.querySelector('[data-testid="inventory-row-without-file"]')?.textContent).toContain('kro-1931-09.png');
    expect(element.querySelector('[data-testid="inventory-files-without-row-count"]')?.textContent).toBe('1');
  });

  it('when a file has no row, then it links to its scan so the archivist can fix the metadata by hand', () => {
    const element = render(MATCH);

    const link = element.querySelector<HTMLAnchorElement>('[data-testid="inventory-fix-link"]');

    expect(link?.getAttribute('href')).toBe('/archive/scans/s-loose');
    expect(link?.textContent).toContain('fix metadata');
  });

  it('when a matched file has several pages, then each page gets its own link', () => {
    const element = render(MATCH);

    const links = Array.from(element.querySelectorAll<HTMLAnchorElement>('[data-testid="inventory-matched"]')[0].querySelectorAll('a'));

    expect(links.map((a) => a.getAttribute('href'))).toEqual(['/archive/scans/s-7a', '/archive/scans/s-7b']);
    expect(links.map((a) => a.textContent?.trim())).toEqual(['page 1', 'page 2']);
  });

  it('when everything matched, then the other groups say so instead of staying blank', () => {
    const element = render({ matched: MATCH.matched, rowsWithoutFile: [], filesWithoutRow: [] });

    expect(element.textContent).toContain('Every row found its file.');
    expect(element.textContent).toContain('Every file has a row.');
  });

  it('when a row names a file that was a duplicate, then the note from the server says which scan holds its bytes', () => {
    const element = render({
      ...MATCH,
      matched: [{ line: 5, fileName: 'copy.png', scanIds: ['s-8'], duplicateOf: 's-8', note: 'A copy of scan s-8, stored in this batch; the row was applied to no scan.' }],
    });

    const note = element.querySelector('[data-testid="inventory-duplicate-note"]');

    expect(note?.textContent).toContain('applied to no scan');
  });
});
