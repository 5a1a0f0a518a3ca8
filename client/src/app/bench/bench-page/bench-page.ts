import { DatePipe, KeyValuePipe } from '@angular/common';
import { ChangeDetectionStrategy, Component, computed, DestroyRef, effect, inject, input, signal, untracked, viewChild } from '@angular/core';
import { takeUntilDestroyed, toObservable, toSignal } from '@angular/core/rxjs-interop';
import { MatButtonModule } from '@angular/material/button';
import { MatIconModule } from '@angular/material/icon';
import { MatProgressBarModule } from '@angular/material/progress-bar';
import { RouterLink } from '@angular/router';
import { type InkLineSaved, type MyInkLine, parseInkLineDraft } from '@shared/api/ink-lines';
import type { ChartFormSummary } from '@shared/api/chart-forms';
import type { ScanDetail } from '@shared/api/scans';
import { snapToCrossing } from '@shared/domain/crossing-snap';
import { checkPins, type PinsCheck } from '@shared/domain/pin-check';
import { catchError, map, of, switchMap } from 'rxjs';

import { ChartFormsApi } from '../../core/api/chart-forms-api';
import { ScansApi } from '../../core/api/scans-api';
import { StationsApi } from '../../core/api/stations-api';
import { ApiError } from '../../core/http/api-error';
import { ObjectUrlHolder } from '../../shared/object-url/object-url';
import { actionForKey, type BenchAction, isTypingTarget } from '../bench-shortcuts';
import { BenchState, type BenchStep } from '../bench-state';
import { DraftSaver } from '../draft-saver';
import { HandInResult } from '../hand-in-result/hand-in-result';
import { InkLinesApi } from '../ink-lines-api';
import { InkStep } from '../ink-step/ink-step';
import { MarksStep } from '../marks-step/marks-step';
import { PreviewPixels } from '../preview-pixels';
import { type PinScan, PinStep } from '../pin-step/pin-step';
import type { StationClock } from '../pin-step/pin-time-lines';
import { ProofStep } from '../proof-step/proof-step';
import { toRegistrationPins } from '../registration-pins';
import { ScanStage } from '../scan-stage/scan-stage';
import { ShortcutHelp } from '../shortcut-help/shortcut-help';
import type { Size } from '../scan-stage/view-transform';

/** Longest side of the image the Bench shows, px: sharp enough to click on, light enough to pan. */
const BENCH_IMAGE_SIDE_PX = 2400;
/** How far from a click (preview px) the Pin step looks for the printed crossing to snap to: a few grid lines' width. */
const SNAP_RADIUS_PREVIEW_PX = 6;
const UTC_CLOCK: StationClock = { timeZone: 'UTC', timeStandard: 'utc' };

interface HandInProblem {
  message: string;
  details: Record<string, string>;
}

/**
 * The tracing editor for one scan: the scan stage, the Pin, Ink, Marks and Proof steps, and Hand in. The work
 * is the volunteer's draft on the server: it resumes as left and every change autosaves. A chart the volunteer
 * has handed in opens read-only with its result.
 */
@Component({
  selector: 'isl-bench-page',
  imports: [DatePipe, KeyValuePipe, RouterLink, MatButtonModule, MatIconModule, MatProgressBarModule, ScanStage, PinStep, InkStep, MarksStep, ProofStep, HandInResult, ShortcutHelp],
  providers: [BenchState, DraftSaver],
  templateUrl: './bench-page.html',
  styleUrl: './bench-page.scss',
  changeDetection: ChangeDetectionStrategy.OnPush,
  host: { '(document:keydown)': 'runShortcut($event)' },
})
export class BenchPage {
  private readonly scansApi = inject(ScansApi);
  private readonly inkLinesApi = inject(InkLinesApi);
  private readonly chartFormsApi = inject(ChartFormsApi);
  private readonly stationsApi = inject(StationsApi);
  private readonly destroyRef = inject(DestroyRef);
  private readonly previewUrls = new ObjectUrlHolder(this.destroyRef);
  private readonly previewPixels = new PreviewPixels();
  protected readonly state = inject(BenchState);
  protected readonly saver = inject(DraftSaver);

  /** From the route parameter. */
  readonly scanId = input.required<string>();

  private readonly stage = viewChild(ScanStage);
  private readonly inkStep = viewChild(InkStep);
  /** The keyboard shortcuts' help panel, opened with `?`. */
  protected readonly isHelpOpen = signal(false);

  private readonly scanResult = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        this.scansApi.get(scanId).pipe(
          map((scan): { scan: ScanDetail | null; failure: string | null } => ({ scan, failure: null })),
          catchError((error: unknown) => of({ scan: null, failure: error instanceof ApiError ? error.message : 'The scan could not be loaded.' })),
        ),
      ),
    ),
  );
  protected readonly scan = computed(() => this.scanResult()?.scan ?? null);
  protected readonly scanFailure = computed(() => this.scanResult()?.failure ?? null);
  protected readonly previewUrl = toSignal(
    toObservable(this.scanId).pipe(
      switchMap((scanId) =>
        // The Bench reads its image through IIIF like every viewer; the plain preview stands in while the worker has not made the tiles yet.
        this.scansApi.iiifImage(scanId, BENCH_IMAGE_SIDE_PX).pipe(
          catchError(() => this.scansApi.preview(scanId)),
          map((blob) => this.previewUrls.replace(blob)),
          catchError(() => of(null)),
        ),
      ),
    ),
  );
  /** The scan's own chart form, fetched by id once the scan is known; a scan without one has none. */
  private readonly chartFormResult = toSignal(
    toObservable(computed(() => this.scan()?.chartFormId ?? null)).pipe(
      switchMap((chartFormId) =>
        chartFormId === null
          ? of({ form: null, failure: null })
          : this.chartFormsApi.get(chartFormId).pipe(
              map((form): { form: ChartFormSummary | null; failure: string | null } => ({ form, failure: null })),
              catchError((error: unknown) => of({ form: null, failure: error instanceof ApiError ? error.message : 'The chart form could not be loaded.' })),
            ),
      ),
    ),
  );
  protected readonly chartForm = computed(() => this.chartFormResult()?.form ?? null);
  /** The station's clock, for showing times as its observers wrote them; UTC until (or unless) the station is known. */
  protected readonly stationClock = toSignal(
    toObservable(computed(() => this.scan()?.stationId ?? null)).pipe(
      switchMap((stationId) =>
        stationId === null
          ? of(UTC_CLOCK)
          : this.stationsApi.get(stationId).pipe(
              map((station): StationClock => ({ timeZone: station.timeZone, timeStandard: station.timeStandard })),
              // The clock only labels the time lines; without the station they are labelled in UTC.
              catchError(() => of(UTC_CLOCK)),
            ),
      ),
    ),
    { initialValue: UTC_CLOCK },
  );
  /** The pins checked against the grid fitted to them, live: residuals, outliers and the ghost grid. */
  protected readonly pinsCheck = computed((): PinsCheck => {
    const form = this.chartForm();
    const chartStart = this.scan()?.chartStart;
    if (!form || !chartStart) return { kind: 'too_few' };
    return checkPins(form, toRegistrationPins(this.state.pins(), Date.parse(chartStart)));
  });
  protected readonly ghostGrid = computed(() => {
    const check = this.pinsCheck();
    return check.kind === 'fitted' && this.state.step() === 'pin' ? check.grid : null;
  });
  protected readonly outlierPins = computed(() => {
    const check = this.pinsCheck();
    return check.kind === 'fitted' ? check.pins.flatMap((pin, index) => (pin.isOutlier ? [index] : [])) : [];
  });
  protected readonly pinScan = computed((): PinScan | null => {
    const scan = this.scan();
    return scan ? { widthPx: scan.widthPx, heightPx: scan.heightPx, dpi: scan.dpi, chartStart: scan.chartStart } : null;
  });
  protected readonly chartFormFailure = computed(() => this.chartFormResult()?.failure ?? null);

  /** The volunteer's own line as the server had it when the Bench opened; undefined while loading. */
  protected readonly mine = signal<MyInkLine | null | undefined>(undefined);
  protected readonly loadFailure = signal<string | null>(null);
  /** Handed in (by this page or before): the Bench shows the work and its result, and takes no changes. */
  protected readonly isReadOnly = computed(() => {
    const mine = this.mine();
    return this.saved() !== null || (mine !== null && mine !== undefined && mine.status !== 'draft');
  });
  protected readonly steps: readonly { step: BenchStep; label: string; icon: string }[] = [
    { step: 'pin', label: 'Pin', icon: 'push_pin' },
    { step: 'ink', label: 'Ink', icon: 'gesture' },
    { step: 'marks', label: 'Marks', icon: 'schedule' },
    { step: 'proof', label: 'Proof', icon: 'fact_check' },
  ];

  constructor() {
    toObservable(this.scanId)
      .pipe(
        switchMap((scanId) => this.inkLinesApi.mine(scanId).pipe(map((answer) => ({ scanId, inkLine: answer.inkLine })))),
        takeUntilDestroyed(this.destroyRef),
      )
      .subscribe({
        next: ({ scanId, inkLine }) => {
          if (inkLine) this.state.loadWork(inkLine.work);
          if (inkLine?.result && inkLine.status !== 'draft') this.saved.set(inkLine.result);
          // Only the volunteer's own draft is saved over; a handed-in line is read-only.
          if (!inkLine || inkLine.status === 'draft') this.saver.start(scanId, inkLine?.version ?? null, inkLine?.updatedAt ?? null);
          this.mine.set(inkLine);
        },
        error: (error: unknown) => this.loadFailure.set(error instanceof ApiError ? error.message : 'Your draft could not be loaded.'),
      });
    // The image's pixels, for snapping a pin's click to the printed crossing; without them a click is taken as it is.
    effect(() => {
      const url = this.previewUrl();
      if (url) this.previewPixels.load(url).catch(() => undefined);
    });
    // Autosave: every change to the work after the draft was loaded.
    let isFirstRun = true;
    effect(() => {
      const work = this.state.work();
      const mine = this.mine();
      if (mine === undefined || untracked(() => this.isReadOnly())) return;
      if (isFirstRun) {
        // The work just loaded (or the empty Bench): nothing to save yet.
        isFirstRun = false;
        return;
      }
      untracked(() => this.saver.changed(work));
    });
  }

  protected readonly isHandingIn = signal(false);
  protected readonly saved = signal<InkLineSaved | null>(null);
  protected readonly problem = signal<HandInProblem | null>(null);

  /** A key press anywhere on the page: the Bench's shortcut for it, unless the key is typed into a field. */
  protected runShortcut(event: KeyboardEvent): void {
    const action = actionForKey(event);
    if (action === null || event.defaultPrevented) return;
    if (isTypingTarget(event.target) && action !== 'cancel') return;
    if (this.runAction(action)) event.preventDefault();
  }

  /** Does what a shortcut asks; false when it does not apply here (read-only, wrong step), so the key passes on. */
  private runAction(action: BenchAction): boolean {
    const steps: Partial<Record<BenchAction, BenchStep>> = { 'step-pin': 'pin', 'step-ink': 'ink', 'step-marks': 'marks', 'step-proof': 'proof' };
    const step = steps[action];
    if (action === 'help') this.isHelpOpen.update((isOpen) => !isOpen);
    else if (action === 'zoom-in') this.stage()?.zoomIn();
    else if (action === 'zoom-out') this.stage()?.zoomOut();
    else if (action === 'zoom-fit') this.stage()?.fitToHost();
    else if (action === 'cancel') {
      if (!this.isHelpOpen() && this.state.pendingPin() === null && this.state.stretchStart() === null) return false;
      this.isHelpOpen.set(false);
      this.state.cancelPick();
    } else if (this.isReadOnly()) return false;
    else if (step) this.state.chooseStep(step);
    else if (action === 'undo') this.state.undo();
    else if (action === 'redo') this.state.redo();
    else if (this.state.step() !== 'ink') return false;
    else if (action === 'follow-ink') this.inkStep()?.followInk();
    else if (action === 'tool-knot') this.state.chooseInkTool('knot');
    else if (action === 'tool-lift') this.state.chooseInkTool('lift');
    else if (action === 'tool-bridge') this.state.chooseInkTool('bridge');
    return true;
  }

  protected chooseStep(step: BenchStep): void {
    this.state.chooseStep(step);
  }

  protected notePreviewSize(size: Size): void {
    const scan = this.scan();
    if (scan) this.state.setPreviewWidth(scan.widthPx, size.width);
  }

  protected pickPoint(point: { x: number; y: number }): void {
    if (this.state.scanPxPerPreviewPx() === null || this.isReadOnly()) return;
    const image = this.previewPixels.image;
    const snapped = this.state.step() === 'pin' && this.state.isSnapOn() && image ? snapToCrossing(image, point, { radiusPx: SNAP_RADIUS_PREVIEW_PX }) : null;
    this.state.pickPoint(snapped ?? point, snapped?.distancePx ?? null);
  }

  protected moveKnot(move: { index: number; point: { x: number; y: number } }): void {
    if (this.state.scanPxPerPreviewPx() !== null && !this.isReadOnly()) this.state.moveKnot(move.index, move.point);
  }

  protected deleteKnot(index: number): void {
    if (!this.isReadOnly()) this.state.deleteKnot(index);
  }

  protected async handIn(): Promise<void> {
    const work = this.state.work();
    const parsed = parseInkLineDraft(work);
    this.saved.set(null);
    if (!parsed.ok) {
      this.problem.set({ message: 'Not ready to hand in yet:', details: parsed.details });
      return;
    }
    this.problem.set(null);
    this.isHandingIn.set(true);
    // The draft on the server must be the one handed in: the last change is saved first, then its version sent.
    await this.saver.flush();
    const draftVersion = this.saver.currentVersion();
    this.inkLinesApi
      .handIn(this.scanId(), { ...work, ...(draftVersion === null ? {} : { draftVersion }) })
      .pipe(takeUntilDestroyed(this.destroyRef))
      .subscribe({
        next: (saved) => {
          this.isHandingIn.set(false);
          this.saver.stop();
          this.saved.set(saved);
        },
        error: (error: unknown) => {
          this.isHandingIn.set(false);
          this.problem.set(
            error instanceof ApiError ? { message: error.message, details: error.details } : { message: 'The hand-in failed.', details: {} },
          );
        },
      });
  }
}
