import { computed, DestroyRef, inject, Injectable, signal } from '@angular/core';
import type { BenchWork } from '@shared/api/bench-work';
import { firstValueFrom } from 'rxjs';

import { ApiError } from '../core/http/api-error';
import { InkLinesApi } from './ink-lines-api';

/** What the Bench's save indicator says. */
export type SaveState = 'saved' | 'saving' | 'not_saved' | 'conflict';

/** Quiet time after the last change before it is saved, ms: a burst of clicks is one save. */
export const AUTOSAVE_DEBOUNCE_MS = 800;
/** Waits between retries of a failed save, ms; the last one repeats. */
const RETRY_DELAYS_MS = [2000, 5000, 15000];

/**
 * Keeps the volunteer's draft on the server: every change is saved after a short quiet time, at once when the
 * page is hidden or left, and again and again after a failure, with the work kept in the page meanwhile. A
 * version conflict (another tab or window) stops saving and says so; nothing is overwritten silently.
 */
@Injectable()
export class DraftSaver {
  private readonly api = inject(InkLinesApi);
  private scanId: string | null = null;
  private version: number | null = null;
  private pending: BenchWork | null = null;
  private inFlight: Promise<void> | null = null;
  private timer: ReturnType<typeof setTimeout> | null = null;
  private failures = 0;
  private isStopped = false;

  private readonly stateValue = signal<SaveState>('saved');
  private readonly savedAtValue = signal<string | null>(null);
  private readonly problemValue = signal<string | null>(null);
  readonly state = this.stateValue.asReadonly();
  /** When the server last stored the draft (ISO 8601). */
  readonly savedAt = this.savedAtValue.asReadonly();
  readonly problem = this.problemValue.asReadonly();
  readonly label = computed(() => ({ saved: 'Saved', saving: 'Saving…', not_saved: 'Not saved', conflict: 'Not saved' })[this.stateValue()]);

  constructor() {
    const onHidden = () => {
      if (document.visibilityState === 'hidden') this.flushOnLeave();
    };
    const onPageHide = () => this.flushOnLeave();
    document.addEventListener('visibilitychange', onHidden);
    window.addEventListener('pagehide', onPageHide);
    inject(DestroyRef).onDestroy(() => {
      // Leaving the Bench inside the app (Back to the Desk): the last change still goes to the server.
      this.flushOnLeave();
      document.removeEventListener('visibilitychange', onHidden);
      window.removeEventListener('pagehide', onPageHide);
      if (this.timer) clearTimeout(this.timer);
    });
  }

  /** Starts saving for a scan from the draft's version (null: no draft yet; the first change creates it). */
  start(scanId: string, version: number | null, savedAt: string | null): void {
    this.scanId = scanId;
    this.version = version;
    this.savedAtValue.set(savedAt);
    this.stateValue.set('saved');
    this.isStopped = false;
  }

  /** The draft version the server holds, for the hand-in. */
  currentVersion(): number | null {
    return this.version;
  }

  /** A change to the work: saved after the quiet time. */
  changed(work: BenchWork): void {
    if (this.scanId === null || this.isStopped) return;
    this.pending = work;
    this.stateValue.set('saving');
    this.schedule(AUTOSAVE_DEBOUNCE_MS);
  }

  /** Saves what is pending now and waits for it (before a hand-in); false when it could not be saved. */
  async flush(): Promise<boolean> {
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    if (this.inFlight) await this.inFlight;
    if (this.pending) await this.saveNow();
    return this.pending === null && this.stateValue() !== 'conflict' && this.stateValue() !== 'not_saved';
  }

  /** Stops saving (the draft was handed in). */
  stop(): void {
    this.isStopped = true;
    this.pending = null;
    if (this.timer) clearTimeout(this.timer);
  }

  private schedule(delayMs: number): void {
    if (this.timer) clearTimeout(this.timer);
    this.timer = setTimeout(() => {
      this.timer = null;
      void this.saveNow();
    }, delayMs);
  }

  private async saveNow(onLeave = false): Promise<void> {
    if (this.inFlight) {
      // One save at a time: the one running carries an older work; save the pending one after it.
      await this.inFlight;
      if (!this.pending) return;
    }
    const work = this.pending;
    if (!work || this.scanId === null || this.isStopped) return;
    this.pending = null;
    this.stateValue.set('saving');
    this.inFlight = (async () => {
      try {
        const scanId = this.scanId as string;
        const saved = onLeave
          ? await this.api.saveDraftOnLeave(scanId, this.version, work)
          : await firstValueFrom(this.api.saveDraft(scanId, this.version, work));
        this.version = saved.version;
        this.failures = 0;
        this.savedAtValue.set(saved.updatedAt);
        this.problemValue.set(null);
        this.stateValue.set(this.pending ? 'saving' : 'saved');
      } catch (error) {
        if (error instanceof ApiError && (error.code === 'draft_version_conflict' || error.code === 'already_handed_in')) {
          this.stateValue.set('conflict');
          this.problemValue.set(error.message);
          this.isStopped = true;
          return;
        }
        // Keep the work: it goes again after a wait (a newer change, if any, replaces it).
        this.pending = this.pending ?? work;
        this.stateValue.set('not_saved');
        this.problemValue.set('The draft could not be saved; retrying. Your work stays in this page.');
        this.schedule(RETRY_DELAYS_MS[Math.min(this.failures, RETRY_DELAYS_MS.length - 1)]);
        this.failures++;
      }
    })();
    await this.inFlight;
    this.inFlight = null;
  }

  /** The page is hidden or left: the pending work goes at once, by a request that outlives the page. */
  private flushOnLeave(): void {
    if (!this.pending || this.scanId === null || this.isStopped) return;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    void this.saveNow(true);
  }
}
