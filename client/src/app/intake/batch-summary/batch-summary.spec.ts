import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { IntakeBatchDetail } from '@shared/api/intake';

import { scanSummaryForTest } from '../../core/api/scan-for-test';
import { httpErrorInterceptor } from '../../core/http/http-error-interceptor';
import { BatchSummary } from './batch-summary';

const BATCH: IntakeBatchDetail = {
  id: 'batch-1',
  label: 'Box 14, Kestrel Ridge 1931',
  createdAt: '2026-12-02T01:00:00.000Z',
  createdByName: 'Idris Fenwhistle',
  fileCount: 3,
  counts: { stored: 1, duplicate: 1, rejected: 1 },
  hasInventory: false,
  files: [
    { fileName: 'kro-w11-13.tif', outcome: 'stored', reason: null, code: null, scanIds: ['p1', 'p2', 'p3'], at: '2026-12-02T01:00:01.000Z' },
    { fileName: 'copy.tif', outcome: 'duplicate', reason: 'This file has been uploaded before.', code: 'duplicate_scan', scanIds: ['p1'], at: '2026-12-02T01:00:02.000Z' },
    { fileName: 'notes.png', outcome: 'rejected', reason: 'These bytes are not an image or a PDF.', code: 'unsupported_file_type', scanIds: [], at: '2026-12-02T01:00:03.000Z' },
  ],
  scans: [0, 1, 2].map((pageIndex) => scanSummaryForTest({ id: `p${pageIndex + 1}`, pageIndex, pageCount: 3 })),
};

describe('BatchSummary', () => {
  let controller: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when a batch is shown, then it counts each outcome, names each page and says why a file was refused', async () => {
    const fixture = TestBed.createComponent(BatchSummary);
    fixture.componentRef.setInput('batchId', 'batch-1');
    await fixture.whenStable();

    controller.expectOne('/api/intake/batches/batch-1').flush(BATCH);
    await fixture.whenStable();
    const element = fixture.nativeElement as HTMLElement;
    const rows = Array.from(element.querySelectorAll('[data-testid="summary-file"]'));

    expect(element.querySelector('[data-testid="summary-stored"]')?.textContent).toBe('1');
    expect(element.querySelector('[data-testid="summary-duplicate"]')?.textContent).toBe('1');
    expect(element.querySelector('[data-testid="summary-rejected"]')?.textContent).toBe('1');
    expect(element.querySelector('[data-testid="summary-scans"]')?.textContent).toBe('3');
    expect(Array.from(rows[0].querySelectorAll('a')).map((a) => [a.textContent?.trim(), a.getAttribute('href')])).toEqual([
      ['page 1', '/archive/scans/p1'],
      ['page 2', '/archive/scans/p2'],
      ['page 3', '/archive/scans/p3'],
    ]);
    expect(rows[2].getAttribute('data-outcome')).toBe('rejected');
    expect(rows[2].textContent).toContain('These bytes are not an image or a PDF.');
    expect(element.querySelector('[data-testid="summary-catalogue-link"]')?.getAttribute('href')).toBe('/archive?batchId=batch-1');
  });

  it('when a batch holds one file, then it says "1 file", not "1 files"', async () => {
    const fixture = TestBed.createComponent(BatchSummary);
    fixture.componentRef.setInput('batchId', 'batch-1');
    await fixture.whenStable();

    controller.expectOne('/api/intake/batches/batch-1').flush({ ...BATCH, fileCount: 1 });
    await fixture.whenStable();
    const text = (fixture.nativeElement as HTMLElement).textContent ?? '';

    expect(text).toContain('· 1 file');
    expect(text).not.toContain('1 files');
  });

  it('when the batch is asked for again, then the last summary stays on screen until the new one arrives', async () => {
    const fixture = TestBed.createComponent(BatchSummary);
    fixture.componentRef.setInput('batchId', 'batch-1');
    await fixture.whenStable();
    controller.expectOne('/api/intake/batches/batch-1').flush(BATCH);
    await fixture.whenStable();

    fixture.componentRef.setInput('refresh', 1);
    await fixture.whenStable();
    const whileLoading = (fixture.nativeElement as HTMLElement).querySelector('[data-testid="intake-summary"]');
    controller.expectOne('/api/intake/batches/batch-1').flush({ ...BATCH, hasInventory: true });

    expect(whileLoading).not.toBeNull();
  });
});
