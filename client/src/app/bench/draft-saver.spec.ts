import { TestBed } from '@angular/core/testing';
import { type BenchWork, EMPTY_BENCH_WORK } from '@shared/api/bench-work';
import type { DraftSaved } from '@shared/api/ink-lines';
import { Subject } from 'rxjs';

import { ApiError } from '../core/http/api-error';
import { AUTOSAVE_DEBOUNCE_MS, DraftSaver } from './draft-saver';
import { InkLinesApi } from './ink-lines-api';

interface SaveCall {
  version: number | null;
  work: BenchWork;
  answer: Subject<DraftSaved>;
}

describe('DraftSaver', () => {
  let calls: SaveCall[];
  let leaveCalls: { version: number | null; work: BenchWork }[];
  let saver: DraftSaver;

  const work = (pinCount: number): BenchWork => ({
    ...EMPTY_BENCH_WORK,
    pins: Array.from({ length: pinCount }, (_, i) => ({ xPx: i, yPx: i, time: '2026-03-02T00:00:00.000Z', pressure: 1000 })),
  });
  const answer = (call: SaveCall, version: number) => {
    call.answer.next({ inkLineId: 'line-1', scanId: 'scan-1', version, updatedAt: '2026-12-02T10:00:00.000Z' });
    call.answer.complete();
  };

  beforeEach(() => {
    jest.useFakeTimers();
    calls = [];
    leaveCalls = [];
    const api: Partial<InkLinesApi> = {
      saveDraft: (_scanId, version, saved) => {
        const call = { version, work: saved, answer: new Subject<DraftSaved>() };
        calls.push(call);
        return call.answer;
      },
      saveDraftOnLeave: async (_scanId, version, saved) => {
        leaveCalls.push({ version, work: saved });
        return { inkLineId: 'line-1', scanId: 'scan-1', version: (version ?? 0) + 1, updatedAt: '2026-12-02T10:00:00.000Z' };
      },
    };
    TestBed.configureTestingModule({ providers: [DraftSaver, { provide: InkLinesApi, useValue: api }] });
    saver = TestBed.inject(DraftSaver);
    saver.start('scan-1', null, null);
  });

  afterEach(() => jest.useRealTimers());

  it('when changes come in a burst, then one save goes after the quiet time, with the last work, and the indicator ends saved', async () => {
    saver.changed(work(1));
    saver.changed(work(2));
    expect(saver.state()).toBe('saving');

    await jest.advanceTimersByTimeAsync(AUTOSAVE_DEBOUNCE_MS);
    answer(calls[0], 1);
    await jest.advanceTimersByTimeAsync(0);

    expect(calls).toHaveLength(1);
    expect(calls[0]).toMatchObject({ version: null, work: work(2) });
    expect(saver.state()).toBe('saved');
    expect(saver.currentVersion()).toBe(1);
  });

  it('when a save fails, then the indicator says not saved, the work is kept and sent again later', async () => {
    saver.changed(work(1));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DEBOUNCE_MS);
    calls[0].answer.error(new ApiError(0, 'internal_error', 'The server could not be reached.'));
    await jest.advanceTimersByTimeAsync(0);
    expect(saver.state()).toBe('not_saved');

    await jest.advanceTimersByTimeAsync(2000);
    answer(calls[1], 1);
    await jest.advanceTimersByTimeAsync(0);

    expect(calls[1]).toMatchObject({ version: null, work: work(1) });
    expect(saver.state()).toBe('saved');
  });

  it('when the server answers a version conflict, then saving stops and the message is shown', async () => {
    saver.changed(work(1));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DEBOUNCE_MS);
    calls[0].answer.error(new ApiError(409, 'draft_version_conflict', 'This draft was saved from another tab or window.'));
    await jest.advanceTimersByTimeAsync(0);

    saver.changed(work(2));
    await jest.advanceTimersByTimeAsync(AUTOSAVE_DEBOUNCE_MS * 2);

    expect(saver.state()).toBe('conflict');
    expect(saver.problem()).toMatch(/another tab/);
    expect(calls).toHaveLength(1);
  });

  it('when the page is hidden with a change pending, then it is sent at once by the request that outlives the page', async () => {
    saver.changed(work(3));

    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => 'hidden' });
    document.dispatchEvent(new Event('visibilitychange'));
    await jest.advanceTimersByTimeAsync(0);
    Object.defineProperty(document, 'visibilityState', { configurable: true, get: () => 'visible' });

    expect(leaveCalls).toEqual([{ version: null, work: work(3) }]);
    expect(calls).toHaveLength(0);
    expect(saver.currentVersion()).toBe(1);
  });

  it('when flushed before a hand-in, then the pending change is saved first and its version is the current one', async () => {
    saver.changed(work(1));

    const flushed = saver.flush();
    answer(calls[0], 1);

    expect(await flushed).toBe(true);
    expect(saver.currentVersion()).toBe(1);
  });
});
