import { HttpEventType, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting, TestRequest } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import type { IntakeFileResult } from '@shared/api/intake';

import { scanSummaryForTest } from '../core/api/scan-for-test';
import { httpErrorInterceptor } from '../core/http/http-error-interceptor';
import { INTAKE_CONCURRENCY, IntakeQueue } from './intake-queue';

const FILES_URL = '/api/intake/batches/batch-1/files';

/** A file whose bytes differ by name, so that two names never look like two copies of one scan. */
function fileNamed(name: string, size = 10): File {
  return new File([name.padEnd(size, '.').slice(0, size)], name, { type: 'image/png' });
}

function stored(fileName: string, scanIds: string[]): IntakeFileResult {
  return { fileName, outcome: 'stored', scans: scanIds.map((id, pageIndex) => scanSummaryForTest({ id, pageIndex, pageCount: scanIds.length })) };
}

function fileNameOf(request: TestRequest): string {
  return ((request.request.body as FormData).get('file') as File).name;
}

function settle(): Promise<void> {
  return new Promise((resolve) => setTimeout(resolve, 0));
}

/** Lets the queue read the files' lane keys (FileReader answers asynchronously). */
async function settleMany(): Promise<void> {
  for (let i = 0; i < 10; i++) await settle();
}

describe('IntakeQueue', () => {
  let queue: IntakeQueue;
  let controller: HttpTestingController;

  function openRequests(): TestRequest[] {
    return controller.match(FILES_URL);
  }

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [IntakeQueue, provideRouter([]), provideHttpClient(withInterceptors([httpErrorInterceptor])), provideHttpClientTesting()],
    });
    queue = TestBed.inject(IntakeQueue);
    controller = TestBed.inject(HttpTestingController);
  });

  afterEach(() => controller.verify());

  it('when five files are queued, then only a few are sent at once and the next starts as one finishes', async () => {
    const files = ['a.png', 'b.png', 'c.png', 'd.png', 'e.png'].map((name) => fileNamed(name));

    queue.run('batch-1', files).subscribe();
    await settleMany();
    const first = openRequests();
    first[0].flush(stored('a.png', ['s-a']), { status: 201, statusText: 'Created' });
    const second = openRequests();

    expect(INTAKE_CONCURRENCY).toBe(3);
    expect(first.map(fileNameOf)).toEqual(['a.png', 'b.png', 'c.png']);
    expect(second.map(fileNameOf)).toEqual(['d.png']);
    expect(queue.items().map((item) => item.state)).toEqual(['stored', 'sending', 'sending', 'sending', 'waiting']);
    for (const request of [...first.slice(1), ...second]) request.flush(stored(fileNameOf(request), ['s']), { status: 201, statusText: 'Created' });
    openRequests().forEach((request) => request.flush(stored(fileNameOf(request), ['s']), { status: 201, statusText: 'Created' }));
  });

  it('when upload progress arrives, then that file’s bar and the whole batch move', async () => {
    queue.run('batch-1', [fileNamed('a.png', 100), fileNamed('b.png', 100)]).subscribe();
    await settleMany();
    const [a, b] = openRequests();

    a.event({ type: HttpEventType.UploadProgress, loaded: 50, total: 100 });

    expect(queue.items()[0].percent).toBe(50);
    expect(queue.items()[1].percent).toBe(0);
    expect(queue.overallPercent()).toBe(25);
    a.flush(stored('a.png', ['s-a']), { status: 201, statusText: 'Created' });
    b.flush(stored('b.png', ['s-b']), { status: 201, statusText: 'Created' });
  });

  it('when the server stores, finds a duplicate and rejects, then each file shows its own outcome and the run ends', async () => {
    let isDone = false;
    queue.run('batch-1', [fileNamed('week-1.tif'), fileNamed('week-1-again.tif'), fileNamed('notes.png')], { stationId: 'st-kro' }).subscribe(() => (isDone = true));
    await settleMany();
    const [tiff, again, fake] = openRequests();

    tiff.flush(stored('week-1.tif', ['s-p1', 's-p2', 's-p3']), { status: 201, statusText: 'Created' });
    again.flush(
      { error: { code: 'duplicate_scan', message: 'This file is already in the archive.', details: { existingScanId: 's-p1' } } },
      { status: 409, statusText: 'Conflict' },
    );
    fake.flush(
      { error: { code: 'unsupported_file_type', message: 'The bytes are not an image or PDF (they look like text).' } },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    // The error interceptor reads error bodies asynchronously.
    await settle();

    const [first, second, third] = queue.items();
    expect((tiff.request.body as FormData).get('stationId')).toBe('st-kro');
    expect(first).toMatchObject({ state: 'stored', scanIds: ['s-p1', 's-p2', 's-p3'], percent: 100 });
    expect(second).toMatchObject({ state: 'duplicate', existingScanId: 's-p1' });
    expect(third).toMatchObject({ state: 'rejected', message: 'The bytes are not an image or PDF (they look like text).' });
    expect(queue.counts()).toEqual({ stored: 1, duplicate: 1, rejected: 1, waiting: 0 });
    expect(queue.isRunning()).toBe(false);
    expect(isDone).toBe(true);
  });

  it('when the run is stopped, then requests in flight are aborted and waiting files are not sent', async () => {
    const files = ['a.png', 'b.png', 'c.png', 'd.png'].map((name) => fileNamed(name));
    queue.run('batch-1', files).subscribe();
    await settleMany();
    const inFlight = openRequests();

    queue.cancel();

    expect(inFlight.every((request) => request.cancelled)).toBe(true);
    expect(openRequests()).toHaveLength(0);
    expect(queue.items().map((item) => item.state)).toEqual(['cancelled', 'cancelled', 'cancelled', 'cancelled']);
    expect(queue.isRunning()).toBe(false);
  });

  it('when two files have the same bytes, then the second is sent only after the first has its answer', async () => {
    const original = new File(['the same scan bytes'], 'kro-w10.png', { type: 'image/png' });
    const copy = new File(['the same scan bytes'], 'second-copy.png', { type: 'image/png' });

    queue.run('batch-1', [original, copy, fileNamed('other.png')]).subscribe();
    await settleMany();
    const first = openRequests();
    first.find((r) => fileNameOf(r) === 'kro-w10.png')!.flush(stored('kro-w10.png', ['s-1']), { status: 201, statusText: 'Created' });
    const second = openRequests();

    expect(first.map(fileNameOf)).toEqual(['kro-w10.png', 'other.png']);
    expect(second.map(fileNameOf)).toEqual(['second-copy.png']);
    for (const request of [first.find((r) => fileNameOf(r) === 'other.png')!, ...second]) request.flush(stored(fileNameOf(request), ['s']), { status: 201, statusText: 'Created' });
  });
});
