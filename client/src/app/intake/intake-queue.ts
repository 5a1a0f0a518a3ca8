import { HttpEventType } from '@angular/common/http';
import { computed, DestroyRef, inject, Injectable, signal } from '@angular/core';
import type { IntakeCounts, IntakeFileFields, IntakeFileResult } from '@shared/api/intake';
import { concatMap, from, mergeMap, Observable, Subscription, switchMap, tap } from 'rxjs';

import { ApiError } from '../core/http/api-error';
import { fileLaneKey } from './file-lane-key';
import { IntakeApi } from './intake-api';

/** Files in flight at once: enough to keep the line busy, few enough that each bar moves visibly. */
export const INTAKE_CONCURRENCY = 3;

export type IntakeItemState = 'waiting' | 'sending' | 'stored' | 'duplicate' | 'rejected' | 'cancelled';

/** One file of the queue as the progress list shows it. */
export interface IntakeItem {
  key: number;
  fileName: string;
  sizeBytes: number;
  state: IntakeItemState;
  /** 0–100 while sending; 100 once the server has the bytes. */
  percent: number;
  /** Why it was rejected or is a duplicate. */
  message: string | null;
  scanIds: string[];
  existingScanId: string | null;
}

interface Finished {
  state: 'stored' | 'duplicate' | 'rejected';
  message: string | null;
  scanIds: string[];
  existingScanId: string | null;
}

/** Maps a failed file request to its outcome: a 409 is a duplicate, any other answer a rejection with the server's reason. */
export function finishedOfFailure(error: unknown): Finished {
  if (!(error instanceof ApiError)) return { state: 'rejected', message: 'The upload failed.', scanIds: [], existingScanId: null };
  const result = isIntakeFileResult(error.body) ? error.body : null;
  if (error.status === 409 || error.code === 'duplicate_scan' || result?.outcome === 'duplicate') {
    const existingScanId = result?.existingScanId ?? error.details['existingScanId'] ?? error.details['scanId'] ?? null;
    return { state: 'duplicate', message: result?.reason ?? error.message, scanIds: result?.scans.map((s) => s.id) ?? [], existingScanId };
  }
  return { state: 'rejected', message: result?.reason ?? error.message, scanIds: [], existingScanId: null };
}

function isIntakeFileResult(body: unknown): body is IntakeFileResult {
  return typeof body === 'object' && body !== null && typeof (body as IntakeFileResult).outcome === 'string' && Array.isArray((body as IntakeFileResult).scans);
}

function finishedOfResult(result: IntakeFileResult): Finished {
  return {
    state: result.outcome,
    message: result.reason ?? null,
    scanIds: result.scans.map((scan) => scan.id),
    existingScanId: result.existingScanId ?? null,
  };
}

/** Groups queued files by lane key, keeping the order of first appearance. */
async function lanesOf<T extends { file: File }>(items: readonly T[]): Promise<T[][]> {
  const keys = await Promise.all(items.map((item) => fileLaneKey(item.file)));
  const lanes = new Map<string, T[]>();
  items.forEach((item, i) => {
    const lane = lanes.get(keys[i]);
    if (lane) lane.push(item);
    else lanes.set(keys[i], [item]);
  });
  return [...lanes.values()];
}

/**
 * The files of one intake run: sends them to a batch a few at a time, one request per file, and keeps each
 * file's progress and outcome in signals. Provided by the Intake page, so it ends with the page.
 */
@Injectable()
export class IntakeQueue {
  private readonly api = inject(IntakeApi);
  private subscription: Subscription | null = null;
  private nextKey = 0;

  readonly items = signal<readonly IntakeItem[]>([]);
  readonly isRunning = signal(false);
  readonly counts = computed<IntakeCounts & { waiting: number }>(() => {
    const counts = { stored: 0, duplicate: 0, rejected: 0, waiting: 0 };
    for (const item of this.items()) {
      if (item.state === 'stored' || item.state === 'duplicate' || item.state === 'rejected') counts[item.state]++;
      else if (item.state === 'waiting' || item.state === 'sending') counts.waiting++;
    }
    return counts;
  });
  /** Bytes sent over bytes queued, 0–100, across the whole run. */
  readonly overallPercent = computed(() => {
    const items = this.items();
    const total = items.reduce((sum, item) => sum + Math.max(item.sizeBytes, 1), 0);
    if (total === 0) return 0;
    const done = items.reduce((sum, item) => sum + (Math.max(item.sizeBytes, 1) * (item.state === 'waiting' ? 0 : item.state === 'sending' ? item.percent : 100)) / 100, 0);
    return Math.round((100 * done) / total);
  });

  constructor() {
    inject(DestroyRef).onDestroy(() => this.cancel());
  }

  /** Queues the files and sends them to the batch; resolves the returned Observable when every file has an outcome. */
  run(batchId: string, files: readonly File[], fields: IntakeFileFields = {}): Observable<void> {
    const added = files.map((file): IntakeItem & { file: File } => ({
      key: this.nextKey++,
      file,
      fileName: file.name,
      sizeBytes: file.size,
      state: 'waiting',
      percent: 0,
      message: null,
      scanIds: [],
      existingScanId: null,
    }));
    this.items.update((items) => [...items, ...added.map(({ file: _file, ...item }) => item)]);
    this.isRunning.set(true);
    return new Observable<void>((subscriber) => {
      this.subscription = from(lanesOf(added))
        .pipe(
          // Lanes run a few at a time; the files of one lane (identical candidates) one after another.
          switchMap((lanes) => from(lanes)),
          mergeMap((lane) => from(lane).pipe(concatMap((item) => this.send(batchId, item.key, item.file, fields))), INTAKE_CONCURRENCY),
        )
        .subscribe({
          complete: () => {
            this.isRunning.set(false);
            subscriber.next();
            subscriber.complete();
          },
        });
      return () => this.cancel();
    });
  }

  /** Stops the run: requests in flight are aborted (the server keeps nothing of them) and waiting files are not sent. */
  cancel(): void {
    if (!this.isRunning()) return;
    this.subscription?.unsubscribe();
    this.subscription = null;
    this.items.update((items) => items.map((item) => (item.state === 'waiting' || item.state === 'sending' ? { ...item, state: 'cancelled', percent: 0 } : item)));
    this.isRunning.set(false);
  }

  clear(): void {
    if (!this.isRunning()) this.items.set([]);
  }

  private send(batchId: string, key: number, file: File, fields: IntakeFileFields): Observable<unknown> {
    this.patch(key, { state: 'sending', percent: 0 });
    return new Observable<void>((subscriber) => {
      const request = this.api
        .sendFile(batchId, file, fields)
        .pipe(
          tap((event) => {
            if (event.type === HttpEventType.UploadProgress) {
              this.patch(key, { percent: event.total ? Math.round((100 * event.loaded) / event.total) : 0 });
            } else if (event.type === HttpEventType.Response && event.body) {
              this.patch(key, { ...finishedOfResult(event.body), percent: 100 });
            }
          }),
        )
        .subscribe({
          // A failed file is one outcome among many, never the end of the run.
          error: (error: unknown) => {
            this.patch(key, { ...finishedOfFailure(error), percent: 100 });
            subscriber.complete();
          },
          complete: () => subscriber.complete(),
        });
      return () => request.unsubscribe();
    });
  }

  private patch(key: number, change: Partial<IntakeItem>): void {
    this.items.update((items) => items.map((item) => (item.key === key ? { ...item, ...change } : item)));
  }
}
