import { computed, Injectable, signal } from '@angular/core';
import type { FollowInkResult } from '@shared/api/follow-ink';
import type { BenchStep, BenchWork, WorkCheckReading, WorkKnot, WorkTimeMark } from '@shared/api/bench-work';
import type { PinInput } from '@shared/api/ink-lines';
import { bridgeStretch, liftStretch, nearestKnotIndex } from '@shared/domain/knot-edits';

import { EMPTY_HISTORY, type EditHistory, recordChange, redoChange, undoChange } from './edit-history';

export type { BenchStep };

/** A point in full-resolution scan pixels (the master file's pixel grid). */
export interface ScanPoint {
  xPx: number;
  yPx: number;
}

/**
 * A knot on the Bench. Knots found by Follow ink carry the finder's confidence (0–1) and whether the pen
 * line has a gap after them; knots placed or moved by hand have neither (they are the volunteer's word).
 */
export type BenchKnot = WorkKnot;

/** How many earlier knot lists Undo can go back through. */
const UNDO_DEPTH = 50;

/**
 * What a click does in the Ink step: add a knot, or pick the two ends of a stretch to lift (no ink: a pen gap)
 * or to bridge (a short skip joined on purpose).
 */
export type InkTool = 'knot' | 'lift' | 'bridge';

/**
 * The Bench's working state for one scan: the step, the pins, the knots and the crossing picked for the
 * next pin. Every point is kept in FULL-resolution scan pixels; clicks arrive in preview-image pixels and
 * are scaled up here, because the server registers pins against the master scan.
 */
@Injectable()
export class BenchState {
  private readonly stepValue = signal<BenchStep>('pin');
  private readonly pinList = signal<readonly PinInput[]>([]);
  private readonly knotList = signal<readonly BenchKnot[]>([]);
  // Earlier knot lists for Undo and undone ones for Redo: every change to the knots records the list it replaced.
  private readonly knotHistory = signal<EditHistory<readonly BenchKnot[]>>(EMPTY_HISTORY);
  private readonly inkToolValue = signal<InkTool>('knot');
  private readonly stretchStartValue = signal<number | null>(null);
  private readonly pendingCrossing = signal<ScanPoint | null>(null);
  private readonly timeMarkList = signal<readonly WorkTimeMark[]>([]);
  private readonly chartOnValue = signal<string | null>(null);
  private readonly chartOffValue = signal<string | null>(null);
  private readonly checkReadingList = signal<readonly WorkCheckReading[]>([]);
  private readonly scanPxPerPreviewPxValue = signal<number | null>(null);
  private readonly isSnapOnValue = signal(true);
  private readonly pendingSnapValue = signal<number | null>(null);

  readonly step = this.stepValue.asReadonly();
  readonly pins = this.pinList.asReadonly();
  readonly knots = this.knotList.asReadonly();
  /** The grid crossing picked in the Pin step, waiting for its time and pressure. */
  readonly pendingPin = this.pendingCrossing.asReadonly();
  /** Pin step: a click near a printed crossing moves to the crossing found in the image (the volunteer may turn it off). */
  readonly isSnapOn = this.isSnapOnValue.asReadonly();
  /** How far the picked crossing was moved from the click to the printed crossing, scan px; null: not snapped. */
  readonly pendingSnapPx = this.pendingSnapValue.asReadonly();
  /** Full-resolution scan pixels per preview pixel; null until the preview has loaded. */
  readonly scanPxPerPreviewPx = this.scanPxPerPreviewPxValue.asReadonly();
  readonly knotCount = computed(() => this.knotList().length);
  readonly canUndo = computed(() => this.knotHistory().past.length > 0);
  readonly canRedo = computed(() => this.knotHistory().future.length > 0);
  readonly inkTool = this.inkToolValue.asReadonly();
  /** Lift or Bridge: the knot picked as the stretch's first end, waiting for the second; null when none. */
  readonly stretchStart = this.stretchStartValue.asReadonly();
  readonly timeMarks = this.timeMarkList.asReadonly();
  readonly chartOn = this.chartOnValue.asReadonly();
  readonly chartOff = this.chartOffValue.asReadonly();
  readonly checkReadings = this.checkReadingList.asReadonly();
  /** Everything done on the chart, as autosaved and handed in. */
  readonly work = computed<BenchWork>(() => ({
    step: this.stepValue(),
    pins: [...this.pinList()],
    knots: [...this.knotList()],
    timeMarks: [...this.timeMarkList()],
    chartOn: this.chartOnValue(),
    chartOff: this.chartOffValue(),
    checkReadings: [...this.checkReadingList()],
  }));

  /** Puts saved work back on the Bench exactly as it was left (Undo starts afresh). */
  loadWork(work: BenchWork): void {
    this.stepValue.set(work.step);
    this.pinList.set(work.pins);
    this.knotList.set(work.knots);
    this.knotHistory.set(EMPTY_HISTORY);
    this.stretchStartValue.set(null);
    this.timeMarkList.set(work.timeMarks);
    this.chartOnValue.set(work.chartOn);
    this.chartOffValue.set(work.chartOff);
    this.checkReadingList.set(work.checkReadings);
    this.pendingCrossing.set(null);
  }

  /** A click in the Marks step: a time mark's foot on the line (scan px), its true time still to give. */
  addTimeMark(point: ScanPoint): void {
    this.timeMarkList.update((marks) => [...marks, { xPx: point.xPx, yPx: point.yPx, time: null }].sort((a, b) => a.xPx - b.xPx));
  }

  setTimeMarkTime(index: number, time: string | null): void {
    this.timeMarkList.update((marks) => marks.map((mark, i) => (i === index ? { ...mark, time } : mark)));
  }

  deleteTimeMark(index: number): void {
    this.timeMarkList.update((marks) => marks.filter((_, i) => i !== index));
  }

  /** Chart on / chart off as written on the chart, as UTC instants (null: not given). */
  setChartOnOff(chartOn: string | null, chartOff: string | null): void {
    this.chartOnValue.set(chartOn);
    this.chartOffValue.set(chartOff);
  }

  addCheckReading(reading: WorkCheckReading): void {
    this.checkReadingList.update((readings) => [...readings, reading].sort((a, b) => Date.parse(a.time) - Date.parse(b.time)));
  }

  deleteCheckReading(index: number): void {
    this.checkReadingList.update((readings) => readings.filter((_, i) => i !== index));
  }

  chooseStep(step: BenchStep): void {
    this.stepValue.set(step);
    this.pendingCrossing.set(null);
    this.stretchStartValue.set(null);
  }

  /** Picks what a click does in the Ink step; a stretch half picked is dropped. */
  chooseInkTool(tool: InkTool): void {
    this.inkToolValue.set(tool);
    this.stretchStartValue.set(null);
  }

  /** Drops a half-entered pin or a half-picked stretch (Escape). */
  cancelPick(): void {
    this.pendingCrossing.set(null);
    this.stretchStartValue.set(null);
  }

  /** Records the preview's size against the scan's: scale = scan width / preview natural width. */
  setPreviewWidth(scanWidthPx: number, previewNaturalWidthPx: number): void {
    if (!(scanWidthPx > 0) || !(previewNaturalWidthPx > 0)) throw new Error('scan and preview widths must be positive');
    this.scanPxPerPreviewPxValue.set(scanWidthPx / previewNaturalWidthPx);
  }

  /** Converts a point on the preview image to full-resolution scan pixels. */
  toScanPoint(previewPoint: { x: number; y: number }): ScanPoint {
    const scale = this.scanPxPerPreviewPxValue();
    if (scale === null) throw new Error('the preview size is not known yet');
    return { xPx: previewPoint.x * scale, yPx: previewPoint.y * scale };
  }

  turnSnap(isOn: boolean): void {
    this.isSnapOnValue.set(isOn);
  }

  /**
   * A click on the preview: picks the next pin's crossing (Pin), adds a knot (Ink) or a time mark (Marks).
   * `snappedFromPx` says the Pin step's point is a printed crossing found this far from the click (preview px).
   */
  pickPoint(previewPoint: { x: number; y: number }, snappedFromPx: number | null = null): void {
    const point = this.toScanPoint(previewPoint);
    const scale = this.scanPxPerPreviewPxValue() ?? 1;
    this.pendingSnapValue.set(this.stepValue() === 'pin' && snappedFromPx !== null ? snappedFromPx * scale : null);
    if (this.stepValue() === 'pin') this.pendingCrossing.set(point);
    else if (this.stepValue() === 'ink' && this.inkToolValue() === 'knot') this.addKnot(point);
    else if (this.stepValue() === 'ink') this.pickStretchEnd(point);
    else if (this.stepValue() === 'marks') this.addTimeMark(point);
  }

  /**
   * Adds a hand-placed knot (scan px) in its place along time: before the first knot to its right, so a click
   * between two followed knots joins the line there. A knot put into a gap bridges it.
   */
  addKnot(point: ScanPoint): void {
    this.changeKnots((knots) => {
      const knot: BenchKnot = { xPx: point.xPx, yPx: point.yPx };
      const at = knots.findIndex((other) => other.xPx > point.xPx);
      if (at < 0) return [...knots, knot];
      const next = [...knots];
      if (at > 0) next[at - 1] = { ...next[at - 1], gapAfter: false };
      next.splice(at, 0, knot);
      return next;
    });
  }

  /**
   * Lift or Bridge: the first click picks the knot nearest it as one end of the stretch, the second the other
   * end, and the stretch is then lifted or bridged (one Undo step). A second click on the same knot drops it.
   */
  pickStretchEnd(point: ScanPoint): void {
    const index = nearestKnotIndex(this.knotList(), point);
    if (index === null) return;
    const start = this.stretchStartValue();
    if (start === null) {
      this.stretchStartValue.set(index);
      return;
    }
    this.stretchStartValue.set(null);
    const tool = this.inkToolValue();
    if (tool === 'lift') this.changeKnots((knots) => liftStretch(knots, start, index));
    else if (tool === 'bridge') this.changeKnots((knots) => bridgeStretch(knots, start, index));
  }

  /** Replaces all knots with the line Follow ink found (one Undo brings the earlier knots back). */
  replaceWithFollowed(result: FollowInkResult): void {
    const gapAfter = new Set(result.spans.filter((span) => span.kind === 'gap' && span.toIndex === span.fromIndex + 1).map((span) => span.fromIndex));
    this.changeKnots(() =>
      result.knots.map((knot, index) => ({ xPx: knot.xPx, yPx: knot.yPx, confidence: knot.confidence, gapAfter: gapAfter.has(index) })),
    );
  }

  /** Drags knot `index` to a point on the preview; a moved knot is a hand-placed one (no confidence of the finder). */
  moveKnot(index: number, previewPoint: { x: number; y: number }): void {
    const point = this.toScanPoint(previewPoint);
    this.changeKnots((knots) => knots.map((knot, i) => (i === index ? { xPx: point.xPx, yPx: point.yPx, gapAfter: knot.gapAfter } : knot)));
  }

  /** Deletes knot `index`; a gap after it passes to the knot before, so deleting a knot never bridges a gap. */
  deleteKnot(index: number): void {
    this.changeKnots((knots) => {
      const deleted = knots[index];
      if (!deleted) return knots;
      return knots.flatMap((knot, i) => {
        if (i === index) return [];
        if (i === index - 1 && deleted.gapAfter) return [{ ...knot, gapAfter: true }];
        return [knot];
      });
    });
  }

  /** Undoes the last change to the knots (a click, a drag, a delete, a lift, a bridge or a Follow ink). */
  undo(): void {
    const step = undoChange(this.knotHistory(), this.knotList());
    if (step === null) return;
    this.knotList.set(step.state);
    this.knotHistory.set(step.history);
    this.stretchStartValue.set(null);
  }

  /** Does again the last change Undo took back; a new change after an Undo ends Redo. */
  redo(): void {
    const step = redoChange(this.knotHistory(), this.knotList());
    if (step === null) return;
    this.knotList.set(step.state);
    this.knotHistory.set(step.history);
    this.stretchStartValue.set(null);
  }

  private changeKnots(change: (knots: readonly BenchKnot[]) => readonly BenchKnot[]): void {
    const before = this.knotList();
    const after = change(before);
    if (after === before) return;
    this.knotHistory.update((history) => recordChange(history, before, UNDO_DEPTH));
    this.knotList.set(after);
  }

  /** Turns the picked crossing into a pin with its printed time (ISO 8601 UTC) and pressure (chart form's unit). */
  savePin(time: string, pressure: number): void {
    const crossing = this.pendingCrossing();
    if (crossing === null) throw new Error('pick a grid crossing first');
    this.pinList.update((pins) => [...pins, { ...crossing, time, pressure }]);
    this.pendingCrossing.set(null);
  }

  cancelPin(): void {
    this.pendingCrossing.set(null);
  }

  deletePin(index: number): void {
    this.pinList.update((pins) => pins.filter((_, i) => i !== index));
  }
}
